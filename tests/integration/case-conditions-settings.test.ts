/**
 * A case stores the whole condition language (patterns with loops and multiple edges, "branch-vertices"); a coverage
 * claim that takes its sub-cases from the case's children reads each child's condition again in its own setting.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params, closeAfterAll } from "./helpers";
import { addCase, draftCaseStep, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import { getCaseTree } from "@/lib/data/cases";
import { flattenCaseTree } from "@/lib/proof-tree";
import * as caseRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/route";
import * as claimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import { makeGraph } from "@/lib/core/graph";
import { canonicalKeyOf } from "@/lib/core/families/canonical-label";
import { readGraphText } from "@/lib/core/families/enumeration";

// Connected graphs with at most one loop per vertex and no multiple edge on n = 1..4 vertices: OEIS A054921
// (2, 3, 10, 50; the same terms as lib/core/families/multigraph-coverage.test.ts, which recomputes them by brute force).
const A054921 = [2, 3, 10, 50];
// Connected simple graphs on n = 1..4 vertices: OEIS A001349 (1, 1, 2, 6).
const A001349 = [1, 1, 2, 6];
const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);

let proofId: string;
let parentId: number;
let stepId: string;

closeAfterAll(() => dropProofs([proofId]), { pool: true });
beforeAll(async () => {
  ({ proofId, caseId: parentId, stepId } = await draftCaseStep("Case conditions in two settings", "Connected graphs with loops", "Split by loops."));
});

const setPredicate = (caseId: number, predicate: unknown) =>
  caseRoute.PATCH(
    jsonRequest("/x", "PATCH", { predicate: typeof predicate === "string" ? predicate : JSON.stringify(predicate) }),
    params({ proofId, caseId: String(caseId) }),
  );
const stored = async (caseId: number) => (await models().Case.findByPk(caseId))!.predicate;
const numberOf = async (caseId: number) => flattenCaseTree(await getCaseTree(Number(proofId))).find((c) => c.id === caseId)!.number;
const claimCount = () => models().Claim.count({ where: { stepId: Number(stepId) } });
const attach = (claim: Record<string, unknown>, wait = true) =>
  claimsRoute.POST(
    jsonRequest(wait ? "/x?wait=60" : "/x", "POST", { claims: [{ format: "cairn-claim/1", kind: "coverage", ...claim }] }),
    params({ proofId, stepId }),
  );
const loopsAtMostOne = { setting: "multigraph", maxMultiplicity: 1, maxLoop: 1, maxVertices: 4 };

// A vertex with a loop (edges text "0 0"), and a looped vertex with a neighbour ("0 1" and the loop "1 1").
const aLoop = { predicate: "contains", graph: { format: "edges", text: "0 0" } };
const aLoopWithNeighbour = { predicate: "contains", graph: { format: "edges", text: "0 1\n1 1" } };
const noLoop = { predicate: "loops", relation: "=", value: 0 };

let noLoopCase: number;
let loopCase: number;

describe("a case's condition with loops and multiple edges (PATCH …/cases/[caseId])", () => {
  beforeAll(async () => {
    noLoopCase = await addCase(proofId, "No loop", parentId);
    loopCase = await addCase(proofId, "A loop somewhere", parentId);
  });

  it("stores a looped pattern (in sparse6) and a multiple edge, and shows them in words on the case", async () => {
    await actAs("author");
    expect((await setPredicate(noLoopCase, noLoop)).status).toBe(200);
    expect((await setPredicate(loopCase, aLoop)).status).toBe(200);
    const json = JSON.parse((await stored(loopCase))!);
    expect(json.graph.format).toBe("sparse6");
    // The stored pattern is one vertex with one loop, up to isomorphism.
    expect(canonicalKeyOf(readGraphText(json.graph.text))).toBe(canonicalKeyOf(makeGraph(1, [{ u: 0, v: 0, m: 1 }])));
    const view = flattenCaseTree(await getCaseTree(Number(proofId))).find((c) => c.id === loopCase)!;
    // Read in words (condition-words.ts describePattern), not as its sparse6 text.
    expect(view.predicate?.words).toBe("G contains K1 with a loop as a subgraph");
    // "branch-vertices" is stored too: only a claim's setting may refuse it.
    const spare = await addCase(proofId, "Spare", parentId);
    expect((await setPredicate(spare, { predicate: "contains", graph: { format: "edges", text: "0 1 2" } })).status).toBe(200);
    expect((await setPredicate(spare, { predicate: "branch-vertices", relation: ">=", value: 1 })).status).toBe(200);
    expect(JSON.parse((await stored(spare))!)).toEqual({ predicate: "branch-vertices", relation: ">=", value: 1 });
    expect((await caseRoute.DELETE(jsonRequest("/x", "DELETE", { confirm: true }), params({ proofId, caseId: String(spare) }))).status).toBe(200);
  });

  it("answers 401, 403, and 422 with the JSON path of a malformed pattern, writing nothing", async () => {
    await actAs(null);
    expect((await setPredicate(loopCase, aLoopWithNeighbour)).status).toBe(401);
    await actAs("reviewer");
    expect((await setPredicate(loopCase, aLoopWithNeighbour)).status).toBe(403);
    await actAs("author");
    const before = await stored(loopCase);
    const res = await setPredicate(loopCase, { not: { predicate: "contains", graph: { format: "edges", text: "0 1 -2" } } });
    expect(res.status).toBe(422);
    const { error } = await res.json();
    expect(error.issues[0].path).toBe("predicate");
    expect(error.issues[0].message).toMatch(/^\$\.not\.graph\.text: /);
    expect(await stored(loopCase)).toBe(before);
  });
});

describe("a coverage claim on the case's children, in the multigraph setting", () => {
  it("verifies a complete split of the connected graphs with loops ≤ 1 on ≤ 4 vertices, counting them as OEIS A054921", async () => {
    await actAs("author");
    const res = await attach(loopsAtMostOne);
    expect(res.status).toBe(200);
    const [c] = (await res.json()).claims as Array<{ id: number; status: string }>;
    expect(c.status).toBe("verified");
    const row = (await models().Claim.findByPk(c.id))!;
    const input = JSON.parse(row.input);
    expect(input.cases.map((x: { label: string }) => x.label)).toEqual(["No loop", "A loop somewhere"]);
    const certificate = JSON.parse(row.certificate!).evidence;
    expect(certificate.orders).toEqual(A054921);
    // The loopless ones are the connected simple graphs (OEIS A001349); every other one has a loop.
    expect(certificate.covered).toEqual([sum(A001349), sum(A054921) - sum(A001349)]);
    expect(row.reason).toMatch(new RegExp(`^All ${sum(A054921)} graphs`));
  });

  it("refutes a leaky split, naming the uncovered graph (one vertex with a loop) in sparse6", async () => {
    await actAs("author");
    expect((await setPredicate(loopCase, aLoopWithNeighbour)).status).toBe(200);
    const res = await attach(loopsAtMostOne);
    expect(res.status).toBe(200);
    const [c] = (await res.json()).claims as Array<{ id: number; status: string }>;
    expect(c.status).toBe("refuted");
    const row = (await models().Claim.findByPk(c.id))!;
    // Every connected graph on ≥ 2 vertices with a loop has the looped vertex's neighbour: only K1 with a loop escapes.
    expect(row.reason).toMatch(new RegExp(`^1 of the ${sum(A054921)} graphs satisfy no sub-case's condition`));
    const named = /condition: (\S+) \(sparse6\)/.exec(row.reason!)![1];
    expect(canonicalKeyOf(readGraphText(named))).toBe(canonicalKeyOf(makeGraph(1, [{ u: 0, v: 0, m: 1 }])));
  });

  it("answers 422 naming the case and the part of its condition that does not fit the setting, storing nothing", async () => {
    await actAs("author");
    const third = await addCase(proofId, "A branch vertex", parentId);
    expect(
      (
        await setPredicate(third, {
          or: [
            { predicate: "max-degree", relation: ">=", value: 5 },
            { predicate: "branch-vertices", relation: "=", value: 1 },
          ],
        })
      ).status,
    ).toBe(200);
    const before = await claimCount();
    const res = await attach(loopsAtMostOne, false);
    expect(res.status).toBe(422);
    const { error } = await res.json();
    expect(error.issues).toEqual([
      {
        path: "claims.0.cases[2].condition.or[1].predicate",
        message: expect.stringMatching(
          new RegExp(`^Case ${(await numberOf(third)).replace(".", "\\.")} “A branch vertex”: "branch-vertices" has no agreed meaning`),
        ),
      },
    ]);
    // The same children under a claim on simple graphs: now the looped pattern is what does not fit.
    const simple = await attach({ maxVertices: 4 }, false);
    expect(simple.status).toBe(422);
    const issues = (await simple.json()).error.issues as Array<{ path: string; message: string }>;
    expect(issues.map((i) => i.path)).toEqual(["claims.0.cases[1].condition.graph.text"]);
    expect(issues[0].message).toMatch(
      new RegExp(`^Case ${(await numberOf(loopCase)).replace(".", "\\.")} “A loop somewhere”: the pattern must be a simple graph`),
    );
    expect(await claimCount()).toBe(before);
  });
});

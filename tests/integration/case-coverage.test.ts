/** A case's machine-readable condition (PATCH .../cases/[caseId]) and the coverage claim through the API. */
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
import { LEAKY_MULTIGRAPH_SPLIT } from "../support/multigraph-brute-force";

let proofId: string;
let caseId: number;
let stepId: string;

closeAfterAll(() => dropProofs([proofId]), { pool: true });
beforeAll(async () => {
  ({ proofId, caseId, stepId } = await draftCaseStep("Case coverage test", "Trees", "Split by the number of branch vertices."));
});

const patch = (body: unknown) => caseRoute.PATCH(jsonRequest("/x", "PATCH", body), params({ proofId, caseId: String(caseId) }));
const stored = async () => (await models().Case.findByPk(caseId))!.predicate;

describe("a case's machine-readable condition", () => {
  it("answers 422 naming the JSON path inside the condition, and writes nothing", async () => {
    await actAs("author");
    const res = await patch({ predicate: JSON.stringify({ and: [{ predicate: "tree" }, { predicate: "max-degree", relation: "<<", value: 2 }] }) });
    expect(res.status).toBe(422);
    const { error } = await res.json();
    expect(error.issues[0].path).toBe("predicate");
    expect(error.issues[0].message).toMatch(/^\$\.and\[1\]\.relation: expected one of/);
    expect((await patch({ predicate: "{ not json" })).status).toBe(422);
    expect(await stored()).toBeNull();
  });

  it("stores a good condition normalised, shows it in words on the case, and clears it with an empty text", async () => {
    await actAs("author");
    const condition = { and: [{ predicate: "tree" }, { not: { predicate: "contains", graph: { format: "edges", text: "0 1\n0 2\n0 3" } } }] };
    expect((await patch({ predicate: JSON.stringify(condition, null, 2) })).status).toBe(200);
    // The claw K1,3 with edges 0-1 0-2 0-3 in graph6 (McKay's format description): "C" for n = 4, then the
    // upper triangle by columns 01 02 12 03 13 23 = 110100 → 52 + 63 = 115 = "s".
    expect(JSON.parse((await stored())!)).toEqual({
      and: [{ predicate: "tree" }, { not: { predicate: "contains", graph: { format: "graph6", text: "Cs" } } }],
    });
    const view = flattenCaseTree(await getCaseTree(Number(proofId))).find((c) => c.id === caseId)!;
    expect(view.predicate?.words).toBe("G is a tree and not (G contains Cs (graph6) as a subgraph)");
    expect(view.condition).toBe("$\\Delta(T) \\ge 4$"); // the prose condition is untouched
    await actAs("reviewer");
    expect((await patch({ predicate: "" })).status).toBe(403);
    await actAs("author");
    expect((await patch({ predicate: "" })).status).toBe(200);
    expect(await stored()).toBeNull();
  });
});

describe("coverage claims through the API", () => {
  it("verifies a split that covers and refutes a leaky one, naming the uncovered graphs", async () => {
    await actAs("author");
    const claim = (cases: unknown[]) => ({ format: "cairn-claim/1", kind: "coverage", maxVertices: 5, cases });
    const covering = claim([
      { label: "tree", condition: { predicate: "tree" } },
      { label: "cyclic", condition: { predicate: "has-cycle" } },
    ]);
    // Connected graphs on ≤ 5 vertices that are neither trees nor contain a triangle: C4, C4 with a pendant, K2,3, C5
    // (nauty's geng -c -t 4 and 5).
    const leaky = claim([
      { label: "tree", condition: { predicate: "tree" } },
      { label: "triangle", condition: { predicate: "contains", graph: "Bw" } },
    ]);
    const res = await claimsRoute.POST(jsonRequest("/x?wait=60", "POST", { claims: [covering, leaky] }), params({ proofId, stepId }));
    expect(res.status).toBe(200);
    const [a, b] = (await res.json()).claims as Array<{ status: string; reason?: string }>;
    expect(a.status).toBe("verified");
    expect(b.status).toBe("refuted");
    const rows = await models().Claim.findAll({ where: { stepId: Number(stepId) }, order: [["id", "ASC"]] });
    const reason = rows.map((r) => JSON.stringify(r.toJSON())).join("\n");
    // Trees on ≤ 5 vertices: 1 + 1 + 1 + 2 + 3 = 8 (OEIS A000055) of the 31 connected graphs (OEIS A001349).
    expect(reason).toMatch(/tree covers 8, cyclic covers 23/);
    // The method and its certificate words fit the 200-character column.
    expect(rows.every((r) => r.method!.length < 200 && r.method!.endsWith("(graph6 or sparse6)"))).toBe(true);
    expect(reason).toMatch(/4 of the 31 graphs satisfy no sub-case/);
  });

  it("fills in the sub-cases from the step's case's children, and says which child lacks a condition", async () => {
    await actAs("author");
    const path = await addCase(proofId, "A path", caseId);
    const spider = await addCase(proofId, "One branch vertex", caseId);
    const more = await addCase(proofId, "Two or more branch vertices", caseId);
    const claim = { format: "cairn-claim/1", kind: "coverage", setting: "tree", maxVertices: 10 };
    const attach = () => claimsRoute.POST(jsonRequest("/x?wait=60", "POST", { claims: [claim] }), params({ proofId, stepId }));
    const setPredicate = (id: number, p: unknown) =>
      caseRoute.PATCH(jsonRequest("/x", "PATCH", { predicate: JSON.stringify(p) }), params({ proofId, caseId: String(id) }));
    expect((await setPredicate(path, { predicate: "path" })).status).toBe(200);
    expect((await setPredicate(spider, { predicate: "branch-vertices", relation: "=", value: 1 })).status).toBe(200);
    const missing = await attach();
    expect(missing.status).toBe(422);
    expect(JSON.stringify(await missing.json())).toMatch(/claims\.0\.cases.*missing on: \\"Two or more branch vertices\\"/);
    expect((await setPredicate(more, { predicate: "branch-vertices", relation: ">=", value: 2 })).status).toBe(200);
    const res = await attach();
    expect(res.status).toBe(200);
    const [c] = (await res.json()).claims as Array<{ id: number; status: string }>;
    expect(c.status).toBe("verified");
    const row = (await models().Claim.findByPk(c.id))!;
    // The stored claim carries the children's conditions (the offline checker needs nothing else).
    expect(JSON.parse(row.input).cases.map((x: { label: string }) => x.label)).toEqual(["A path", "One branch vertex", "Two or more branch vertices"]);
    // All 1 + 1 + 1 + 2 + 3 + 6 + 11 + 23 + 47 + 106 = 201 trees on ≤ 10 vertices (OEIS A000055).
    expect(row.reason).toMatch(/^All 201 graphs/);
  });

  it("runs over graphs with loops and multiple edges: a leaky split is refuted naming the missing multigraph in sparse6", async () => {
    await actAs("author");
    const claim = (extra: Record<string, unknown>) => ({
      format: "cairn-claim/1",
      kind: "coverage",
      setting: "multigraph",
      maxMultiplicity: 2,
      maxLoop: 1,
      ...extra,
    });
    // LEAKY_MULTIGRAPH_SPLIT: on ≤ 4 vertices only the double edge on 2 vertices escapes.
    const leaky = claim({ maxVertices: 4, cases: LEAKY_MULTIGRAPH_SPLIT });
    const res = await claimsRoute.POST(jsonRequest("/x?wait=60", "POST", { claims: [leaky] }), params({ proofId, stepId }));
    expect(res.status).toBe(200);
    const [c] = (await res.json()).claims as Array<{ id: number; status: string }>;
    expect(c.status).toBe("refuted");
    const row = (await models().Claim.findByPk(c.id))!;
    expect(JSON.parse(row.input)).toMatchObject({ setting: "multigraph", maxMultiplicity: 2, maxLoop: 1 });
    const named = /satisfy no sub-case's condition: (\S+) \(sparse6\)/.exec(row.reason!)![1];
    expect(canonicalKeyOf(readGraphText(named))).toBe(canonicalKeyOf(makeGraph(2, [{ u: 0, v: 1, m: 2 }])));
    // The card draws it (the double edge) and names it in sparse6.
    const picture = JSON.parse(row.picture!) as { pictures: Array<{ title: string; edges: Array<[number, number, number]> }> };
    expect(picture.pictures).toEqual([expect.objectContaining({ title: `uncovered graph 1 (sparse6 ${named})`, edges: [[0, 1, 2]] })]);

    // A predicate with no meaning there, and N past the cap for the bounds, are 422s naming the field; nothing is stored.
    const before = await models().Claim.count({ where: { stepId: Number(stepId) } });
    const branch = claim({ maxVertices: 3, cases: [{ condition: { predicate: "branch-vertices", relation: "=", value: 0 } }] });
    const bad = await claimsRoute.POST(jsonRequest("/x", "POST", { claims: [branch] }), params({ proofId, stepId }));
    expect(bad.status).toBe(422);
    expect(JSON.stringify(await bad.json())).toMatch(/claims\.0\.cases\[0\]\.condition\.predicate.*branch-vertices.*no agreed meaning/);
    const big = await claimsRoute.POST(
      jsonRequest("/x", "POST", { claims: [claim({ maxVertices: 9, cases: [{ condition: { predicate: "simple" } }] })] }),
      params({ proofId, stepId }),
    );
    expect(big.status).toBe(422);
    expect(JSON.stringify(await big.json())).toMatch(/claims\.0\.maxVertices.*at most 5 vertices/);
    expect(await models().Claim.count({ where: { stepId: Number(stepId) } })).toBe(before);
  });

  it("answers 422 with the path of a bad condition inside a coverage claim", async () => {
    await actAs("author");
    const bad = { format: "cairn-claim/1", kind: "coverage", maxVertices: 5, cases: [{ condition: { predicate: "planar" } }] };
    const res = await claimsRoute.POST(jsonRequest("/x", "POST", { claims: [bad] }), params({ proofId, stepId }));
    expect(res.status).toBe(422);
    expect(JSON.stringify(await res.json())).toMatch(/claims\.0\.cases\[0\]\.condition\.predicate/);
  });
});

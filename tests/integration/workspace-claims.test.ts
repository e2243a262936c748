/** Claims on steps: 422 naming the field, verification off the request path in the worker pool, verdicts and pictures. */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params, closeAfterAll } from "./helpers";
import { draftCaseStep, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import { verificationSettled } from "@/lib/data/claims";
import { runInPool } from "@/lib/verification/pool";
import { CLAIM_KINDS } from "@/lib/core/claims/claim-schema";
import * as claimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as proofClaimsRoute from "@/app/api/proofs/[proofId]/claims/route";
import * as claimRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/route";
import * as recheckRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/recheck/route";
import * as inputRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/input/route";

let proofId: string;
let stepId: string;
const named = (text: string) => ({ format: "named", text });
const claim = <T extends object>(o: T) => ({ format: "cairn-claim/1", ...o });
// ρ(K_{1,5}) = √5 exactly (a star with k leaves has spectral radius √k).
const starBound = claim({ kind: "spectral-radius-bound", graph: named("star(5)"), op: ">=", bound: "sqrt(5)" });
const starInTree = claim({ kind: "subgraph", pattern: named("star(4)"), host: named("starlike(1,1,1,2,3)"), induced: false });

closeAfterAll(() => dropProofs([proofId]), { pool: true });
beforeAll(async () => {
  ({ proofId, stepId } = await draftCaseStep("Workspace claims test", "A vertex of degree at least 5", "$K_{1,5} \\subseteq G$, so $\\rho(G) \\ge \\sqrt 5$."));
});

const attach = (claims: unknown, step = stepId) => claimsRoute.POST(jsonRequest("/x", "POST", { claims }), params({ proofId, stepId: step }));
const getClaim = async (id: number) => (await (await claimRoute.GET(new Request("http://localhost/x"), params({ proofId, claimId: String(id) }))).json()).claim;

describe("POST .../steps/[stepId]/claims", () => {
  it("stores claims pending (202), verifies them in the pool, and shows verdict, method, certificate and picture", async () => {
    await actAs("author");
    const res = await attach([starBound, starInTree]);
    expect(res.status).toBe(202);
    const { claims } = await res.json();
    expect(claims.map((c: { status: string }) => c.status)).toEqual(["pending", "pending"]);
    for (const c of claims) await verificationSettled(c.id);
    await actAs("reviewer");
    const bound = await getClaim(claims[0].id);
    expect(bound).toMatchObject({
      status: "verified",
      statement: "ρ(G) ≥ sqrt(5)",
      checkerVersion: expect.stringMatching(/^cairn-check\//),
      checkedByName: "Ada Quenby",
    });
    expect(bound.certificate.summary).toMatch(/supports “verified”/);
    expect(bound.digest).toMatch(/^[0-9a-f]{64}$/);
    // The picture: 6 vertices laid out, the float spectrum of K_{1,5} is ±√5 and 0 (display only).
    const picture = bound.picture.pictures[0];
    expect(picture.n).toBe(6);
    expect(picture.x).toHaveLength(6);
    expect(Math.max(...picture.spectrum)).toBeCloseTo(Math.sqrt(5), 6);
    expect(bound.picture.bound.approx).toBeCloseTo(Math.sqrt(5), 9);
    // The inputs as entered and as graph6 (K1,5 = "Esa?" by McKay's formats.txt), and the method without the
    // certificate words, which stand beside it as the certificate kind read from the certificate.
    expect(bound.inputs.entries[0]).toMatchObject({ type: "graph", graph: { entered: "star(5)", encoding: "graph6", encoded: "Esa?", order: 6, size: 5 } });
    expect(bound.inputs.entries.map((e: { label: string }) => e.label)).toEqual(["graph G", "relation", "bound b"]);
    expect(bound.method).not.toContain("certificate:");
    expect(bound.certificateKind).toEqual(expect.any(String));
    expect(bound.certificate.summary).toContain(bound.certificateKind);
    const sub = await getClaim(claims[1].id);
    expect(sub.status).toBe("verified");
    // The embedding's image is highlighted in the host: 5 vertices of K_{1,4}, its centre of degree 4.
    expect(sub.picture.pictures[0].highlight.vertices).toHaveLength(5);
    expect(sub.picture.pictures[0].highlight.edges).toHaveLength(4);
  });

  it("downloads a claim's full stored input to members who may see its step; 401 signed out, 403 for outsiders, 404 for another proof's id", async () => {
    await actAs("author");
    const [c] = await (await attach([starBound])).json().then((b: { claims: Array<{ id: number }> }) => b.claims);
    const get = (id: number | string, proof = proofId) => inputRoute.GET(new Request("http://localhost/x"), params({ proofId: proof, claimId: String(id) }));
    await actAs("reviewer");
    const res = await get(c.id);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toMatch(/attachment; filename="cairn-proof-\d+-claim-\d+-input\.json"/);
    expect(JSON.parse(await res.text())).toMatchObject({ kind: "spectral-radius-bound", graph: { format: "named", text: "star(5)" }, bound: "sqrt(5)" });
    await actAs("outsider");
    expect((await get(c.id)).status).toBe(403);
    await actAs("author");
    expect((await get(999_999_999)).status).toBe(404);
    await actAs(null);
    expect((await get(c.id)).status).toBe(401);
    await actAs("author");
    await verificationSettled(c.id);
  });

  it("answers 422 naming the field for a malformed graph, a bound that does not parse, or a wrong-size embedding; nothing is saved", async () => {
    await actAs("author");
    const before = await models().Claim.count({ where: { stepId: Number(stepId) } });
    const badGraph = await attach([claim({ kind: "structure", graph: { format: "matrix", text: "0 1\n1 0 1" }, predicate: "tree" })]);
    expect(badGraph.status).toBe(422);
    const g = (await badGraph.json()).error.issues[0];
    expect(g.path).toBe("claims.0.graph.text");
    expect(g.message).toMatch(/line 2/);
    const badBound = await attach([starBound, claim({ kind: "spectral-radius-bound", graph: named("path(4)"), op: "<", bound: "sqrt(5" })]);
    expect(badBound.status).toBe(422);
    expect((await badBound.json()).error.issues[0].path).toBe("claims.1.bound");
    const badEmbedding = await attach([{ ...starInTree, embedding: [0, 1, 2] }]);
    expect(badEmbedding.status).toBe(422);
    const e = (await badEmbedding.json()).error.issues[0];
    expect(e).toMatchObject({ path: "claims.0.embedding", message: expect.stringMatching(/3 vertices but the pattern H has 5/) });
    const badKind = await attach([claim({ kind: "magic", graph: named("path(3)") })]);
    expect((await badKind.json()).error.issues[0].path).toBe("claims.0.kind");
    expect((await attach([])).status).toBe(422);
    // Two unreadable claims, one whose graph text is cut short and one with a misspelt field: both are named at once.
    const both = await attach([claim({ kind: "spectral-radius-bound", graph: named("A(5"), op: "<", bound: "2" }), { ...starInTree, indcued: true }]);
    expect(both.status).toBe(422);
    const paths = (await both.json()).error.issues.map((i: { path: string }) => i.path);
    expect(paths).toHaveLength(2);
    expect(paths[0]).toMatch(/^claims\.0\.graph/);
    expect(paths[1]).toMatch(/^claims\.1/);
    expect(await models().Claim.count({ where: { stepId: Number(stepId) } })).toBe(before);
  });

  it("with ?wait answers 200 with the verdict once the pool is done", async () => {
    await actAs("author");
    const res = await claimsRoute.POST(jsonRequest("/x?wait=30", "POST", { claims: [starBound] }), params({ proofId, stepId }));
    expect(res.status).toBe(200);
    expect((await res.json()).claims[0]).toMatchObject({ status: "verified", statement: "ρ(G) ≥ sqrt(5)" });
  });

  it("401, 403 for a reviewer and a non-member, 404 for a step of another proof", async () => {
    await actAs(null);
    expect((await attach([starBound])).status).toBe(401);
    await actAs("reviewer");
    expect((await attach([starBound])).status).toBe(403);
    await actAs("outsider");
    expect((await attach([starBound])).status).toBe(403);
    await actAs("author");
    const foreign = await models().Step.findOne({ order: [["id", "ASC"]] });
    expect((await attach([starBound], String(foreign!.id))).status).toBe(404);
  });
});

describe("every kind the core offers", () => {
  it("attaches one claim of each kind and gets a verdict for each", async () => {
    await actAs("author");
    const e8 = named("E(8)");
    const all = [
      starBound,
      // Ẽ8 = T(1,2,5); its null vector (the marks 1..6, 4, 2, 3) certifies ρ = 2.
      claim({ kind: "vector-certificate", graph: named("E~(8)"), vector: ["1", "2", "3", "4", "5", "6", "4", "2", "3"], relation: "=", bound: "2" }),
      starInTree,
      claim({ kind: "exclusion", host: named("path(6)"), patterns: [named("star(3)"), named("cycle(3)")], induced: false }),
      claim({ kind: "identification", graph: e8, family: "E8" }),
      // χ(P3) = x³ − 2x.
      claim({ kind: "characteristic-polynomial", graph: named("path(3)"), coefficients: ["1", "0", "-2", "0"] }),
      // E8's exponents with Coxeter number 30.
      claim({ kind: "eigenvalues", graph: e8, h: 30, multiset: [1, 7, 11, 13, 17, 19, 23, 29] }),
      claim({ kind: "structure", graph: e8, predicate: "leg-lengths", parameter: [1, 2, 4] }),
      // Smith 1970: the connected graphs with ρ < 2 on at most 5 vertices are A1–A5, D4, D5.
      claim({ kind: "enumeration", maxVertices: 5, op: "<", bound: "2", graphs: ["A(1)", "A(2)", "A(3)", "A(4)", "D(4)", "A(5)", "D(5)"].map(named) }),
      // h(E8) = 30 and |W(E8)| = 696729600 (Humphreys, Reflection Groups and Coxeter Groups, Tables 2.4 and 3.1).
      claim({ kind: "dynkin-data", graph: e8, type: "E8", coxeterNumber: 30, weylGroupOrder: "696729600" }),
      // Every connected graph is a tree or contains a cycle (elementary), here on ≤ 5 vertices.
      claim({ kind: "coverage", maxVertices: 5, cases: [{ condition: { predicate: "tree" } }, { condition: { predicate: "has-cycle" } }] }),
    ];
    const res = await claimsRoute.POST(jsonRequest("/x?wait=60", "POST", { claims: all }), params({ proofId, stepId }));
    expect(res.status).toBe(200);
    const claims = (await res.json()).claims as Array<{ kind: string; status: string }>;
    expect(new Set(claims.map((c) => c.kind)).size).toBe(CLAIM_KINDS.length);
    expect(claims.map((c) => `${c.kind}: ${c.status}`)).toEqual(all.map((c) => `${c.kind}: verified`));
  });
});

describe("claims list, one claim and re-check", () => {
  it("lists every claim of the proof with its step number; re-check runs again (202) for authors, 403 for reviewers", async () => {
    await actAs("reviewer");
    const list = await proofClaimsRoute.GET(new Request("http://localhost/x"), params({ proofId }));
    expect(list.status).toBe(200);
    const rows = (await list.json()).claims;
    expect(rows.length).toBeGreaterThanOrEqual(2);
    expect(rows[0]).toMatchObject({ stepNumber: "1(a)", caseNumber: "1", kind: "spectral-radius-bound", status: "verified" });
    expect((await recheckRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, claimId: String(rows[0].id) }))).status).toBe(403);
    await actAs("author");
    const again = await recheckRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, claimId: String(rows[0].id) }));
    expect(again.status).toBe(202);
    expect((await models().Claim.findByPk(rows[0].id))!.status).toBe("pending");
    await verificationSettled(rows[0].id);
    expect((await getClaim(rows[0].id)).status).toBe("verified");
    expect((await claimRoute.GET(new Request("http://localhost/x"), params({ proofId, claimId: "987654" }))).status).toBe(404);
    expect((await recheckRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, claimId: "987654" }))).status).toBe(404);
    const one = { proofId, claimId: String(rows[0].id) };
    await actAs("outsider");
    expect((await proofClaimsRoute.GET(new Request("http://localhost/x"), params({ proofId }))).status).toBe(403);
    expect((await claimRoute.GET(new Request("http://localhost/x"), params(one))).status).toBe(403);
    expect((await recheckRoute.POST(new Request("http://localhost/x", { method: "POST" }), params(one))).status).toBe(403);
    expect((await claimsRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId }))).status).toBe(403);
    await actAs(null);
    expect((await claimsRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId }))).status).toBe(401);
    expect((await proofClaimsRoute.GET(new Request("http://localhost/x"), params({ proofId }))).status).toBe(401);
    expect((await claimRoute.GET(new Request("http://localhost/x"), params(one))).status).toBe(401);
    expect((await recheckRoute.POST(new Request("http://localhost/x", { method: "POST" }), params(one))).status).toBe(401);
  });
});

describe("the worker pool", () => {
  it("runs a heavy check in a worker thread while this thread keeps answering", async () => {
    let ticks = 0;
    const timer = setInterval(() => ticks++, 10);
    const started = Date.now();
    // det(xI − A) of K_150 takes about a second of exact arithmetic.
    const answer = await runInPool({
      mode: "verify",
      claim: claim({ kind: "characteristic-polynomial", graph: named("complete(150)") }),
      stepLimit: 200_000_000,
      picture: false,
    });
    clearInterval(timer);
    const elapsed = Date.now() - started;
    expect(answer.ok && answer.outcome?.status).toBe("verified");
    // Had the check run on this thread, no timer could have fired until it ended.
    expect(ticks).toBeGreaterThan(elapsed / 10 / 4);
  });

  it("turns an exhausted budget into undecided with the reason", async () => {
    const answer = await runInPool({
      mode: "verify",
      claim: claim({ kind: "structure", graph: named("path(100000)"), predicate: "tree" }),
      stepLimit: 50,
      picture: false,
    });
    expect(answer.ok).toBe(true);
    if (!answer.ok) return;
    expect(answer.outcome).toMatchObject({ status: "undecided", reason: expect.stringMatching(/budget exceeded/) });
  });
});

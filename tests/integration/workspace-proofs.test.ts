/** Proofs and the case tree: create, edit, nest, number, reorder, move and delete with confirmation. */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params, expectStatusAs } from "./helpers";
import { addCase, addStep, draftProof, dropProofs } from "./workspace-fixture";
import { closeSequelize } from "@/lib/db";
import { models } from "@/models";
import { listDeletedCases } from "@/lib/data/cases";
import * as proofsRoute from "@/app/api/proofs/route";
import * as proofRoute from "@/app/api/proofs/[proofId]/route";
import * as casesRoute from "@/app/api/proofs/[proofId]/cases/route";
import * as caseRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/route";

const created: string[] = [];
let proofId: string;

beforeAll(async () => {
  proofId = await draftProof("Workspace proofs test");
  created.push(proofId);
});
afterAll(async () => {
  await dropProofs(created);
  await closeSequelize();
});

const tree = async () => {
  await actAs("reviewer");
  const res = await casesRoute.GET(new Request(`http://localhost/api/proofs/${proofId}/cases`), params({ proofId }));
  expect(res.status).toBe(200);
  return res.json() as Promise<{
    cases: Array<{ id: number; number: string; title: string; state: string; children: Array<{ id: number; number: string; title: string }> }>;
    counts: Record<string, number>;
  }>;
};

describe("POST /api/proofs", () => {
  it("creates a proof with its creator as author (201), listed for them", async () => {
    await actAs("author");
    const res = await proofsRoute.POST(jsonRequest("/api/proofs", "POST", { title: "  A second proof  ", statement: "$\\rho < 2$" }), params({}));
    expect(res.status).toBe(201);
    const id = String((await res.json()).proof.id);
    created.push(id);
    const members = await models().ProofMember.findAll({ where: { proofId: Number(id) } });
    expect(members.map((m) => m.role)).toEqual(["author"]);
    expect((await models().Proof.findByPk(Number(id)))!.title).toBe("A second proof");
  });

  it("answers 401 without a session and 422 naming the empty field", async () => {
    await actAs(null);
    expect((await proofsRoute.POST(jsonRequest("/api/proofs", "POST", { title: "x", statement: "y" }), params({}))).status).toBe(401);
    await actAs("author");
    const bad = await proofsRoute.POST(jsonRequest("/api/proofs", "POST", { title: "", statement: "y" }), params({}));
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues).toEqual([expect.objectContaining({ path: "title" })]);
    const notJson = await proofsRoute.POST(jsonRequest("/api/proofs", "POST", "{oops"), params({}));
    expect(notJson.status).toBe(422);
  });
});

describe("PATCH /api/proofs/[proofId]", () => {
  const patch = (body: unknown, id = proofId) => proofRoute.PATCH(jsonRequest(`/api/proofs/${id}`, "PATCH", body), params({ proofId: id }));
  it("lets the author edit the statement; 401, 403 reviewer, 403 non-member, 404, 422", async () => {
    await actAs("author");
    const ok = await patch({ statement: "Every tree with $\\rho(T) < 2$ is of type A, D or E." });
    expect(ok.status).toBe(200);
    expect((await ok.json()).proof.statement).toContain("type A, D or E");
    await expectStatusAs(() => patch({ title: "t" }), { nobody: 401, reviewer: 403, outsider: 403 });
    await actAs("author");
    expect((await patch({ title: "t" }, "987654")).status).toBe(404);
    expect((await patch({})).status).toBe(422);
  });
});

describe("case tree", () => {
  it("numbers nested cases 1, 1.1, 1.2, 2 and reports each state", async () => {
    const one = await addCase(proofId, "A vertex of degree at least 4");
    await addCase(proofId, "Sub-case a", one);
    await addCase(proofId, "Sub-case b", one);
    await addCase(proofId, "All degrees at most 3");
    const { cases, counts } = await tree();
    expect(cases.map((c) => [c.number, c.title])).toEqual([
      ["1", "A vertex of degree at least 4"],
      ["2", "All degrees at most 3"],
    ]);
    expect(cases[0].children.map((c) => c.number)).toEqual(["1.1", "1.2"]);
    expect(cases[0].state).toBe("drafting");
    expect(counts.drafting).toBe(4);
  });

  it("POST: 401, 403 for a reviewer and a non-member, 422 for a parent in another proof, 404 for no proof", async () => {
    const post = (body: unknown, id = proofId) => casesRoute.POST(jsonRequest(`/api/proofs/${id}/cases`, "POST", body), params({ proofId: id }));
    await actAs(null);
    expect((await post({ title: "x" })).status).toBe(401);
    await actAs("reviewer");
    const denied = await post({ title: "x" });
    expect(denied.status).toBe(403);
    expect((await denied.json()).error.message).toMatch(/author/);
    await actAs("outsider");
    expect((await post({ title: "x" })).status).toBe(403);
    await actAs("author");
    const foreign = await models().Case.findOne({ where: { proofId: { [(await import("sequelize")).Op.ne]: Number(proofId) } } });
    const bad = await post({ title: "x", parentId: foreign!.id });
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues[0].path).toBe("parentId");
    expect((await post({ title: "" })).status).toBe(422);
    expect((await post({ title: "x" }, "987654")).status).toBe(404);
  });

  it("moves a case down and up among its siblings, renumbering", async () => {
    const { cases } = await tree();
    const [a, b] = cases[0].children;
    await actAs("author");
    const res = await caseRoute.PATCH(jsonRequest("/x", "PATCH", { move: "down" }), params({ proofId, caseId: String(a.id) }));
    expect(res.status).toBe(200);
    const after = (await tree()).cases[0].children;
    expect(after.map((c) => [c.id, c.number])).toEqual([
      [b.id, "1.1"],
      [a.id, "1.2"],
    ]);
  });

  it("asks for confirmation before moving or deleting a case with steps, then keeps its history", async () => {
    const { cases } = await tree();
    const target = cases[1];
    const step = await addStep(proofId, target.id, "By $\\rho(K_{1,4}) = 2$ …");
    await actAs("author");
    const move = await caseRoute.PATCH(jsonRequest("/x", "PATCH", { parentId: cases[0].id }), params({ proofId, caseId: String(target.id) }));
    expect(move.status).toBe(409);
    expect((await move.json()).error).toMatchObject({ code: "conflict", needsConfirmation: true, steps: 1 });
    const moved = await caseRoute.PATCH(jsonRequest("/x", "PATCH", { parentId: cases[0].id, confirm: true }), params({ proofId, caseId: String(target.id) }));
    expect(moved.status).toBe(200);
    expect((await tree()).cases[0].children.map((c) => c.number)).toEqual(["1.1", "1.2", "1.3"]);

    await actAs("author");
    const del = await caseRoute.DELETE(new Request("http://localhost/x", { method: "DELETE" }), params({ proofId, caseId: String(target.id) }));
    expect(del.status).toBe(409);
    const confirmed = await caseRoute.DELETE(jsonRequest("/x", "DELETE", { confirm: true }), params({ proofId, caseId: String(target.id) }));
    expect(confirmed.status).toBe(200);
    expect((await tree()).cases[0].children.map((c) => c.id)).not.toContain(target.id);
    // The history stays: the case row (marked deleted), its step and revision are still stored.
    expect((await models().Case.findByPk(target.id))!.deletedAt).toBeInstanceOf(Date);
    expect(await models().StepRevision.count({ where: { stepId: step.id } })).toBe(1);
    expect(await listDeletedCases(Number(proofId))).toEqual([expect.objectContaining({ id: target.id, title: target.title, steps: 1 })]);
  });

  it("refuses to move a case under its own sub-case (422) and answers 404, 401, 403 on PATCH/DELETE", async () => {
    const { cases } = await tree();
    const parent = cases[0];
    await actAs("author");
    const loop = await caseRoute.PATCH(jsonRequest("/x", "PATCH", { parentId: parent.children[0].id }), params({ proofId, caseId: String(parent.id) }));
    expect(loop.status).toBe(422);
    expect((await caseRoute.PATCH(jsonRequest("/x", "PATCH", { title: "t" }), params({ proofId, caseId: "987654" }))).status).toBe(404);
    expect((await caseRoute.PATCH(jsonRequest("/x", "PATCH", { move: "sideways" }), params({ proofId, caseId: String(parent.id) }))).status).toBe(422);
    await actAs(null);
    expect((await caseRoute.DELETE(jsonRequest("/x", "DELETE", {}), params({ proofId, caseId: String(parent.id) }))).status).toBe(401);
    await actAs("reviewer");
    expect((await caseRoute.DELETE(jsonRequest("/x", "DELETE", {}), params({ proofId, caseId: String(parent.id) }))).status).toBe(403);
    expect((await caseRoute.PATCH(jsonRequest("/x", "PATCH", { title: "t" }), params({ proofId, caseId: String(parent.id) }))).status).toBe(403);
    await actAs("outsider");
    expect((await casesRoute.GET(new Request("http://localhost/x"), params({ proofId }))).status).toBe(403);
  });
});

/** Restoring deleted cases: back with everything they held, last among their siblings, parents first. */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params } from "./helpers";
import { addCase, addStep, draftProof, dropProofs } from "./workspace-fixture";
import { closeSequelize } from "@/lib/db";
import { models } from "@/models";
import { getCaseTree, listDeletedCases } from "@/lib/data/cases";
import { flattenCaseTree } from "@/lib/proof-tree";
import * as caseRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/route";
import * as restoreRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/restore/route";

let proofId: string;
const ids: Record<string, number> = {};

beforeAll(async () => {
  proofId = await draftProof("Case restore test");
  ids.a = await addCase(proofId, "Degree at least 5");
  ids.b = await addCase(proofId, "A tree with two branch vertices");
  ids.b1 = await addCase(proofId, "Both branch vertices of degree 3", ids.b);
  ids.c = await addCase(proofId, "A cycle");
  await addStep(proofId, ids.b1, "Contains $\\tilde D_n$, so $\\rho \\ge 2$.");
});
afterAll(async () => {
  await dropProofs([proofId]);
  await closeSequelize();
});

const del = (caseId: number) => caseRoute.DELETE(jsonRequest("/x", "DELETE", { confirm: true }), params({ proofId, caseId: String(caseId) }));
const restore = (caseId: number) => restoreRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, caseId: String(caseId) }));
const numbered = async () => flattenCaseTree(await getCaseTree(Number(proofId))).map((c) => `${c.number} ${c.title}`);

describe("POST /api/proofs/[proofId]/cases/[caseId]/restore", () => {
  it("brings cases back last among their siblings, a deleted parent first, with their steps", async () => {
    await actAs("author");
    expect((await del(ids.b1)).status).toBe(200);
    expect((await del(ids.b)).status).toBe(200);
    expect(await numbered()).toEqual(["1 Degree at least 5", "2 A cycle"]);
    expect((await listDeletedCases(Number(proofId))).map((c) => c.id).sort()).toEqual([ids.b, ids.b1].sort());

    // The sub-case cannot come back while its parent is deleted: the answer names the parent.
    const early = await restore(ids.b1);
    expect(early.status).toBe(409);
    expect((await early.json()).error).toMatchObject({ restoreFirst: ids.b, message: expect.stringContaining("A tree with two branch vertices") });

    // Neither a reviewer nor a signed-out visitor can restore.
    await actAs("reviewer");
    expect((await restore(ids.b)).status).toBe(403);
    await actAs(null);
    expect((await restore(ids.b)).status).toBe(401);

    await actAs("author");
    expect((await restore(ids.b)).status).toBe(200);
    expect(await numbered()).toEqual(["1 Degree at least 5", "2 A cycle", "3 A tree with two branch vertices"]);
    expect((await restore(ids.b1)).status).toBe(200);
    expect(await numbered()).toEqual(["1 Degree at least 5", "2 A cycle", "3 A tree with two branch vertices", "3.1 Both branch vertices of degree 3"]);
    const back = flattenCaseTree(await getCaseTree(Number(proofId))).find((c) => c.id === ids.b1)!;
    expect(back.steps).toHaveLength(1);
    expect(await listDeletedCases(Number(proofId))).toEqual([]);
    expect(await models().AuditEvent.count({ where: { action: "case.restored", subjectId: [ids.b, ids.b1] } })).toBe(2);
  });

  it("answers 409 for a case that is not deleted and 404 for a case of no such proof", async () => {
    await actAs("author");
    const live = await restore(ids.a);
    expect(live.status).toBe(409);
    expect((await live.json()).error.message).toMatch(/not deleted/);
    expect((await restore(987654)).status).toBe(404);
  });

  it("explains a sub-case hidden by its deleted parent: it comes back with the parent", async () => {
    await actAs("author");
    const c1 = await addCase(proofId, "A cycle with a chord", ids.c);
    expect((await del(ids.c)).status).toBe(200);
    const hidden = await restore(c1);
    expect(hidden.status).toBe(409);
    expect((await hidden.json()).error).toMatchObject({ restoreFirst: ids.c, message: expect.stringMatching(/not deleted itself.*“A cycle”/) });
    expect((await restore(ids.c)).status).toBe(200);
    expect(await numbered()).toContain("3.1 A cycle with a chord");
  });
});

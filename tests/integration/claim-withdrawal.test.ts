/** Withdrawing a claim: authors only, history kept, and the claim stops counting everywhere. */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params, closeAfterAll } from "./helpers";
import { draftCaseStep, draftProof, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import { getProofOverview } from "@/lib/data/cases";
import { verificationSettled } from "@/lib/data/claims";
import { listProofClaims } from "@/lib/data/claim-lists";
import * as claimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as claimRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/route";
import * as recheckRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/recheck/route";

let proofId: string;
let caseId: number;
let stepId: string;
const named = (text: string) => ({ format: "named", text });
// E7 is a Dynkin diagram, so ρ(E7) < 2 (Smith 1970); the typo "E(8)~" was meant as affine E8, and
// ρ(E8) < 2 as well, so "ρ(E8) ≥ 2" is refuted.
const good = { format: "cairn-claim/1", kind: "spectral-radius-bound", graph: named("E(7)"), op: "<", bound: "2" };
const typo = { format: "cairn-claim/1", kind: "spectral-radius-bound", graph: named("E(8)"), op: ">=", bound: "2" };

closeAfterAll(() => dropProofs([proofId]), { pool: true });
beforeAll(async () => {
  ({ proofId, caseId, stepId } = await draftCaseStep("Claim withdrawal test", "Trees with three legs", "$E_7$ and $\\tilde E_8$."));
});

const withdraw = (id: number) => claimRoute.DELETE(new Request("http://localhost/x", { method: "DELETE" }), params({ proofId, claimId: String(id) }));
const stepClaims = async () => (await claimsRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId }))).json();
const caseState = async () => (await getProofOverview(Number(proofId), null, { id: 0, role: "editor" })).cases.find((c) => c.id === caseId)!.state;

describe("DELETE /api/proofs/[proofId]/claims/[claimId]", () => {
  it("takes back a refuted claim: the case stops failing, the claim leaves the tables, the history keeps it", async () => {
    await actAs("author");
    const { claims } = await (await claimsRoute.POST(jsonRequest("/x", "POST", { claims: [good, typo] }), params({ proofId, stepId }))).json();
    for (const c of claims) await verificationSettled(c.id);
    const [kept, mistaken] = claims.map((c: { id: number }) => c.id);
    expect((await stepClaims()).claims.map((c: { status: string }) => c.status)).toEqual(["verified", "refuted"]);
    expect(await caseState()).toBe("claim failing");

    // Neither a reviewer nor a non-member may withdraw; nothing changes.
    await actAs("reviewer");
    expect((await withdraw(mistaken)).status).toBe(403);
    await actAs("outsider");
    expect((await withdraw(mistaken)).status).toBe(403);
    await actAs("author");
    expect((await stepClaims()).claims).toHaveLength(2);
    const res = await withdraw(mistaken);
    expect(res.status).toBe(200);
    expect((await res.json()).withdrawn).toMatchObject({ id: mistaken, status: "refuted", withdrawnByName: "Ada Quenby" });
    const after = await stepClaims();
    expect(after.claims.map((c: { id: number }) => c.id)).toEqual([kept]);
    expect(after.withdrawn.map((w: { id: number }) => w.id)).toEqual([mistaken]);
    expect(await caseState()).not.toBe("claim failing");
    expect((await listProofClaims(Number(proofId))).map((c) => c.id)).toEqual([kept]);

    // The row and an audit event remain; the claim itself can no longer be read, re-checked or withdrawn again.
    const row = await models().Claim.unscoped().findByPk(mistaken);
    expect(row?.withdrawnAt).toBeInstanceOf(Date);
    expect(await models().AuditEvent.count({ where: { action: "claim.withdrawn", subjectId: mistaken } })).toBe(1);
    expect((await claimRoute.GET(new Request("http://localhost/x"), params({ proofId, claimId: String(mistaken) }))).status).toBe(404);
    expect((await recheckRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, claimId: String(mistaken) }))).status).toBe(404);
    expect((await withdraw(mistaken)).status).toBe(404);
  });

  it("answers 404 for a claim of another proof, 401 when signed out", async () => {
    await actAs("author");
    const other = await draftProof("Another proof");
    try {
      const claimId = String((await models().Claim.findOne({ where: { stepId: Number(stepId) } }))!.id);
      const res = await claimRoute.DELETE(new Request("http://localhost/x", { method: "DELETE" }), params({ proofId: other, claimId }));
      expect(res.status).toBe(404);
      await actAs(null);
      expect((await withdraw(Number(claimId))).status).toBe(401);
      expect((await claimsRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId }))).status).toBe(401);
    } finally {
      await dropProofs([other]);
    }
  });
});

/** Reordering the steps of a case: places stay 1..k and the labels (case:place) follow. */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params } from "./helpers";
import { addCase, addStep, draftProof, dropProofs } from "./workspace-fixture";
import { closeSequelize } from "@/lib/db";
import { models } from "@/models";
import { getCaseTree } from "@/lib/data/cases";
import * as stepRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/route";

let proofId: string;
let otherProofId: string;
let caseId: number;
const steps: number[] = [];

beforeAll(async () => {
  proofId = await draftProof("Step order test");
  otherProofId = await draftProof("Another proof");
  caseId = await addCase(proofId, "Starlike trees");
  for (const body of ["First: the legs.", "Second: the bound.", "Third: the exceptions."]) steps.push((await addStep(proofId, caseId, body)).id);
});
afterAll(async () => {
  await dropProofs([proofId, otherProofId]);
  await closeSequelize();
});

const move = (stepId: number, body: unknown, proof = proofId) =>
  stepRoute.PATCH(jsonRequest("/x", "PATCH", body), params({ proofId: proof, stepId: String(stepId) }));
const order = async () => (await getCaseTree(Number(proofId))).find((c) => c.id === caseId)!.steps.map((s) => s.id);
const label = async (stepId: number) =>
  (await (await stepRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(stepId) }))).json()).step.number;

describe("PATCH /api/proofs/[proofId]/steps/[stepId]", () => {
  it("moves a step up and down within its case; the labels follow; the ends do not move", async () => {
    const [s1, s2, s3] = steps;
    await actAs("author");
    expect((await move(s3, { move: "up" })).status).toBe(200);
    expect(await order()).toEqual([s1, s3, s2]);
    expect(await label(s3)).toBe("1(b)");
    expect(await label(s2)).toBe("1(c)");
    expect((await move(s1, { move: "up" })).status).toBe(200); // already first: nothing changes
    expect((await move(s2, { move: "down" })).status).toBe(200); // already last
    expect(await order()).toEqual([s1, s3, s2]);
    expect((await move(s1, { move: "down" })).status).toBe(200);
    expect(await order()).toEqual([s3, s1, s2]);
    const positions = (await models().Step.findAll({ where: { caseId }, order: [["position", "ASC"]] })).map((s) => [s.id, s.position]);
    expect(positions).toEqual([
      [s3, 1],
      [s1, 2],
      [s2, 3],
    ]);
    expect(await models().AuditEvent.count({ where: { action: "step.moved", subjectId: [s1, s3] } })).toBe(2);
  });

  it("answers 422 for a bad move, 403 for a reviewer, 404 for a step of another proof, 401 signed out", async () => {
    await actAs("author");
    const bad = await move(steps[0], { move: "sideways" });
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues[0]).toMatchObject({ path: "move", message: 'move must be "up" or "down"' });
    expect((await move(steps[0], { move: "up" }, otherProofId)).status).toBe(404);
    await actAs("reviewer");
    expect((await move(steps[0], { move: "down" })).status).toBe(403);
    await actAs(null);
    expect((await move(steps[0], { move: "down" })).status).toBe(401);
    await actAs("author");
    expect(await order()).toEqual([steps[2], steps[0], steps[1]]); // nothing moved
  });
});

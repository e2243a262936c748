/** A fresh proof per test file for the workspace tests: Ada (author) creates it, Celia joins as reviewer. */
import { models } from "@/models";
import { actAs, jsonRequest, params, userIdOf } from "./helpers";
import * as proofsRoute from "@/app/api/proofs/route";
import * as casesRoute from "@/app/api/proofs/[proofId]/cases/route";
import * as stepsRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/steps/route";

export async function draftProof(title: string): Promise<string> {
  await actAs("author");
  const res = await proofsRoute.POST(
    jsonRequest("/api/proofs", "POST", { title, statement: "Every tree $T$ with $\\rho(T) \\le 2$ is a Dynkin diagram." }),
    params({}),
  );
  if (res.status !== 201) throw new Error(`draftProof: ${res.status} ${await res.text()}`);
  const id = (await res.json()).proof.id as number;
  await models().ProofMember.create({ proofId: id, userId: await userIdOf("reviewer"), role: "reviewer" });
  return String(id);
}

export async function addCase(proofId: string, title: string, parentId?: number): Promise<number> {
  await actAs("author");
  const res = await casesRoute.POST(
    jsonRequest(`/api/proofs/${proofId}/cases`, "POST", { title, condition: "$\\Delta(T) \\ge 4$", parentId }),
    params({ proofId }),
  );
  if (res.status !== 201) throw new Error(`addCase: ${res.status} ${await res.text()}`);
  return (await res.json()).case.id;
}

export async function addStep(proofId: string, caseId: number, body: string): Promise<{ id: number; revisionId: number }> {
  await actAs("author");
  const res = await stepsRoute.POST(jsonRequest(`/api/proofs/${proofId}/cases/${caseId}/steps`, "POST", { body }), params({ proofId, caseId: String(caseId) }));
  if (res.status !== 201) throw new Error(`addStep: ${res.status} ${await res.text()}`);
  return (await res.json()).step;
}

export interface DraftedStep {
  proofId: string;
  caseId: number;
  stepId: string;
}

/** A drafted proof (draftProof) with one case and, if `stepBody` is given, one step in it (stepId is "" without). */
export async function draftCaseStep(title: string, caseTitle: string, stepBody?: string): Promise<DraftedStep> {
  const proofId = await draftProof(title);
  const caseId = await addCase(proofId, caseTitle);
  const stepId = stepBody === undefined ? "" : String((await addStep(proofId, caseId, stepBody)).id);
  return { proofId, caseId, stepId };
}

/** Removes the proofs a test file created, so other files see the demo data unchanged. */
export async function dropProofs(ids: string[]): Promise<void> {
  await models().Proof.destroy({ where: { id: ids.map(Number) } });
}

import { forbidden } from "@/lib/errors";
import { proofAccess, seesCase, type ProofAction } from "@/lib/access";
import { loadBatch } from "@/lib/data/batches";
import { loadStep } from "@/lib/data/reviews";

/** 401 → 404 (proof, batch) → 403 (not a member, the action, a case out of scope) for a batch claim's routes. */
export async function requireBatchAccess(proofId: number, batchId: number, action: ProofAction = "proof.read") {
  const access = await proofAccess(proofId, action);
  const { batch, stepId } = await loadBatch(proofId, batchId);
  const step = await loadStep(proofId, stepId);
  if (!seesCase(access, step.caseId)) throw forbidden("This batch claim belongs to a step in a case you were not asked to review.");
  return { access, batch };
}

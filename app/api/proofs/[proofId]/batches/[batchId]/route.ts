import { route } from "@/lib/http";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireBatchAccess } from "./batch-access";
import { batchesVerification } from "@/lib/data/batches";

type Context = { params: Promise<{ proofId: string; batchId: string }> };

/** A batch claim's progress: done / total, verdict counts, failing so far, rate and estimate, and whether verification is paused; any member who sees its step. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, batchId } = await routeIds(params);
  const { batch } = await requireBatchAccess(proofId, batchId);
  return Response.json({ batch, verification: await batchesVerification([batch]) });
});

import { route } from "@/lib/http";
import { cancelBatch } from "@/lib/data/batches";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireBatchAccess } from "../batch-access";

type Context = { params: Promise<{ proofId: string; batchId: string }> };

/** Cancels a batch claim that is still running (authors); results already stored stay. 409 once finished. */
export const POST = route(async (_request: Request, { params }: Context) => {
  const { proofId, batchId } = await routeIds(params);
  const { access } = await requireBatchAccess(proofId, batchId, "claims.write");
  return Response.json({ batch: await cancelBatch(proofId, batchId, access.user.id) });
});

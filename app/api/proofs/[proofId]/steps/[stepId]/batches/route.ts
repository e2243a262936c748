import { readBody, route, BODY_LIMITS } from "@/lib/http";
import { requireStepAccess } from "@/lib/access";
import { batchesVerification, createBatch, listStepBatches } from "@/lib/data/batches";
import { createBatchSchema } from "@/lib/validations/batch";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/** The step's batch claims with their progress, and whether verification is paused while one is unfinished; any member who sees the step. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  await requireStepAccess(proofId, stepId);
  const batches = await listStepBatches(stepId);
  return Response.json({ batches, verification: await batchesVerification(batches) });
});

/**
 * Starts a batch claim over a graph list uploaded to this step: `{ fileId, op, bound }` for "every
 * graph of the file satisfies ρ(G) op bound"; authors only. 202: the chunks are queued for the
 * workers (`queued: false` when the queue is away: the batch waits and the workers pick it up later).
 */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  const { user } = await requireStepAccess(proofId, stepId, "claims.write");
  const input = await readBody(request, createBatchSchema, BODY_LIMITS.small);
  const { batch, queued } = await createBatch(proofId, stepId, user.id, input);
  return Response.json({ batch, queued }, { status: 202 });
});

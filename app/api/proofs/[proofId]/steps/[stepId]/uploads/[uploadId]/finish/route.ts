import { route } from "@/lib/http";
import { requireStepAccess } from "@/lib/access";
import { finishPartUpload } from "@/lib/data/part-uploads";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; stepId: string; uploadId: string }> };

/**
 * Finishes the upload: 409 naming the missing parts, 413 past the limit, 409 when the SHA-256 declared at the start does
 * not match, 415 by content. Otherwise as a one-request upload: 201 with the new file row, or 200 with the row this step
 * already has for these bytes (stored once).
 */
export const POST = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId, uploadId } = await routeIds(params);
  const { user } = await requireStepAccess(proofId, stepId, "files.upload");
  const { file, duplicate } = await finishPartUpload(proofId, stepId, user.id, uploadId);
  return Response.json({ file, duplicate }, { status: duplicate ? 200 : 201 });
});

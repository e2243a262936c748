import { route } from "@/lib/http";
import { requireStepAccess } from "@/lib/access";
import { listStepFiles, receiveUpload } from "@/lib/data/files";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/** The files uploaded to this step; any member who sees the step. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  await requireStepAccess(proofId, stepId);
  return Response.json({ files: await listStepFiles(proofId, stepId) });
});

/**
 * Uploads one file to the step: the raw bytes are the body (any Content-Type), `?name=` the file's
 * name and `?kind=graph-list|claims|document` optionally what the uploader means. Authors and the
 * proof's owner only. The type is decided by content: 415 for content Cairn does not take (or that
 * contradicts `kind`), 413 past CAIRN_UPLOAD_MAX_BYTES (named in the message). 201 with the new
 * row; 200 with the existing row when this step already has the same bytes (stored once).
 */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  const { user } = await requireStepAccess(proofId, stepId, "files.upload");
  const { file, duplicate } = await receiveUpload(request, proofId, stepId, user.id);
  return Response.json({ file, duplicate }, { status: duplicate ? 200 : 201 });
});

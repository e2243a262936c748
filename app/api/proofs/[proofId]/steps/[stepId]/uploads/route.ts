import { readBody, route, BODY_LIMITS } from "@/lib/http";
import { requireStepAccess } from "@/lib/access";
import { startPartUpload } from "@/lib/data/part-uploads";
import { partUploadSchema } from "@/lib/validations/upload";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/**
 * Starts an upload in parts (files larger than one part; lib/data/part-uploads.ts): JSON `{ name, size, sha256?, kind? }`.
 * Authors and the proof's owner only. 413 naming the limit when `size` is past it. 201 with the upload's id, the part
 * size and the parts to send.
 */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  const { user } = await requireStepAccess(proofId, stepId, "files.upload");
  const input = await readBody(request, partUploadSchema, BODY_LIMITS.small);
  return Response.json({ upload: await startPartUpload(stepId, user.id, input) }, { status: 201 });
});

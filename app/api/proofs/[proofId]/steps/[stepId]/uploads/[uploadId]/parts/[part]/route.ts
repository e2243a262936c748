import { readFileBody, route } from "@/lib/http";
import { requireStepAccess } from "@/lib/access";
import { receivePart } from "@/lib/data/part-uploads";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; stepId: string; uploadId: string; part: string }> };

/**
 * Sends part `part` (numbered from 1) of the upload as the raw body. Every part but the last is exactly the part size the
 * start answered. Sending a part again replaces it (retries are harmless). 400 for a part number the upload does not have
 * or a part of the wrong length. Answers the parts received and missing.
 */
export const PUT = route(async (request: Request, { params }: Context) => {
  const p = await params;
  const { proofId, stepId, uploadId } = await routeIds(Promise.resolve({ proofId: p.proofId, stepId: p.stepId, uploadId: p.uploadId }));
  await requireStepAccess(proofId, stepId, "files.upload");
  const n = /^[0-9]{1,9}$/.test(p.part) ? Number(p.part) : NaN;
  return Response.json({ upload: await receivePart(stepId, uploadId, n, (limit) => readFileBody(request, limit)) });
});

import { route } from "@/lib/http";
import { requireStepAccess } from "@/lib/access";
import { abandonPartUpload, describePartUpload } from "@/lib/data/part-uploads";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; stepId: string; uploadId: string }> };

/** Which parts of the upload the server has and which are missing (to resume after a dropped connection). Authors and the owner. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId, uploadId } = await routeIds(params);
  await requireStepAccess(proofId, stepId, "files.upload");
  return Response.json({ upload: await describePartUpload(stepId, uploadId) });
});

/** Abandons the upload: its row and staged parts go; nothing is stored. */
export const DELETE = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId, uploadId } = await routeIds(params);
  await requireStepAccess(proofId, stepId, "files.upload");
  await abandonPartUpload(stepId, uploadId);
  return new Response(null, { status: 204 });
});

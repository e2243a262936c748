import { route } from "@/lib/http";
import { requireStepAccess } from "@/lib/access";
import { getClaimInput } from "@/lib/data/claims";
import { linkToClaim, listClaimFiles, receiveUpload } from "@/lib/data/files";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; claimId: string }> };

/** The files uploaded to this claim; any member who sees its step (a reviewer of chosen cases: within them). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, claimId } = await routeIds(params);
  const { stepId } = await getClaimInput(proofId, claimId);
  await requireStepAccess(proofId, stepId);
  return Response.json({ files: await listClaimFiles(proofId, stepId, claimId) });
});

/**
 * Uploads a file to the claim (a supporting document, a claims file, a graph list): as an upload to the claim's step
 * (`?name=`, `?kind=`, raw body; 413, 415), and linked to the claim in the same transaction. Authors and the owner.
 * Larger files: an upload in parts on the claim's step with `claimId` in the start.
 */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, claimId } = await routeIds(params);
  const { stepId } = await getClaimInput(proofId, claimId);
  const { user } = await requireStepAccess(proofId, stepId, "files.upload");
  const { file, duplicate } = await receiveUpload(request, proofId, stepId, user.id, linkToClaim(claimId));
  return Response.json({ file, duplicate }, { status: duplicate ? 200 : 201 });
});

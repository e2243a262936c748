import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { getClaim } from "@/lib/data/claims";
import { requireStepAccess } from "@/lib/data/reviews";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; claimId: string }> };

/** One claim with its verdict, certificate summary and picture; any member. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, claimId } = await routeIds(params);
  await requireProofRole(proofId);
  const claim = await getClaim(proofId, claimId);
  await requireStepAccess(proofId, claim.stepId); // a reviewer of chosen cases sees only those
  return Response.json({ claim });
});

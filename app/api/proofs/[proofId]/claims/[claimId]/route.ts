import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { getClaim, withdrawClaim } from "@/lib/data/claims";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireStepAccess } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; claimId: string }> };

/** One claim with its verdict, certificate summary and picture; any member. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, claimId } = await routeIds(params);
  await requireProofRole(proofId);
  const claim = await getClaim(proofId, claimId);
  await requireStepAccess(proofId, claim.stepId); // a reviewer of chosen cases sees only those
  return Response.json({ claim });
});

/**
 * Withdraws the claim; authors only. The claim stays in the database as history (who, when, an audit
 * event) but no longer counts anywhere: a refuted claim attached by mistake stops blocking the case.
 */
export const DELETE = route(async (_request: Request, { params }: Context) => {
  const { proofId, claimId } = await routeIds(params);
  const { user } = await requireProofRole(proofId, "author");
  return Response.json({ withdrawn: await withdrawClaim(proofId, claimId, user.id) });
});

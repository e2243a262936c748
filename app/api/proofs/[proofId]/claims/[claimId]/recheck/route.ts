import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { recheck } from "@/lib/data/claims";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; claimId: string }> };

/** Runs the claim's check again in the worker pool (202, `pending` until done); authors and editors. */
export const POST = route(async (_request: Request, { params }: Context) => {
  const { proofId, claimId } = await routeIds(params);
  const { user } = await requireProofRole(proofId, "author", "editor");
  return Response.json({ claim: await recheck(proofId, claimId, user.id) }, { status: 202 });
});

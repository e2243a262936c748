import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { cancelVerification } from "@/lib/data/claims";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; claimId: string }> };

/** Cancels a pending claim's verification job (the claim becomes `undecided`; re-check runs it again); authors and editors. */
export const POST = route(async (_request: Request, { params }: Context) => {
  const { proofId, claimId } = await routeIds(params);
  const { user } = await requireProofRole(proofId, "author", "editor");
  return Response.json({ claim: await cancelVerification(proofId, claimId, { id: user.id, name: user.name || "a member" }) });
});

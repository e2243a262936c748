import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { getClaimInput } from "@/lib/data/claims";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireStepAccess } from "@/lib/access";
import { download } from "@/lib/export/files";

type Context = { params: Promise<{ proofId: string; claimId: string }> };

/** The claim's full input as stored (cairn-claim/1 JSON), for inputs too large to show; any member who may see the step. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, claimId } = await routeIds(params);
  await requireProofRole(proofId);
  const { stepId, input } = await getClaimInput(proofId, claimId);
  await requireStepAccess(proofId, stepId);
  return download(input, "application/json; charset=utf-8", `cairn-proof-${proofId}-claim-${claimId}-input.json`);
});

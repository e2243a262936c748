import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { restoreCase } from "@/lib/data/case-edits";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; caseId: string }> };

/**
 * Restores a deleted case with everything it held; authors only. 409 when the case is not deleted,
 * or when its parent is deleted too (the answer names the case to restore first, `restoreFirst`).
 */
export const POST = route(async (_request: Request, { params }: Context) => {
  const { proofId, caseId } = await routeIds(params);
  const { user } = await requireProofRole(proofId, "author");
  await restoreCase(proofId, caseId, user.id);
  return Response.json({ ok: true });
});

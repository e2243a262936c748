import { idParam, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { loadDispute, moveDispute } from "@/lib/data/disputes";
import { disputeMoveSchema } from "@/lib/validations/review";
import { assertCanMoveDispute } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; reviewId: string }> };

async function readTarget(request: Request) {
  const clone = request.clone();
  const raw = (await clone.json().catch(() => null)) as { to?: unknown } | null;
  return raw && (raw.to === "answered" || raw.to === "withdrawn" || raw.to === "upheld") ? raw.to : null;
}

/**
 * Moves a dispute: an author marks it answered; its reviewer (or an editor) withdraws or upholds it.
 * Who may act depends on the target state, so the target is peeked at for the 403 before the full 422 check.
 */
export const POST = route(async (request: Request, { params }: Context) => {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const reviewId = idParam(p.reviewId, "This dispute");
  const { user, role } = await requireProofRole(proofId);
  const dispute = await loadDispute(proofId, reviewId);
  const target = await readTarget(request);
  if (target) await assertCanMoveDispute(dispute, { id: user.id, role }, target);
  const input = await readBody(request, disputeMoveSchema);
  return Response.json(await moveDispute(dispute, { id: user.id, role }, input.to, input.comment || undefined));
});

import { idParam, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { assertCanManageReviewers, retryInvitationMail } from "@/lib/data/invitations";

type Context = { params: Promise<{ proofId: string; invitationId: string }> };

/** Tries to send an invitation's mail again now. */
export const POST = route(async (_request: Request, { params }: Context) => {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const invitationId = idParam(p.invitationId, "This invitation");
  const { user, role } = await requireProofRole(proofId);
  await assertCanManageReviewers(proofId, user, role);
  return Response.json(await retryInvitationMail(proofId, invitationId));
});

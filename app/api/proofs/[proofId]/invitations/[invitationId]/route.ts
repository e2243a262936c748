import { idParam, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { retryInvitationMail, revokeInvitation } from "@/lib/data/invitations";
import { assertCanManageReviewers } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; invitationId: string }> };

/** The ids of the request, once its user is known to manage this proof's reviewers (editors and the owner). */
async function asManager({ params }: Context) {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const invitationId = idParam(p.invitationId, "This invitation");
  const { user, role } = await requireProofRole(proofId);
  await assertCanManageReviewers(proofId, user, role);
  return { proofId, invitationId, user };
}

/** Tries to send an invitation's mail again now. */
export const POST = route(async (_request: Request, context: Context) => {
  const { proofId, invitationId } = await asManager(context);
  return Response.json(await retryInvitationMail(proofId, invitationId));
});

/** Revokes an invitation that has not been used: its link stops working. */
export const DELETE = route(async (_request: Request, context: Context) => {
  const { proofId, invitationId, user } = await asManager(context);
  await revokeInvitation(proofId, invitationId, user.id);
  return Response.json({ ok: true });
});

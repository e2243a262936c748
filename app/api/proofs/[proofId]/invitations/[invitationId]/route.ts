import { idParam, route } from "@/lib/http";
import { invitationRole, retryInvitationMail, revokeInvitation } from "@/lib/data/invitations";
import { assertMayInvite, membershipAccess } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; invitationId: string }> };

/** The ids of the request, once its user is known to be allowed to invite in this invitation's role. */
async function asInviter({ params }: Context) {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const invitationId = idParam(p.invitationId, "This invitation");
  const m = await membershipAccess(proofId);
  assertMayInvite(m, await invitationRole(proofId, invitationId));
  return { proofId, invitationId, user: m.user };
}

/** Tries to send an invitation's mail again now. */
export const POST = route(async (_request: Request, context: Context) => {
  const { proofId, invitationId } = await asInviter(context);
  return Response.json(await retryInvitationMail(proofId, invitationId));
});

/** Revokes an invitation that has not been used: its link stops working. */
export const DELETE = route(async (_request: Request, context: Context) => {
  const { proofId, invitationId, user } = await asInviter(context);
  await revokeInvitation(proofId, invitationId, user.id);
  return Response.json({ ok: true });
});

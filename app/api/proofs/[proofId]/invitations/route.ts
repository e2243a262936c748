import { idParam, BODY_LIMITS, readBody, route } from "@/lib/http";
import { createInvitation, listInvitations } from "@/lib/data/invitations";
import { invitationSchema } from "@/lib/validations/invitation";
import { assertMayInvite, membershipAccess } from "@/lib/access";

type Context = { params: Promise<{ proofId: string }> };

/** The invitations this member may manage (the roles they may invite), with their mail status ("pending" = not sent yet, retried). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const m = await membershipAccess(proofId);
  return Response.json({ invitations: await listInvitations(proofId, m.invites) });
});

/**
 * Invites someone by e-mail: a referee (the default; the whole proof or chosen cases), a co-author
 * (`role: "author"`) or an editor. The invitation is stored even when the mail cannot go out yet.
 */
export const POST = route(async (request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const m = await membershipAccess(proofId);
  const input = await readBody(request, invitationSchema, BODY_LIMITS.small);
  assertMayInvite(m, input.role);
  const created = await createInvitation(proofId, m.user, input);
  return Response.json({ id: created.id, role: input.role, mailStatus: created.mailStatus }, { status: 201 });
});

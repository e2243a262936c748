import { idParam, BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { createInvitation, listInvitations } from "@/lib/data/invitations";
import { invitationSchema } from "@/lib/validations/invitation";
import { assertCanManageReviewers } from "@/lib/access";

type Context = { params: Promise<{ proofId: string }> };

/** The proof's invitations with their mail status ("pending" = not sent yet, retried). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user, role } = await requireProofRole(proofId);
  await assertCanManageReviewers(proofId, user, role);
  return Response.json({ invitations: await listInvitations(proofId) });
});

/** Invites a reviewer by e-mail to the whole proof or to chosen cases. The invitation is stored even when the mail cannot go out yet. */
export const POST = route(async (request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user, role } = await requireProofRole(proofId);
  await assertCanManageReviewers(proofId, user, role);
  const input = await readBody(request, invitationSchema, BODY_LIMITS.small);
  const created = await createInvitation(proofId, user, input);
  return Response.json({ id: created.id, mailStatus: created.mailStatus }, { status: 201 });
});

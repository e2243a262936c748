import { BODY_LIMITS, readBody, route } from "@/lib/http";
import { getCurrentUser } from "@/lib/session";
import { acceptInvitation, previewInvitation } from "@/lib/data/invitations";
import { acceptInvitationSchema } from "@/lib/validations/invitation";
import { notFound } from "@/lib/errors";

type Context = { params: Promise<{ token: string }> };

const tokenParam = (t: string | undefined) => {
  if (!t || !/^[A-Za-z0-9_-]{20,100}$/.test(t)) throw notFound("This invitation link");
  return t;
};

/** What an invitation link is for (the link itself is the credential; no session needed). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const token = tokenParam((await params).token);
  return Response.json({ invitation: await previewInvitation(token) });
});

/** Accepts the invitation: signed in as the invited address, or signed out with a name and password for a new account. */
export const POST = route(async (request: Request, { params }: Context) => {
  const token = tokenParam((await params).token);
  const user = await getCurrentUser();
  const input = await readBody(request, acceptInvitationSchema, BODY_LIMITS.small);
  return Response.json(await acceptInvitation(token, user, input));
});

import type { Metadata } from "next";
import Link from "next/link";
import { Wordmark } from "@/components/ui/logo";
import { getCurrentUser } from "@/lib/session";
import { previewInvitation, ROLE_WORD, type InvitationPreview } from "@/lib/data/invitations";
import { AppError } from "@/lib/errors";
import { AcceptInvitation } from "@/components/review/accept-invitation";

export const metadata: Metadata = { title: "Invitation" };

/** The link from an invitation e-mail: create an account or sign in, and join the proof in the invited role. */
export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const [user, preview] = await Promise.all([
    getCurrentUser(),
    /^[A-Za-z0-9_-]{20,100}$/.test(token) ? previewInvitation(token).catch((e) => (e instanceof AppError ? null : Promise.reject(e))) : null,
  ]);
  return (
    <main className="mx-auto max-w-md px-6 py-16">
      <Wordmark />
      <h1 className="mt-8 text-2xl font-semibold">{preview && preview.role !== "reviewer" ? "Invitation to join a proof" : "Invitation to review"}</h1>
      <InvitationBody token={token} preview={preview} user={user} />
    </main>
  );
}

function InvitationBody({ token, preview, user }: { token: string; preview: InvitationPreview | null; user: { email: string } | null }) {
  if (!preview)
    return (
      <p className="mt-4" role="alert">
        This invitation link is not valid. Check that you copied all of it, or ask the editor for a new one.
      </p>
    );
  if (preview.state !== "waiting")
    return (
      <p className="mt-4" role="alert" data-testid="invitation-closed">
        {
          {
            accepted: "This invitation link was already used.",
            expired: "This invitation link has expired.",
            revoked: "This invitation was withdrawn by the proof's editor.",
          }[preview.state]
        }{" "}
        Ask the editor for a new one if you still need to join.
      </p>
    );
  const callback = encodeURIComponent(`/invitations/${token}`);
  const intro = (
    <p className="mt-4">
      {preview.inviterName} invites <span className="font-mono">{preview.email}</span>{" "}
      {preview.role === "reviewer" ? (
        <>
          to review <strong>{preview.scope}</strong> of
        </>
      ) : (
        <>
          to join as <strong>{ROLE_WORD[preview.role]}</strong>
        </>
      )}{" "}
      “{preview.proofTitle}”.
    </p>
  );
  if (user && user.email.toLowerCase() !== preview.email.toLowerCase())
    return (
      <>
        {intro}
        <p className="mt-4" role="alert">
          You are signed in as <span className="font-mono">{user.email}</span>. Sign out and sign in as the invited address to accept.
        </p>
      </>
    );
  if (!user && preview.accountExists)
    return (
      <>
        {intro}
        <p className="mt-4">
          An account for this address exists.{" "}
          <Link className="text-lichen-700 underline" href={`/sign-in?callbackUrl=${callback}`}>
            Sign in
          </Link>{" "}
          to accept.
        </p>
      </>
    );
  return (
    <>
      {intro}
      <AcceptInvitation token={token} email={preview.email} signedIn={user !== null} roleWord={ROLE_WORD[preview.role]} />
    </>
  );
}

"use client";
/** Accepting an invitation: join as the signed-in invitee, or create the account and sign in. */
import { useState } from "react";
import { useRouter } from "next/navigation";
import { signIn } from "next-auth/react";
import { send } from "@/components/proof/api-client";
import { TextInput } from "@/components/ui/text-input";

export function AcceptInvitation({ token, email, signedIn, roleWord = "reviewer" }: { token: string; email: string; signedIn: boolean; roleWord?: string }) {
  const router = useRouter();
  const [name, setName] = useState("");
  const [password, setPassword] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const accept = async () => {
    setBusy(true);
    const res = await send<{ proofId: number }>(`/api/invitations/${token}`, "POST", signedIn ? {} : { name, password });
    if (!res.ok) {
      setBusy(false);
      return setError(res.error ?? "Not accepted.");
    }
    if (!signedIn) {
      const result = await signIn("credentials", { email, password, redirect: false });
      if (!result || result.error) {
        setBusy(false);
        return setError("Your account was created, but signing in failed; sign in with your new password.");
      }
    }
    router.push("/queue");
    router.refresh();
  };
  return (
    <form
      className="mt-6 space-y-4"
      data-testid="accept-invitation"
      onSubmit={(e) => {
        e.preventDefault();
        void accept();
      }}
    >
      {!signedIn && (
        <>
          <label className="block">
            <span className="text-sm font-semibold">Your name</span>
            <TextInput value={name} onValue={setName} autoComplete="name" className="mt-1 block w-full rounded border border-stone-300 px-3 py-2" />
          </label>
          <label className="block">
            <span className="text-sm font-semibold">Choose a password (at least 10 characters)</span>
            <TextInput
              type="password"
              value={password}
              onValue={setPassword}
              autoComplete="new-password"
              className="mt-1 block w-full rounded border border-stone-300 px-3 py-2 font-mono"
            />
          </label>
        </>
      )}
      {error && (
        <p role="alert" className="rounded border border-refuted/40 bg-red-50 px-3 py-2 text-sm text-refuted">
          {error}
        </p>
      )}
      <button type="submit" disabled={busy} className="w-full rounded bg-lichen-600 px-4 py-2 font-semibold text-white hover:bg-lichen-700 disabled:opacity-60">
        {signedIn ? `Join as ${roleWord}` : `Create account and join as ${roleWord}`}
      </button>
    </form>
  );
}

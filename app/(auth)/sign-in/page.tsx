import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { Wordmark } from "@/components/ui/logo";
import { SignInForm } from "@/components/auth/sign-in-form";
import { getCurrentUser } from "@/lib/session";

export const metadata: Metadata = { title: "Sign in" };

/** Only same-site paths may be a destination after sign-in. */
function safeCallback(value: string | string[] | undefined): string {
  const v = Array.isArray(value) ? value[0] : value;
  if (!v) return "/proofs";
  try {
    const url = new URL(v, "http://local");
    return url.origin === "http://local" ? `${url.pathname}${url.search}` : "/proofs";
  } catch {
    return "/proofs";
  }
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const query = await searchParams;
  const callbackUrl = safeCallback(query.callbackUrl);
  if (await getCurrentUser()) redirect(callbackUrl);
  return (
    <main className="mx-auto max-w-sm px-6 py-16">
      <Wordmark />
      <h1 className="mt-8 text-2xl font-semibold">Sign in</h1>
      {query.changed === "password" && (
        <p role="status" className="mt-4 rounded border border-stone-300 bg-stone-50 px-3 py-2 text-sm">
          Your password was changed and every session ended. Sign in with the new password.
        </p>
      )}
      <SignInForm callbackUrl={callbackUrl} />
    </main>
  );
}

import type { Metadata } from "next";
import { requireUser } from "@/lib/session";
import { PasswordForm } from "@/components/auth/password-form";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage() {
  const user = await requireUser();
  return (
    <main className="max-w-prose">
      <h1 className="text-3xl font-semibold">Account</h1>
      <p className="mt-2 text-stone-600">
        Signed in as <span className="font-semibold">{user.name}</span> (<span className="font-mono text-sm">{user.email}</span>).
      </p>
      <h2 className="mt-8 text-xl font-semibold">Change password</h2>
      <p className="mt-1 text-sm text-stone-600">Changing it signs you out everywhere, on this device too; then sign in with the new password.</p>
      <PasswordForm />
    </main>
  );
}

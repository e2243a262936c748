import Link from "next/link";
import { redirect } from "next/navigation";
import { Wordmark } from "@/components/ui/logo";
import { SignOutButton } from "@/components/auth/sign-out-button";
import { getCurrentUser } from "@/lib/session";

export default async function WorkspaceLayout({ children }: { children: React.ReactNode }) {
  const user = await getCurrentUser();
  if (!user) redirect("/sign-in");
  return (
    <>
      <header className="site-header border-b border-stone-200 bg-white">
        <div className="mx-auto flex max-w-6xl items-center justify-between px-6 py-3">
          <Link href="/proofs" aria-label="Cairn, your proofs">
            <Wordmark />
          </Link>
          <div className="flex items-center gap-4 text-sm">
            <span data-testid="current-user">
              {user.name} {user.role === "admin" && <span className="font-mono text-xs text-stone-500">(admin)</span>}
            </span>
            <SignOutButton />
          </div>
        </div>
      </header>
      <div className="mx-auto max-w-6xl px-6 py-8">{children}</div>
    </>
  );
}

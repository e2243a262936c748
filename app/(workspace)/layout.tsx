import Link from "next/link";
import { redirect } from "next/navigation";
import { Wordmark } from "@/components/ui/logo";
import { SignOutButton } from "@/components/auth/sign-out-button";
import { getCurrentUser } from "@/lib/session";
import { countUnread } from "@/lib/data/notifications";

export default async function WorkspaceLayout({ children }: { children: React.ReactNode }) {
  const user = await getCurrentUser();
  if (!user) redirect("/sign-in");
  const unread = await countUnread(user.id);
  return (
    <>
      <header className="site-header border-b border-stone-200 bg-white">
        <div className="mx-auto flex max-w-6xl items-center justify-between px-6 py-3">
          <Link href="/proofs" aria-label="Cairn, your proofs">
            <Wordmark />
          </Link>
          <nav className="flex items-center gap-5 text-sm" aria-label="Main">
            <Link href="/proofs" className="hover:underline">Proofs</Link>
            <Link href="/queue" className="hover:underline">Review queue</Link>
            <Link href="/notifications" className="hover:underline" data-testid="nav-notifications">
              Notifications{unread > 0 && <span className="ml-1 rounded-full bg-lichen-600 px-1.5 font-mono text-xs text-white">{unread}</span>}
            </Link>
            {user.role === "admin" && <Link href="/admin/mail" className="hover:underline">Captured mail</Link>}
          </nav>
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

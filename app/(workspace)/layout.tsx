import Link from "next/link";
import { redirect } from "next/navigation";
import { Wordmark } from "@/components/ui/logo";
import { SignOutButton } from "@/components/auth/sign-out-button";
import { SiteMenu } from "@/components/ui/site-menu";
import { getCurrentUser } from "@/lib/session";
import { countUnread } from "@/lib/data/notifications";

export default async function WorkspaceLayout({ children }: { children: React.ReactNode }) {
  const user = await getCurrentUser();
  if (!user) redirect("/sign-in");
  const unread = await countUnread(user.id);
  return (
    <>
      <header className="site-header border-b border-stone-200 bg-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-x-8 gap-y-2 px-4 py-3 sm:px-6">
          <Link href="/proofs" aria-label="Cairn, your proofs" className="shrink-0">
            <Wordmark />
          </Link>
          <SiteMenu>
            <nav className="flex flex-col gap-3 text-sm md:flex-row md:items-center md:gap-5" aria-label="Main">
              <Link href="/proofs" className="hover:underline">
                Proofs
              </Link>
              <Link href="/queue" className="hover:underline">
                Review queue
              </Link>
              <Link href="/notifications" className="hover:underline" data-testid="nav-notifications">
                Notifications
                {unread > 0 && (
                  <span className="ml-1 rounded-full bg-lichen-600 px-1.5 font-mono text-xs text-white">
                    {unread}
                    <span className="sr-only"> unread</span>
                  </span>
                )}
              </Link>
              {user.role === "admin" && (
                <Link href="/admin/mail" className="hover:underline">
                  Captured mail
                </Link>
              )}
            </nav>
            <div className="flex flex-wrap items-center gap-x-4 gap-y-2 text-sm">
              <Link href="/account" data-testid="current-user" className="break-words hover:underline" title="Your account">
                {user.name} {user.role === "admin" && <span className="font-mono text-xs text-stone-600">(admin)</span>}
              </Link>
              <SignOutButton />
            </div>
          </SiteMenu>
        </div>
      </header>
      <div className="mx-auto max-w-6xl px-4 py-6 sm:px-6 sm:py-8">{children}</div>
    </>
  );
}

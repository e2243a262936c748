import type { Metadata } from "next";
import Link from "next/link";
import { requireUser } from "@/lib/session";
import { listProofsForUser } from "@/lib/data/proofs";
import { RoleTag } from "@/components/ui/role-tag";
import { ProofStandingMark } from "@/components/review/badges";

export const metadata: Metadata = { title: "Your proofs" };

export default async function ProofsPage() {
  const user = await requireUser();
  const proofs = await listProofsForUser(user.id);
  return (
    <main>
      <div className="flex items-center justify-between gap-4">
        <h1 className="text-3xl font-semibold">Your proofs</h1>
        <Link href="/proofs/new" className="rounded bg-lichen-600 px-4 py-2 font-semibold text-white hover:bg-lichen-700">
          Start a proof
        </Link>
      </div>
      {proofs.length === 0 ? (
        <p className="mt-6 text-stone-600">
          You are not a member of any proof yet. Start a proof of your own, or ask a proof’s editor to invite you as a referee (the invitation comes by e-mail).
        </p>
      ) : (
        <ul className="mt-6 divide-y divide-stone-200 rounded border border-stone-200 bg-white" data-testid="proof-list">
          {proofs.map((p) => (
            <li key={p.id} className="flex items-center justify-between gap-4 px-5 py-4">
              <div>
                <Link href={`/proofs/${p.id}`} className="text-lg font-semibold text-lichen-700 hover:underline">
                  {p.title}
                </Link>
                <p className="mt-1 flex flex-wrap items-baseline gap-x-3 gap-y-1 text-sm" data-testid="proof-standing" data-stage={p.standing.stage}>
                  <ProofStandingMark standing={p.standing} />
                  <span className={p.openDisputes > 0 ? "text-undecided" : "text-stone-500"} data-open-disputes={p.openDisputes}>
                    {p.openDisputes === 0 ? "no open dispute" : `⚑ ${p.openDisputes} open dispute${p.openDisputes === 1 ? "" : "s"}`}
                  </span>
                </p>
                <p className="font-mono text-xs text-stone-500">
                  {p.caseCount} cases · {p.memberCount} members · updated {p.updatedAt.slice(0, 10)}
                </p>
              </div>
              <RoleTag role={p.role} />
            </li>
          ))}
        </ul>
      )}
    </main>
  );
}

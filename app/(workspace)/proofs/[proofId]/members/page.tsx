import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { getProofSummary } from "@/lib/data/proofs";
import { listInvitations } from "@/lib/data/invitations";
import { getReadiness, getReviewerProgress } from "@/lib/data/review-queues";
import { deliverAfterCommit } from "@/lib/mail/outbox";
import { RoleTag } from "@/components/ui/role-tag";
import { InviteForm } from "@/components/review/invite-form";
import { InvitationList } from "@/components/review/invitation-list";
import { RequiredApprovalsForm } from "@/components/review/required-vouches-form";
import { ReadinessRollup } from "@/components/review/readiness-rollup";
import { VerdictCaution } from "@/components/ui/caution";
import { QueueTable } from "@/components/review/queue-table";
import { ActionButton } from "@/components/review/action-button";
import { pageAccess } from "@/app/(workspace)/page-access";
import { may } from "@/lib/access";

export const metadata: Metadata = { title: "Members and reviewers" };

export default async function MembersPage({ params }: { params: Promise<{ proofId: string }> }) {
  const { proofId, standing, visible, user, role } = await pageAccess((await params).proofId);
  const manages = may(standing, "reviewers.manage");
  if (manages) await deliverAfterCommit(); // messages whose retry is due go out now
  const [proof, readiness, progress, invitations] = await Promise.all([
    getProofSummary(proofId, { id: user.id, role }),
    getReadiness(proofId, visible), // a reviewer of chosen cases sees the readiness of those cases only
    getReviewerProgress([proofId]),
    manages ? listInvitations(proofId) : Promise.resolve([]),
  ]);
  if (!proof) notFound();
  const scopeOf = new Map(progress.map((r) => [r.reviewerId, r.scope]));
  return (
    <main className="space-y-10">
      <div>
        <Link href={`/proofs/${proofId}`} className="text-sm text-lichen-700 underline">← {proof.title}</Link>
        <h1 className="mt-2 text-3xl font-semibold">Members and reviewers</h1>
      </div>
      <section className="space-y-2">
        <h2 className="text-xl font-semibold">Members</h2>
        <ul className="divide-y divide-stone-100 rounded border border-stone-200 bg-white" data-testid="members">
          {proof.members.map((m) => (
            <li key={m.userId} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
              <span>
                {m.name} <span className="break-all font-mono text-xs text-stone-600">{m.email}</span>
              </span>
              <span className="flex items-center gap-2 text-sm">
                {m.role === "reviewer" && <span className="text-stone-600">{scopeOf.get(m.userId)}</span>}
                {manages && m.role === "reviewer" && scopeOf.get(m.userId) !== "whole proof" && (
                  <ActionButton url={`/api/proofs/${proofId}/settings/scopes/${m.userId}`} method="DELETE" label="Share the whole proof" />
                )}
                <RoleTag role={m.role} />
              </span>
            </li>
          ))}
        </ul>
      </section>
      {manages && (
        <>
          <section className="space-y-3">
            <h2 className="text-xl font-semibold">Invite a reviewer</h2>
            <InviteForm proofId={proofId} cases={readiness.cases.map((c) => ({ id: c.id, number: c.number, title: c.title }))} />
            <InvitationList proofId={proofId} invitations={invitations} />
          </section>
          <section className="space-y-3">
            <h2 className="text-xl font-semibold">Reviewers’ progress</h2>
            <QueueTable kind="progress" rows={progress} empty="No reviewer yet." testId="progress" />
            <RequiredApprovalsForm proofId={proofId} current={readiness.requiredApprovals} />
          </section>
        </>
      )}
      <ReadinessRollup readiness={readiness} />
      <VerdictCaution />
    </main>
  );
}

import type { Metadata } from "next";
import Link from "next/link";
import { ProofPageHeading } from "@/components/proof/proof-page-heading";
import { notFound } from "next/navigation";
import { getProofSummary } from "@/lib/data/proofs";
import { isBlind } from "@/lib/data/blind";
import { listInvitations } from "@/lib/data/invitations";
import { getReadiness, getReviewerProgress } from "@/lib/data/review-queues";
import { deliverAfterCommit } from "@/lib/mail/outbox";
import { MemberList, type MemberRow } from "@/components/review/member-list";
import { InviteForm } from "@/components/review/invite-form";
import { InvitationList } from "@/components/review/invitation-list";
import { RequiredApprovalsForm } from "@/components/review/required-vouches-form";
import { ReadinessRollup } from "@/components/review/readiness-rollup";
import { VerdictCaution } from "@/components/ui/caution";
import { QueueTable } from "@/components/review/queue-table";
import { pageAccess } from "@/app/(workspace)/page-access";
import { invitationRefusal, may, mayOwn, removalRefusal } from "@/lib/access";

export const metadata: Metadata = { title: "Members and reviewers" };

export default async function MembersPage({ params }: { params: Promise<{ proofId: string }> }) {
  const { proofId, standing, visible, user, role } = await pageAccess((await params).proofId);
  const proof = await getProofSummary(proofId, { id: user.id, role });
  if (!proof) notFound();
  const blind = await isBlind(proofId);
  const manages = may(standing, "reviewers.manage") && invitationRefusal(standing, "reviewer", blind) === null;
  const invites = (["reviewer", "author", "editor"] as const).filter((r) => invitationRefusal(standing, r, blind) === null);
  if (invites.length) await deliverAfterCommit(); // messages whose retry is due go out now
  const [readiness, progress, invitations] = await Promise.all([
    getReadiness(proofId, visible), // a reviewer of chosen cases sees the readiness of those cases only
    getReviewerProgress([proofId]),
    listInvitations(proofId, invites),
  ]);
  const scopeOf = new Map(progress.map((r) => [r.reviewerId, r.scope]));
  const rows: MemberRow[] = proof.members.map((m) => {
    const real = m.userId > 0; // a blind referee is shown without an id (userId −k): nothing to act on
    const owner = m.userId === proof.ownerId;
    return {
      ...m,
      owner,
      self: m.userId === user.id,
      scope: m.role === "reviewer" && real ? scopeOf.get(m.userId) : undefined,
      mayRemove: real && !owner && removalRefusal(standing, user.id, m, blind) === null,
      mayMakeOwner: real && !owner && may(standing, "ownership.transfer") && mayOwn(m.role),
      mayShare: manages && real && m.role === "reviewer" && scopeOf.get(m.userId) !== "whole proof",
    };
  });
  return (
    <main className="space-y-10">
      <ProofPageHeading proofId={proofId} proofTitle={proof.title} title="Members and reviewers" />
      <section className="space-y-2">
        <h2 className="text-xl font-semibold">Members</h2>
        <MemberList proofId={proofId} members={rows} />
      </section>
      {invites.length > 0 && (
        <section className="space-y-3">
          <h2 className="text-xl font-semibold">Invite {invites.length === 1 && invites[0] === "author" ? "a co-author" : "someone"}</h2>
          <InviteForm proofId={proofId} roles={[...invites]} cases={readiness.cases.map((c) => ({ id: c.id, number: c.number, title: c.title }))} />
          <InvitationList proofId={proofId} invitations={invitations} />
        </section>
      )}
      {manages && (
        <>
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

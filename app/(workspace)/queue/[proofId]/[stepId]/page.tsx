import type { Metadata } from "next";
import Link from "next/link";
import { describeStep } from "@/lib/data/review-panel";
import { getReadiness } from "@/lib/data/review-queues";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { VerdictCaution } from "@/components/ui/caution";
import { StepReviewSlot } from "@/components/review/step-review-slot";
import { CaseStateBadge } from "@/components/proof/case-state-badge";
import { ClaimList } from "@/components/claims/claim-list";
import { may } from "@/lib/access";
import { openStepPage, stepClaimLists, type StepPageProps } from "@/app/(workspace)/step-page";
import { RevisionHistory } from "@/components/editor/revision-history";

export const metadata: Metadata = { title: "Review a step" };

/**
 * One step to review, reached from the queue, reader first: the argument and its claims, with the review
 * panel beside them on a wide screen (below them on a phone).
 */
export default async function QueueStepPage(props: StepPageProps) {
  const { access: viewer, ref: step, step: detail, compare } = await openStepPage(props);
  const access = { user: viewer.user, role: viewer.role, step };
  const proofId = viewer.proofId;
  const [info, readiness, claimLists] = await Promise.all([describeStep(step), getReadiness(viewer.proofId, viewer.visible), stepClaimLists(step.id)]);
  const { revisions } = detail;
  const caseState = readiness.cases.find((c) => c.id === access.step.caseId)?.state;
  return (
    <main className="space-y-4">
      <p className="text-sm">
        <Link href="/queue" className="text-lichen-700 underline">
          ← Review queue
        </Link>{" "}
        ·{" "}
        <Link href={`/proofs/${proofId}`} className="text-lichen-700 underline">
          {info.proofTitle}
        </Link>
      </p>
      <h1 className="text-2xl font-semibold">
        <span className="mr-2 font-mono text-lichen-700">Step {info.stepLabel}</span>
      </h1>
      <p className="flex flex-wrap items-center gap-2" data-testid="case-state">
        Case {info.caseNumber}: {info.caseTitle} {caseState && <CaseStateBadge state={caseState} />}
      </p>
      <div className="lg:grid lg:grid-cols-[minmax(0,1fr)_24rem] lg:gap-6">
        <div className="min-w-0 space-y-4">
          {info.revision ? (
            <article className="max-w-prose rounded border border-stone-200 bg-white p-4" data-testid="step-body">
              <p className="font-mono text-xs text-stone-500">
                revision {info.revision.number} by {info.revision.authorName}
              </p>
              <MathMarkdown source={info.revision.body} />
            </article>
          ) : (
            <p className="italic text-stone-500">This step has no revision yet.</p>
          )}
          <ClaimList proofId={proofId} stepId={step.id} initial={claimLists} canRecheck={may(viewer.standing, "claims.recheck")} canWithdraw={false} />
          <VerdictCaution />
        </div>
        <div className="min-w-0 lg:sticky lg:top-4 lg:self-start">
          <StepReviewSlot proofId={proofId} stepId={step.id} revisionId={info.revision?.id ?? null} viewer={{ id: access.user.id, role: access.role }} />
        </div>
      </div>
      <RevisionHistory key={compare ? `${compare.from}..${compare.to}` : "latest"} proofId={proofId} stepId={step.id} revisions={revisions} initial={compare} />
    </main>
  );
}

import type { Metadata } from "next";
import Link from "next/link";
import { describeStep } from "@/lib/data/review-panel";
import { getReadiness } from "@/lib/data/review-queues";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { VerdictCaution } from "@/components/ui/caution";
import { StepReviewSlot } from "@/components/review/step-review-slot";
import { CaseStateBadge } from "@/components/proof/case-state-badge";
import { stepPageAccess } from "@/app/(workspace)/page-access";
import { ClaimList } from "@/components/claims/claim-list";
import { listStepClaims, listWithdrawnClaims } from "@/lib/data/claims";
import { verificationNotice } from "@/lib/data/claim-jobs";
import { may } from "@/lib/access";
import { getStep } from "@/lib/data/steps";
import { RevisionHistory } from "@/components/editor/revision-history";
import { parseCompare } from "@/lib/review/compare-link";

export const metadata: Metadata = { title: "Review a step" };

/**
 * One step to review, reached from the queue, reader first: the argument and its claims, with the review
 * panel beside them on a wide screen (below them on a phone).
 */
export default async function QueueStepPage({
  params,
  searchParams,
}: {
  params: Promise<{ proofId: string; stepId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const p = await params;
  const { access: viewer, step } = await stepPageAccess(p.proofId, p.stepId);
  const access = { user: viewer.user, role: viewer.role, step };
  const proofId = viewer.proofId;
  const [info, readiness, claims, withdrawn] = await Promise.all([
    describeStep(step),
    getReadiness(viewer.proofId, viewer.visible),
    listStepClaims(step.id),
    listWithdrawnClaims(step.id),
  ]);
  const { revisions } = await getStep(proofId, step.id);
  const verification = await verificationNotice(claims);
  // A superseded vouch's notice opens the page with the vouched revision compared to the latest.
  const compare = parseCompare((await searchParams).compare, revisions[0]?.number ?? 0);
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
          <ClaimList
            proofId={proofId}
            stepId={step.id}
            initial={{ claims, withdrawn, verification }}
            canRecheck={may(viewer.standing, "claims.recheck")}
            canWithdraw={false}
          />
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

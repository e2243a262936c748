import type { Metadata } from "next";
import Link from "next/link";
import { getProofSummary } from "@/lib/data/proofs";
import { proofReferences } from "@/lib/data/cases";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { StepEditor } from "@/components/editor/step-editor";
import { RevisionHistory } from "@/components/editor/revision-history";
import { ClaimList } from "@/components/claims/claim-list";
import { ClaimForm } from "@/components/claims/claim-form";
import { ClaimFileForm } from "@/components/claims/claim-file-form";
import { VerdictCaution } from "@/components/ui/caution";
import { StepReviewSlot } from "@/components/review/step-review-slot";
import { may } from "@/lib/access";
import { openStepPage, stepClaimLists, type StepPageProps } from "@/app/(workspace)/step-page";
import { listStepFiles } from "@/lib/data/files";
import { FileList } from "@/components/files/file-list";
import { FileUpload } from "@/components/files/file-upload";
import { readEnv } from "@/lib/env";
import { BatchForm } from "@/components/batches/batch-form";
import { BatchList } from "@/components/batches/batch-list";

export const metadata: Metadata = { title: "Step" };

export default async function StepPage(props: StepPageProps) {
  // A reviewer invited to chosen cases sees only their steps; a step under a deleted case is gone.
  const { access, step, compare } = await openStepPage(props);
  const { proofId, user, role, standing } = access;
  const [proof, claimLists, files] = await Promise.all([
    getProofSummary(proofId, { id: user.id, role }),
    stepClaimLists(step.id),
    listStepFiles(proofId, step.id),
  ]);
  const isAuthor = may(standing, "steps.write");
  const references = isAuthor ? await proofReferences(proofId) : [];
  return (
    <main>
      <nav className="text-sm text-stone-600">
        <Link href={`/proofs/${proofId}`} className="text-lichen-700 hover:underline">
          {proof?.title}
        </Link>{" "}
        › <a href={`/proofs/${proofId}#case-${step.caseNumber}`}>Case {step.caseNumber}</a>
      </nav>
      <h1 className="mt-2 text-2xl font-semibold">
        <span className="mr-2 font-mono text-lichen-700">Step {step.number}</span>
        <span className="text-stone-700">in “{step.caseTitle}”</span>
      </h1>
      {step.latest && (
        <p className="font-mono text-xs text-stone-500">
          revision {step.latest.number} by {step.latest.authorName}
        </p>
      )}
      {/* Reader first: the argument and its claims, with the review beside them; the author's tools below. */}
      <div className="mt-3 lg:grid lg:grid-cols-[minmax(0,1fr)_24rem] lg:gap-6">
        <div className="min-w-0">
          {step.latest && <MathMarkdown source={step.latest.body} className="max-w-prose rounded border border-stone-200 bg-white p-4 text-lg" />}
          <ClaimList
            proofId={proofId}
            stepId={step.id}
            initial={claimLists}
            canRecheck={may(standing, "claims.recheck")}
            canWithdraw={isAuthor}
            uploadPartSize={may(standing, "files.upload") ? readEnv().CAIRN_UPLOAD_PART_BYTES : undefined}
          />
          <div className="mt-4">
            <VerdictCaution />
          </div>
        </div>
        <div className="min-w-0 lg:sticky lg:top-4 lg:self-start">
          <StepReviewSlot proofId={proofId} stepId={step.id} revisionId={step.latest?.id ?? null} viewer={{ id: user.id, role }} />
        </div>
      </div>
      {isAuthor && step.latest && (
        <details className="mt-8" data-testid="step-edit">
          <summary className="cursor-pointer font-semibold text-lichen-700">Edit the text (makes revision {step.latest.number + 1})</summary>
          <StepEditor key={step.id} proofId={proofId} stepId={step.id} latest={step.latest} references={references} />
        </details>
      )}
      {isAuthor && <ClaimForm proofId={proofId} stepId={step.id} />}
      {isAuthor && (
        <details className="mt-3">
          <summary className="cursor-pointer text-sm text-lichen-700">Attach several claims at once from a claims file</summary>
          <ClaimFileForm proofId={proofId} stepId={step.id} />
        </details>
      )}
      <FileList proofId={proofId} stepId={step.id} initial={files} canAttach={may(standing, "files.upload")} />
      {may(standing, "files.upload") && <FileUpload proofId={proofId} stepId={step.id} partSize={readEnv().CAIRN_UPLOAD_PART_BYTES} />}
      <BatchList proofId={proofId} stepId={step.id} canCancel={isAuthor} />
      {may(standing, "claims.write") && <BatchForm proofId={proofId} stepId={step.id} />}
      <RevisionHistory
        key={compare ? `${compare.from}..${compare.to}` : "latest"}
        proofId={proofId}
        stepId={step.id}
        revisions={step.revisions}
        initial={compare}
      />
    </main>
  );
}

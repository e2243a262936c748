"use client";
/**
 * The review panel under a step (rendered by the workspace under each step, and by the queue's step view):
 * verdicts at the current revision, approvals on older revisions marked "needs re-review", disputes with
 * their states, transitions and threads, and the step's comments with replies.
 */
import { useState } from "react";
import useSWR from "swr";
import { useRouter } from "next/navigation";
import type { StepReviewView } from "@/lib/data/review-panel";
import { ApprovalBadge } from "./badges";
import { CommentBox, CommentThread } from "./comment-thread";
import { DisputeCard } from "./dispute-card";
import { send } from "./send";

export interface StepReviewSlotProps {
  proofId: number;
  stepId: number;
  revisionId: number | null;
  viewer: { id: number; role: "author" | "reviewer" | "editor" };
}

const fetcher = async (url: string): Promise<StepReviewView> => {
  const res = await fetch(url);
  const body = await res.json();
  if (!res.ok) throw new Error(body?.error?.message ?? `The server answered ${res.status}.`);
  return body.review;
};

export function StepReviewSlot({ proofId, stepId, revisionId }: StepReviewSlotProps) {
  const base = `/api/proofs/${proofId}/steps/${stepId}`;
  const router = useRouter();
  const { data, error, mutate } = useSWR(`${base}/reviews`, fetcher);
  const [disputing, setDisputing] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const changed = () => {
    void mutate();
    router.refresh();
  };
  if (error) return <p className="mt-2 text-sm text-stone-500">Review panel unavailable: {(error as Error).message}</p>;
  if (!data) return <p className="mt-2 text-sm text-stone-500">Loading the review…</p>;

  const at = revisionId ?? data.latestRevision?.id;
  const viewingOld = revisionId !== null && data.latestRevision !== null && revisionId !== data.latestRevision.id;
  const verdict = async (kind: "approve" | "dispute", comment?: string) => {
    const res = await send(`${base}/reviews`, "POST", { revisionId: at, verdict: kind, comment });
    setMessage(res.ok ? null : (res.error ?? "Not recorded."));
    if (res.ok) changed();
    return res.ok ? null : (res.error ?? "Not recorded.");
  };

  return (
    <section className="mt-3 space-y-3 rounded border border-stone-200 bg-stone-50/60 p-3" aria-label="Review of this step" data-testid="step-review" data-step-id={stepId}>
      <header className="flex flex-wrap items-center gap-3 text-sm">
        <strong>Review</strong>
        <span className="font-mono" data-testid="approval-count">
          {data.status.approvals}/{data.requiredApprovals} approval{data.requiredApprovals === 1 ? "" : "s"} at revision {data.latestRevision?.number ?? "—"}
        </span>
        {data.status.staleApprovals > 0 && <span className="font-mono text-undecided">↻ {data.status.staleApprovals} needs re-review</span>}
        {data.status.openDisputes > 0 && <span className="font-mono text-refuted">⚑ {data.status.openDisputes} unresolved dispute{data.status.openDisputes === 1 ? "" : "s"}</span>}
      </header>

      {data.approvals.length > 0 && (
        <ul className="space-y-1 text-sm">
          {data.approvals.map((a) => (
            <li key={a.id} className="flex items-center gap-2" data-testid="approval">
              <ApprovalBadge stale={a.stale} />
              {a.reviewerName}, on revision {a.revisionNumber}
            </li>
          ))}
        </ul>
      )}

      {viewingOld && <p className="text-sm text-undecided">You are looking at an older revision; verdicts are given on revision {data.latestRevision!.number}.</p>}
      {data.can.verdict && data.can.ownDisputeOpen && (
        <p className="text-sm text-stone-600" data-testid="verdict-waits">
          Your dispute on this step is not closed yet: close it below before approving.
        </p>
      )}
      {data.can.verdict && !data.can.ownDisputeOpen && (
        <div className="space-y-2">
          <div className="flex flex-wrap gap-2">
            <button type="button" onClick={() => verdict("approve")} className="rounded bg-lichen-600 px-3 py-1 text-sm font-semibold text-white hover:bg-lichen-700">
              ✓ Approve revision {data.latestRevision?.number}
            </button>
            <button type="button" onClick={() => setDisputing((d) => !d)} className="rounded border border-refuted/50 bg-white px-3 py-1 text-sm text-refuted hover:bg-red-50">
              ⚑ Dispute…
            </button>
          </div>
          {disputing && (
            <CommentBox
              label="What is wrong? (required for a dispute)"
              testId="dispute-form"
              onSubmit={async (body) => {
                const failure = await verdict("dispute", body);
                if (!failure) setDisputing(false);
                return failure;
              }}
            />
          )}
        </div>
      )}
      {!data.can.verdict && data.can.verdictRefusal?.startsWith("You wrote") && <p className="text-xs text-stone-500">{data.can.verdictRefusal}</p>}
      {message && (
        <p role="alert" className="text-sm text-refuted">
          {message}
        </p>
      )}

      {data.disputes.map((d) => (
        <DisputeCard key={d.id} dispute={d} proofId={proofId} commentsUrl={`${base}/comments`} onChange={changed} />
      ))}

      <details open={data.comments.length > 0}>
        <summary className="cursor-pointer text-sm font-semibold">Comments ({data.comments.length})</summary>
        <div className="mt-2">
          <CommentThread nodes={data.comments} commentsUrl={`${base}/comments`} onChange={changed} />
          <CommentBox
            label="Comment on this step"
            onSubmit={async (body) => {
              const res = await send(`${base}/comments`, "POST", { body });
              if (!res.ok) return res.error ?? "Not posted.";
              changed();
              return null;
            }}
          />
        </div>
      </details>
    </section>
  );
}

"use client";
/**
 * The review panel under a step (rendered by the workspace under each step, and by the queue's step view):
 * verdicts at the current revision, vouches on older revisions marked superseded, disputes with
 * their states, transitions and threads, and the step's comments with replies.
 */
import { useState } from "react";
import useSWR from "swr";
import Link from "next/link";
import { usePathname, useRouter } from "next/navigation";
import { compareQuery } from "@/lib/review/compare-link";
import type { StepReviewView } from "@/lib/data/review-panel";
import { VouchBadge } from "./badges";
import { CommentBox, CommentThread } from "./comment-thread";
import { DisputeCard } from "./dispute-card";
import { apiFetch, send } from "@/components/proof/api-client";

export interface StepReviewSlotProps {
  proofId: number;
  stepId: number;
  revisionId: number | null;
  viewer: { id: number; role: "author" | "reviewer" | "editor" };
}

const fetcher = async (url: string): Promise<StepReviewView> => (await apiFetch<{ review: StepReviewView }>(url)).review;

export function StepReviewSlot({ proofId, stepId, revisionId, viewer }: StepReviewSlotProps) {
  const base = `/api/proofs/${proofId}/steps/${stepId}`;
  const router = useRouter();
  const pathname = usePathname();
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
  // The viewer's own vouch on an older revision (its id is the viewer's own even on a blind proof).
  const mineSuperseded = data.mine.vouchedAt ? undefined : data.vouches.find((v) => v.stale && v.reviewerId === viewer.id);
  const viewingOld = revisionId !== null && data.latestRevision !== null && revisionId !== data.latestRevision.id;
  const verdict = async (kind: "vouch" | "dispute", comment?: string) => {
    // A vouch names the digest of what the referee read: a claim change meanwhile makes the server refuse it.
    const digest = kind === "vouch" && data.latestRevision && at === data.latestRevision.id ? data.latestRevision.digest : undefined;
    const res = await send(`${base}/reviews`, "POST", { revisionId: at, verdict: kind, comment, digest });
    setMessage(res.ok ? null : (res.error ?? "Not recorded."));
    if (res.ok) changed();
    return res.ok ? null : (res.error ?? "Not recorded.");
  };

  return (
    <section
      className="mt-3 space-y-3 rounded border border-stone-200 bg-stone-50/60 p-3"
      id="review"
      aria-label="Review of this step"
      data-testid="step-review"
      data-step-id={stepId}
    >
      <header className="flex flex-wrap items-center gap-3 text-sm">
        <strong>Review</strong>
        <span data-testid="approval-count">
          {data.status.vouches} of {data.requiredApprovals} vouch{data.requiredApprovals === 1 ? "" : "es"} needed for revision{" "}
          {data.latestRevision?.number ?? "—"}
        </span>
        {data.status.supersededVouches > 0 && <span className="text-undecided">{data.status.supersededVouches} superseded</span>}
        {data.status.openDisputes > 0 && (
          <span className="font-mono text-refuted">
            ⚑ {data.status.openDisputes} unresolved dispute{data.status.openDisputes === 1 ? "" : "s"}
          </span>
        )}
      </header>

      {data.vouches.length > 0 && (
        <ul className="space-y-1 text-sm">
          {data.vouches.map((a) => (
            <li key={a.id} className="flex flex-wrap items-baseline gap-x-2" data-testid="approval">
              <VouchBadge stale={a.stale} />
              {a.reviewerName} vouched for revision {a.revisionNumber}
              {a.stale && data.latestRevision && (
                <Link href={`${pathname}${compareQuery(a.revisionNumber, data.latestRevision.number)}`} className="text-lichen-700 underline">
                  compare revision {a.revisionNumber} with {data.latestRevision.number}
                </Link>
              )}
            </li>
          ))}
        </ul>
      )}

      {mineSuperseded && data.latestRevision && (
        <p className="rounded border border-undecided/40 bg-amber-50 p-2 text-sm" data-testid="vouch-superseded-notice">
          Your vouch for revision {mineSuperseded.revisionNumber} is superseded: revision {data.latestRevision.number} changed what it covers, so it no longer
          counts.{" "}
          <Link href={`${pathname}${compareQuery(mineSuperseded.revisionNumber, data.latestRevision.number)}`} className="text-lichen-700 underline">
            Compare revision {mineSuperseded.revisionNumber} with revision {data.latestRevision.number}
          </Link>{" "}
          and vouch again if it still holds.
        </p>
      )}
      {viewingOld && (
        <p className="text-sm text-undecided">You are looking at an older revision; verdicts are given on revision {data.latestRevision!.number}.</p>
      )}
      {data.can.verdict && data.can.ownDisputeOpen && (
        <p className="text-sm text-stone-600" data-testid="verdict-waits">
          Your dispute on this step is still open: withdraw it below (if you are satisfied) before vouching.
        </p>
      )}
      {data.can.verdict && data.mine.vouchedAt && !viewingOld && (
        <p className="text-sm" data-testid="already-vouched">
          You vouched for revision {data.latestRevision?.number} on {new Date(data.mine.vouchedAt).toLocaleDateString()}. Your vouch covers its text and its{" "}
          {""}
          claims as they stand; any change makes a new revision and asks you again.
        </p>
      )}
      {data.can.verdict && !data.mine.vouchedAt && data.latestRevision && data.latestRevision.pendingClaims > 0 && (
        <p className="text-sm text-stone-600" data-testid="vouch-waits">
          {data.latestRevision.pendingClaims} claim{data.latestRevision.pendingClaims === 1 ? " is" : "s are"} still being checked; a vouch covers the verdicts
          too, so it waits for them.
        </p>
      )}
      {data.can.verdict && !data.can.ownDisputeOpen && !data.mine.vouchedAt && (
        <div className="space-y-2">
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              disabled={(data.latestRevision?.pendingClaims ?? 0) > 0}
              onClick={() => verdict("vouch")}
              className="rounded border border-stone-400 bg-white px-3 py-1 text-sm hover:border-lichen-600 disabled:opacity-50"
            >
              I vouch for revision {data.latestRevision?.number}
            </button>
            <button
              type="button"
              onClick={() => setDisputing((d) => !d)}
              className="rounded border border-stone-400 bg-white px-3 py-1 text-sm hover:border-stone-600"
            >
              I raise a dispute…
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

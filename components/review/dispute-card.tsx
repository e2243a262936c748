"use client";
/** One dispute: its state, its recorded transitions, its own thread, and the moves this viewer may make. */
import { useState } from "react";
import type { StepReviewView } from "@/lib/data/review-panel";
import { DisputeStateBadge } from "./badges";
import { CommentBox, CommentThread } from "./comment-thread";
import { send } from "@/components/proof/api-client";

type Dispute = StepReviewView["disputes"][number];
const when = (at: string) => new Date(at).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });

export function DisputeCard({ dispute, proofId, commentsUrl, onChange }: { dispute: Dispute; proofId: number; commentsUrl: string; onChange: () => void }) {
  const [note, setNote] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const moves = [
    dispute.can.answer && { to: "answered", label: "Mark answered" },
    dispute.can.withdraw && { to: "withdrawn", label: "Withdraw: I am satisfied" },
    dispute.can.uphold && { to: "upheld", label: "Uphold: not yet answered" },
  ].filter(Boolean) as Array<{ to: string; label: string }>;

  const moveTo = async (to: string) => {
    setBusy(true);
    const res = await send(`/api/proofs/${proofId}/disputes/${dispute.id}`, "POST", { to, comment: note.trim() || undefined });
    setBusy(false);
    setError(res.ok ? null : (res.error ?? "Not changed."));
    if (res.ok) {
      setNote("");
      onChange();
    }
  };

  return (
    <article
      id={`dispute-${dispute.id}`}
      className="scroll-mt-4 rounded border border-stone-300 bg-stone-50 p-3"
      data-testid="dispute"
      data-dispute-id={dispute.id}
    >
      <header className="flex flex-wrap items-center gap-2">
        <DisputeStateBadge state={dispute.state} />
        <span className="text-sm">
          Dispute by <strong>{dispute.reviewerName}</strong> on revision {dispute.revisionNumber}
        </span>
      </header>
      <ol className="mt-2 space-y-0.5 font-mono text-xs text-stone-600" aria-label="Transitions">
        {dispute.transitions.map((t, i) => (
          <li key={i}>
            {t.from ?? "·"} → {t.to} by {t.actorName}, {when(t.at)}
          </li>
        ))}
      </ol>
      <div className="mt-3">
        <CommentThread nodes={dispute.thread} commentsUrl={commentsUrl} reviewId={dispute.id} onChange={onChange} />
        <CommentBox
          label="Add to this dispute's thread"
          onSubmit={async (body) => {
            const res = await send(commentsUrl, "POST", { body, reviewId: dispute.id });
            if (!res.ok) return res.error ?? "Not posted.";
            onChange();
            return null;
          }}
        />
      </div>
      {moves.length > 0 && (
        <div className="mt-3 space-y-2 border-t border-stone-200 pt-3">
          <label className="block text-xs font-semibold text-stone-600">
            Note with the change (optional)
            <textarea
              value={note}
              onChange={(e) => setNote(e.target.value)}
              rows={2}
              className="mt-1 block w-full rounded border border-stone-300 bg-white px-2 py-1 font-mono text-sm"
            />
          </label>
          <div className="flex flex-wrap gap-2">
            {moves.map((m) => (
              <button
                key={m.to}
                type="button"
                disabled={busy}
                onClick={() => moveTo(m.to)}
                className="rounded bg-lichen-600 px-3 py-1 text-sm font-semibold text-white hover:bg-lichen-700 disabled:opacity-60"
              >
                {m.label}
              </button>
            ))}
          </div>
        </div>
      )}
      {error && (
        <p role="alert" className="mt-2 text-sm text-refuted">
          {error}
        </p>
      )}
    </article>
  );
}

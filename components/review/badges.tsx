/** States of the review workflow, always as a glyph and a word (never colour alone). Case states: components/proof/case-state-badge.tsx. */
import type { DisputeState, ProofState } from "@/lib/review/states";

function Badge({ glyph, word, className, data }: { glyph: string; word: string; className: string; data: Record<string, string> }) {
  return (
    <span className={`inline-flex shrink-0 items-center gap-1 rounded border bg-white px-2 py-0.5 font-mono text-xs ${className}`} {...data}>
      <span aria-hidden="true">{glyph}</span>
      {word}
    </span>
  );
}

const disputeLook: Record<DisputeState, { glyph: string; className: string }> = {
  open: { glyph: "⚑", className: "border-refuted/50 text-refuted" },
  reopened: { glyph: "⚑", className: "border-refuted/50 text-refuted" },
  answered: { glyph: "↩", className: "border-undecided/50 text-undecided" },
  closed: { glyph: "■", className: "border-stone-300 text-stone-600" },
};

export function DisputeStateBadge({ state }: { state: DisputeState }) {
  return <Badge {...disputeLook[state]} word={state} data={{ "data-dispute-state": state }} />;
}

export function ProofStateBadge({ state }: { state: ProofState }) {
  const ready = state === "ready to certify";
  return (
    <Badge glyph={ready ? "●" : "…"} word={state} className={`text-sm ${ready ? "border-verified/50 text-verified" : "border-stone-300 text-stone-700"}`} data={{ "data-proof-state": state }} />
  );
}

/** An approval, current or stale ("needs re-review"). */
export function ApprovalBadge({ stale }: { stale: boolean }) {
  return stale ? (
    <Badge glyph="↻" word="needs re-review" className="border-undecided/50 text-undecided" data={{ "data-approval": "stale" }} />
  ) : (
    <Badge glyph="✓" word="approved" className="border-verified/50 text-verified" data={{ "data-approval": "current" }} />
  );
}

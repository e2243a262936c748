/** States of the review workflow, always as a glyph and a word (never colour alone). */
import type { CaseState, DisputeState, ProofState } from "@/lib/review/states";

const disputeLook: Record<DisputeState, { glyph: string; cls: string }> = {
  open: { glyph: "⚑", cls: "border-refuted/50 text-refuted" },
  reopened: { glyph: "⚑", cls: "border-refuted/50 text-refuted" },
  answered: { glyph: "↩", cls: "border-undecided/50 text-undecided" },
  closed: { glyph: "■", cls: "border-stone-300 text-stone-600" },
};

export function DisputeStateBadge({ state }: { state: DisputeState }) {
  const look = disputeLook[state];
  return (
    <span className={`inline-flex items-center gap-1 rounded border bg-white px-2 py-0.5 font-mono text-xs ${look.cls}`} data-dispute-state={state}>
      <span aria-hidden="true">{look.glyph}</span>
      {state}
    </span>
  );
}

const caseLook: Record<CaseState, { glyph: string; cls: string }> = {
  drafting: { glyph: "✎", cls: "border-stone-300 text-stone-600" },
  "claim failing": { glyph: "✗", cls: "border-refuted/50 text-refuted" },
  "under review": { glyph: "◔", cls: "border-undecided/50 text-undecided" },
  disputed: { glyph: "⚑", cls: "border-refuted/50 text-refuted" },
  settled: { glyph: "✓", cls: "border-verified/50 text-verified" },
};

export function CaseStateBadge({ state }: { state: CaseState }) {
  const look = caseLook[state];
  return (
    <span className={`inline-flex items-center gap-1 rounded border bg-white px-2 py-0.5 font-mono text-xs ${look.cls}`} data-case-state={state}>
      <span aria-hidden="true">{look.glyph}</span>
      {state}
    </span>
  );
}

export function ProofStateBadge({ state }: { state: ProofState }) {
  const ready = state === "ready to certify";
  return (
    <span
      className={`inline-flex items-center gap-1 rounded border bg-white px-2 py-0.5 font-mono text-sm ${ready ? "border-verified/50 text-verified" : "border-stone-300 text-stone-700"}`}
      data-proof-state={state}
    >
      <span aria-hidden="true">{ready ? "✓" : "…"}</span>
      {state}
    </span>
  );
}

/** An approval, current or stale ("needs re-review"). */
export function ApprovalBadge({ stale }: { stale: boolean }) {
  return stale ? (
    <span className="inline-flex items-center gap-1 rounded border border-undecided/50 bg-white px-2 py-0.5 font-mono text-xs text-undecided" data-approval="stale">
      <span aria-hidden="true">↻</span>needs re-review
    </span>
  ) : (
    <span className="inline-flex items-center gap-1 rounded border border-verified/50 bg-white px-2 py-0.5 font-mono text-xs text-verified" data-approval="current">
      <span aria-hidden="true">✓</span>approved
    </span>
  );
}

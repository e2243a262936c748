import type { CaseState } from "@/lib/review/states";

const look: Record<CaseState, { glyph: string; className: string }> = {
  drafting: { glyph: "✎", className: "border-stone-300 text-stone-600" },
  "claim failing": { glyph: "✗", className: "border-refuted/50 text-refuted" },
  "under review": { glyph: "◐", className: "border-lichen-300 text-lichen-700" },
  disputed: { glyph: "⚑", className: "border-undecided/50 text-undecided" },
  settled: { glyph: "●", className: "border-verified/50 text-verified" },
};

/** A case's derived state with a glyph and the word. */
export function CaseStateBadge({ state }: { state: CaseState }) {
  const l = look[state];
  return (
    <span className={`inline-flex shrink-0 items-center gap-1 rounded border bg-white px-2 py-0.5 font-mono text-xs ${l.className}`} data-case-state={state}>
      <span aria-hidden="true">{l.glyph}</span>
      {state}
    </span>
  );
}

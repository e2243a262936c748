import type { CaseState } from "@/lib/review/states";
import { Mark } from "@/components/ui/mark";

const look: Record<CaseState, { glyph: string; className: string }> = {
  drafting: { glyph: "✎", className: "text-stone-600" },
  "claim failing": { glyph: "✗", className: "text-refuted" },
  "under review": { glyph: "◐", className: "text-lichen-700" },
  disputed: { glyph: "⚑", className: "text-undecided" },
  settled: { glyph: "●", className: "text-verified" },
};

/** A case's derived state with a glyph and the word. */
export function CaseStateBadge({ state }: { state: CaseState }) {
  const l = look[state];
  return <Mark glyph={l.glyph} word={state} tone={l.className} data={{ "data-case-state": state }} />;
}

import type { CaseState } from "@/lib/review/states";
import { LookMark, type MarkLook } from "@/components/ui/mark";

const look: Record<CaseState, MarkLook> = {
  drafting: { glyph: "✎", tone: "text-stone-600" },
  "claim failing": { glyph: "✗", tone: "text-refuted" },
  "under review": { glyph: "◐", tone: "text-lichen-700" },
  disputed: { glyph: "⚑", tone: "text-undecided" },
  settled: { glyph: "●", tone: "text-verified" },
};

/** A case's derived state with a glyph and the word. */
export function CaseStateBadge({ state }: { state: CaseState }) {
  return <LookMark looks={look} value={state} attribute="data-case-state" />;
}

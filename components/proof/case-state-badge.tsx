import type { CaseState } from "@/lib/review/states";
import { Mark } from "@/components/ui/mark";

/** Each state has its own shape; no progression of one shape from grey to green. */
const look: Record<CaseState, { glyph: string; tone: string }> = {
  drafting: { glyph: "¶", tone: "text-stone-500" },
  "claim failing": { glyph: "✕", tone: "text-refuted" },
  "under review": { glyph: "◇", tone: "text-lichen-700" },
  disputed: { glyph: "△", tone: "text-undecided" },
  settled: { glyph: "◆", tone: "text-verified" },
};

/** A case's derived state: a shape and the word in small capitals. */
export function CaseStateBadge({ state }: { state: CaseState }) {
  return <Mark {...look[state]} word={state} data={{ "data-case-state": state }} />;
}

import type { ClaimStatus } from "@/lib/review/states";
import { LookMark, type MarkLook } from "@/components/ui/mark";

const look: Record<ClaimStatus, MarkLook> = {
  verified: { glyph: "✓", tone: "text-verified" },
  refuted: { glyph: "✗", tone: "text-refuted" },
  undecided: { glyph: "?", tone: "text-undecided" },
  pending: { glyph: "◌", tone: "text-stone-600", pulse: true },
};

/** A claim's verdict with a glyph and the word (never colour alone). */
export function VerdictBadge({ status }: { status: ClaimStatus }) {
  return <LookMark looks={look} value={status} attribute="data-verdict" />;
}

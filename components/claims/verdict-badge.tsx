import type { ClaimStatus } from "@/lib/review/states";
import { Mark } from "@/components/ui/mark";

const look: Record<ClaimStatus, { glyph: string; className: string }> = {
  verified: { glyph: "✓", className: "text-verified" },
  refuted: { glyph: "✗", className: "text-refuted" },
  undecided: { glyph: "?", className: "text-undecided" },
  pending: { glyph: "◌", className: "text-stone-600" },
};

/** A claim's verdict with a glyph and the word (never colour alone). */
export function VerdictBadge({ status }: { status: ClaimStatus }) {
  const l = look[status];
  return <Mark glyph={l.glyph} word={status} tone={l.className} data={{ "data-verdict": status }} pulse={status === "pending"} />;
}

import type { ClaimStatus } from "@/models/claim";
import { Mark } from "@/components/ui/mark";

const look: Record<ClaimStatus, { glyph: string; tone: string }> = {
  verified: { glyph: "✓", tone: "text-verified" },
  refuted: { glyph: "✕", tone: "text-refuted" },
  undecided: { glyph: "?", tone: "text-undecided" },
  pending: { glyph: "◌", tone: "text-stone-500" },
};

/** A claim's verdict: a shape and the word in small capitals (never colour alone). */
export function VerdictBadge({ status }: { status: ClaimStatus }) {
  return <Mark {...look[status]} word={status} data={{ "data-verdict": status }} pulse={status === "pending"} />;
}

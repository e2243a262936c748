import type { ClaimStatus } from "@/models/claim";

const look: Record<ClaimStatus, { glyph: string; className: string }> = {
  verified: { glyph: "✓", className: "border-verified/50 text-verified" },
  refuted: { glyph: "✗", className: "border-refuted/50 text-refuted" },
  undecided: { glyph: "?", className: "border-undecided/50 text-undecided" },
  pending: { glyph: "◌", className: "border-stone-300 text-stone-600" },
};

/** A claim's verdict with a glyph and the word (never colour alone). */
export function VerdictBadge({ status }: { status: ClaimStatus }) {
  const l = look[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded border bg-white px-2 py-0.5 font-mono text-xs ${l.className}`} data-verdict={status}>
      <span aria-hidden="true" className={status === "pending" ? "animate-pulse" : ""}>
        {l.glyph}
      </span>
      {status}
    </span>
  );
}

/** States of the review workflow, always as a glyph and a word (never colour alone). Case states: components/proof/case-state-badge.tsx. */
import type { DisputeState, ProofState } from "@/lib/review/states";
import { proofStandingText, type ProofStanding } from "@/lib/review/rounds";
import { LookMark, Mark, type MarkLook } from "@/components/ui/mark";

const disputeLook: Record<DisputeState, MarkLook> = {
  raised: { glyph: "△", tone: "text-refuted" },
  upheld: { glyph: "▲", tone: "text-refuted" },
  answered: { glyph: "↩", tone: "text-undecided" },
  withdrawn: { glyph: "▽", tone: "text-stone-600" },
};

export function DisputeStateBadge({ state }: { state: DisputeState }) {
  return <LookMark looks={disputeLook} value={state} attribute="data-dispute-state" />;
}

export function ProofStateBadge({ state }: { state: ProofState }) {
  const ready = state === "ready to certify";
  return <Mark glyph={ready ? "●" : "…"} word={state} tone={ready ? "text-verified" : "text-stone-500"} data={{ "data-proof-state": state }} />;
}

/** A vouch, covering the latest revision or superseded by a newer one. */
export function VouchBadge({ stale }: { stale: boolean }) {
  return stale ? (
    <Mark glyph="◌" word="superseded" tone="text-undecided" data={{ "data-approval": "stale" }} />
  ) : (
    <Mark glyph="◆" word="vouched" tone="text-verified" data={{ "data-approval": "current" }} />
  );
}

const standingLook: Record<ProofStanding["stage"], MarkLook> = {
  drafting: { glyph: "✎", tone: "text-stone-600" },
  "in review": { glyph: "◐", tone: "text-lichen-700" },
  decided: { glyph: "§", tone: "text-stone-800" },
};

/** Where a proof stands in refereeing: drafting, in review (round N), decided (with the decision). */
export function ProofStandingMark({ standing }: { standing: ProofStanding }) {
  return <Mark {...standingLook[standing.stage]} word={proofStandingText(standing)} data={{ "data-proof-standing": standing.stage }} />;
}

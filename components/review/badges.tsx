/** States of the review workflow, always as a glyph and a word (never colour alone). Case states: components/proof/case-state-badge.tsx. */
import type { DisputeState, ProofState } from "@/lib/review/states";
import { proofStandingText, type ProofStanding } from "@/lib/review/rounds";
import { Mark } from "@/components/ui/mark";

function Badge({ glyph, word, className, data }: { glyph: string; word: string; className: string; data: Record<string, string> }) {
  return <Mark glyph={glyph} word={word} tone={className} data={data} />;
}

const disputeLook: Record<DisputeState, { glyph: string; className: string }> = {
  raised: { glyph: "△", className: "text-refuted" },
  upheld: { glyph: "▲", className: "text-refuted" },
  answered: { glyph: "↩", className: "text-undecided" },
  withdrawn: { glyph: "▽", className: "text-stone-600" },
};

export function DisputeStateBadge({ state }: { state: DisputeState }) {
  return <Badge {...disputeLook[state]} word={state} data={{ "data-dispute-state": state }} />;
}

export function ProofStateBadge({ state }: { state: ProofState }) {
  const ready = state === "ready to certify";
  return <Badge glyph={ready ? "●" : "…"} word={state} className={ready ? "text-verified" : "text-stone-500"} data={{ "data-proof-state": state }} />;
}

/** A vouch, covering the latest revision or superseded by a newer one. */
export function VouchBadge({ stale }: { stale: boolean }) {
  return stale ? (
    <Badge glyph="◌" word="superseded" className="text-undecided" data={{ "data-approval": "stale" }} />
  ) : (
    <Badge glyph="◆" word="vouched" className="text-verified" data={{ "data-approval": "current" }} />
  );
}

const standingLook: Record<ProofStanding["stage"], { glyph: string; className: string }> = {
  drafting: { glyph: "✎", className: "text-stone-600" },
  "in review": { glyph: "◐", className: "text-lichen-700" },
  decided: { glyph: "§", className: "text-stone-800" },
};

/** Where a proof stands in refereeing: drafting, in review (round N), decided (with the decision). */
export function ProofStandingMark({ standing }: { standing: ProofStanding }) {
  return <Badge {...standingLook[standing.stage]} word={proofStandingText(standing)} data={{ "data-proof-standing": standing.stage }} />;
}

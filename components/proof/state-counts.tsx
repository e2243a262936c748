import type { CaseState, ProofState } from "@/lib/review/states";
import { CaseStateBadge } from "./case-state-badge";
import { ProofStateBadge } from "@/components/review/badges";

/** How many cases are in each state, and the proof's state. */
export function StateCounts({ counts, proofState }: { counts: Record<CaseState, number>; proofState: ProofState }) {
  return (
    <div className="rounded border border-stone-200 bg-white p-3" data-testid="state-counts">
      <p className="font-semibold">
        Proof: <ProofStateBadge state={proofState} />
      </p>
      <ul className="mt-2 space-y-1">
        {(Object.keys(counts) as CaseState[]).map((s) => (
          <li key={s} className="flex items-center justify-between gap-2 text-sm">
            <CaseStateBadge state={s} />
            <span className="font-mono">{counts[s]}</span>
          </li>
        ))}
      </ul>
    </div>
  );
}

/**
 * The readiness roll-up of a proof: each case's derived state and whether the proof is ready to certify.
 * Shown on the proof overview (rendered by the workspace), the members page and the queue's step view.
 */
import type { Readiness } from "@/lib/data/review-queues";
import { CaseStateBadge } from "@/components/proof/case-state-badge";
import { ProofStateBadge } from "./badges";

export function ReadinessRollup({ readiness }: { readiness: Readiness }) {
  return (
    <section aria-labelledby="readiness-heading" className="space-y-3" data-testid="readiness">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="readiness-heading" className="text-lg font-semibold">
          Readiness
        </h2>
        <ProofStateBadge state={readiness.state} />
        <span className="text-sm text-stone-600">
          each step needs {readiness.requiredApprovals} approving reviewer{readiness.requiredApprovals === 1 ? "" : "s"} at its latest revision
        </span>
      </div>
      <ul className="divide-y divide-stone-100 rounded border border-stone-200 bg-white">
        {readiness.cases.map((c) => (
          <li
            key={c.id}
            className="flex items-center justify-between gap-3 px-3 py-2"
            style={{ paddingLeft: `${0.75 + c.depth * 1.25}rem` }}
            data-testid="readiness-case"
            data-case-number={c.number}
          >
            <span>
              <span className="mr-2 font-mono text-lichen-700">Case {c.number}</span>
              {c.title}
            </span>
            <span className="flex items-center gap-3 text-sm text-stone-600">
              <span className="font-mono">
                {c.settledSteps}/{c.steps} steps settled
              </span>
              <CaseStateBadge state={c.state} />
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}

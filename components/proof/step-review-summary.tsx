import type { StepView } from "@/lib/data/cases";
import { VerdictBadge } from "@/components/claims/verdict-badge";
import { DisputeStateBadge, VouchBadge } from "@/components/review/badges";

/**
 * Under a step of the overview: its claims (what each states, with its verdict) and its review (each
 * referee's latest vouch, at which revision, superseded when older than the latest; the unresolved
 * disputes with their state). Names arrive through the viewer's blind lens (lib/data/cases.ts).
 */
export function StepReviewSummary({ step, label, required, href }: { step: StepView; label: string; required: number; href: string }) {
  const latest = step.revision?.number ?? 0;
  const { vouches, disputes } = step.review;
  return (
    <div className="mt-2 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
      <div data-testid="step-claims">
        <p className="text-xs font-semibold uppercase tracking-wide text-stone-500">Claims</p>
        {step.claimItems.length === 0 ? (
          <p className="text-stone-500">none attached</p>
        ) : (
          <ul aria-label={`Claims of step ${label}`}>
            {step.claimItems.map((c) => (
              <li key={c.id} className="flex flex-wrap items-baseline gap-2">
                <VerdictBadge status={c.status} />
                <span className="break-all font-mono text-xs">{c.statement}</span>
              </li>
            ))}
          </ul>
        )}
      </div>
      <div data-testid="step-review-summary" data-vouches={step.vouches} data-open-disputes={step.openDisputes}>
        <p className="text-xs font-semibold uppercase tracking-wide text-stone-500">
          Review: {step.vouches} of {required} vouch{required === 1 ? "" : "es"}
          {latest > 0 ? ` at revision ${latest}` : ""}
        </p>
        {vouches.length === 0 && disputes.length === 0 && <p className="text-stone-500">no vouch or dispute yet</p>}
        <ul aria-label={`Review of step ${label}`}>
          {vouches.map((v, i) => (
            <li key={`v${i}`} className="flex flex-wrap items-baseline gap-2" data-testid="overview-vouch">
              <VouchBadge stale={v.superseded} />
              <span>
                {v.name}, revision {v.revision}
                {v.superseded && <span className="text-stone-500"> (latest is {latest})</span>}
              </span>
            </li>
          ))}
          {disputes.map((d) => (
            <li key={d.id} className="flex flex-wrap items-baseline gap-2" data-testid="overview-dispute">
              <DisputeStateBadge state={d.state} />
              <a href={`${href}#dispute-${d.id}`} className="text-lichen-700 hover:underline">
                dispute by {d.name} on revision {d.revision}
              </a>
            </li>
          ))}
        </ul>
      </div>
    </div>
  );
}

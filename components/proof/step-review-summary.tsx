import type { StepView } from "@/lib/data/cases";
import { VerdictBadge } from "@/components/claims/verdict-badge";
import { DisputeStateBadge, VouchBadge } from "@/components/review/badges";

/**
 * Under a step of the overview: its claims (what each states, with its verdict) and its review (each
 * referee's latest vouch, at which revision, superseded when older than the latest; the unresolved
 * disputes with their state). Names arrive through the viewer's blind lens (lib/data/cases.ts). The
 * outline repeats this once per step, so its markup is kept short (the .step-facts rules in globals.css).
 */
export function StepReviewSummary({ step, label, required, href }: { step: StepView; label: string; required: number; href: string }) {
  const latest = step.revision?.number ?? 0;
  const { vouches, disputes } = step.review;
  return (
    <div className="step-facts">
      <div data-testid="step-claims">
        <h4>Claims</h4>
        {step.claimItems.length === 0 ? (
          <p className="none">none attached</p>
        ) : (
          <ul aria-label={`Claims of step ${label}`}>
            {step.claimItems.map((c) => (
              <li key={c.id}>
                <VerdictBadge status={c.status} />
                <span className="break-all font-mono text-xs">{c.statement}</span>
              </li>
            ))}
          </ul>
        )}
      </div>
      <div data-testid="step-review-summary" data-vouches={step.vouches} data-open-disputes={step.openDisputes}>
        <h4>
          Review: {step.vouches} of {required} vouch{required === 1 ? "" : "es"}
          {latest > 0 ? ` at revision ${latest}` : ""}
        </h4>
        {vouches.length === 0 && disputes.length === 0 ? (
          <p className="none">no vouch or dispute yet</p>
        ) : (
          <ul aria-label={`Review of step ${label}`}>
            {vouches.map((v, i) => (
              <li key={`v${i}`} data-testid="overview-vouch">
                <VouchBadge stale={v.superseded} />
                <span>
                  {v.name}, revision {v.revision}
                  {v.superseded && <span className="none"> (latest is {latest})</span>}
                </span>
              </li>
            ))}
            {disputes.map((d) => (
              <li key={d.id} data-testid="overview-dispute">
                <DisputeStateBadge state={d.state} />
                <a href={`${href}#dispute-${d.id}`} className="text-lichen-700 hover:underline">
                  dispute by {d.name} on revision {d.revision}
                </a>
              </li>
            ))}
          </ul>
        )}
      </div>
    </div>
  );
}

"use client";
import useSWR from "swr";
import type { WithdrawnClaimView } from "@/lib/data/claim-lists";
import type { ClaimView } from "@/lib/data/claim-views";
import type { VerificationService } from "@/lib/jobs/queue";
import { jsonFetcher } from "@/components/proof/api-client";
import { ClaimCard } from "./claim-card";

type StepClaims = { claims: ClaimView[]; withdrawn: WithdrawnClaimView[]; verification: VerificationService | null };

/** The step's claims, polled every second while any is pending, and below them the withdrawn ones. */
export function ClaimList(props: {
  proofId: number;
  stepId: number;
  initial: StepClaims;
  canRecheck: boolean;
  canWithdraw: boolean;
  /** Set for those who may upload files to the claims: the part size above which uploads go in parts. */
  uploadPartSize?: number;
}) {
  const { proofId, stepId, initial, canRecheck, canWithdraw, uploadPartSize } = props;
  const { data, error, mutate } = useSWR<StepClaims>(`/api/proofs/${proofId}/steps/${stepId}/claims`, jsonFetcher, {
    fallbackData: initial,
    refreshInterval: (latest) => (latest?.claims.some((c) => c.status === "pending") ? 1000 : 0),
  });
  const claims = data?.claims ?? [];
  const withdrawn = data?.withdrawn ?? [];
  return (
    <section aria-labelledby="claims-heading" className="mt-8" data-testid="claim-list">
      <h2 id="claims-heading" className="text-xl font-semibold">
        Claims <span className="font-mono text-sm text-stone-500">({claims.length})</span>
      </h2>
      {error && (
        <p role="alert" className="mt-2 text-sm text-refuted">
          The claims could not be refreshed: {(error as Error).message}
        </p>
      )}
      {data?.verification?.paused && (
        <p role="status" data-testid="verification-paused" className="mt-2 rounded border border-amber-300 bg-amber-50 p-2 text-sm text-amber-900">
          {data.verification.message}
        </p>
      )}
      {claims.length === 0 ? (
        <p className="mt-2 text-stone-600">No claims on this step yet.</p>
      ) : (
        <ul className="mt-3 space-y-4">
          {claims.map((c) => (
            <ClaimCard
              key={c.id}
              claim={c}
              proofId={proofId}
              canRecheck={canRecheck}
              canWithdraw={canWithdraw}
              onChanged={() => void mutate()}
              uploadPartSize={uploadPartSize}
            />
          ))}
        </ul>
      )}
      {withdrawn.length > 0 && (
        <details className="mt-3 text-sm text-stone-600" data-testid="withdrawn-claims">
          <summary className="cursor-pointer">
            {withdrawn.length} withdrawn {withdrawn.length === 1 ? "claim" : "claims"} (kept as history; they count nowhere)
          </summary>
          <ul className="mt-2 space-y-1">
            {withdrawn.map((w) => (
              <li key={w.id} data-testid="withdrawn-claim">
                <span className="font-mono text-xs">{w.kind}</span> {w.statement ?? "(not checked)"} — was {w.status}; withdrawn by{" "}
                {w.withdrawnByName ?? "a former member"} on {w.withdrawnAt.slice(0, 16).replace("T", " ")} UTC
              </li>
            ))}
          </ul>
        </details>
      )}
    </section>
  );
}

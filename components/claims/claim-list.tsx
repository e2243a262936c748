"use client";
import useSWR from "swr";
import type { ClaimView } from "@/lib/data/claims";
import { jsonFetcher } from "@/components/proof/api-client";
import { ClaimCard } from "./claim-card";

/** The step's claims, polled every second while any is pending. */
export function ClaimList({ proofId, stepId, initial, canRecheck }: { proofId: number; stepId: number; initial: ClaimView[]; canRecheck: boolean }) {
  const { data, error, mutate } = useSWR<{ claims: ClaimView[] }>(`/api/proofs/${proofId}/steps/${stepId}/claims`, jsonFetcher, {
    fallbackData: { claims: initial },
    refreshInterval: (latest) => (latest?.claims.some((c) => c.status === "pending") ? 1000 : 0),
  });
  const claims = data?.claims ?? [];
  return (
    <section aria-labelledby="claims-heading" className="mt-8">
      <h2 id="claims-heading" className="text-xl font-semibold">
        Claims <span className="font-mono text-sm text-stone-500">({claims.length})</span>
      </h2>
      {error && (
        <p role="alert" className="mt-2 text-sm text-refuted">
          The claims could not be refreshed: {(error as Error).message}
        </p>
      )}
      {claims.length === 0 ? (
        <p className="mt-2 text-stone-600">No claims on this step yet.</p>
      ) : (
        <ul className="mt-3 space-y-4">
          {claims.map((c) => (
            <ClaimCard key={c.id} claim={c} proofId={proofId} canRecheck={canRecheck} onChanged={() => void mutate()} />
          ))}
        </ul>
      )}
    </section>
  );
}

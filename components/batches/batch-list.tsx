"use client";
import { useState } from "react";
import useSWR from "swr";
import { apiFetch, jsonFetcher } from "@/components/proof/api-client";
import type { BatchView } from "@/lib/data/batches";
import type { VerificationService } from "@/lib/jobs/queue";
import { BatchResultsTable } from "./batch-results-table";

const STATE: Record<BatchView["status"], string> = { queued: "waiting for a worker", running: "being checked", done: "finished", cancelled: "cancelled" };

function outcome(b: BatchView): string {
  if (b.status !== "done") return "";
  const missing = b.missing > 0 ? `${b.missing} graphs of the enumeration are not listed` : null;
  if (b.failing === 0 && !missing) return "✓ verified for every graph of the list";
  return `✗ not established: ${[b.failing ? `${b.failing} of ${b.total} graphs fail` : null, missing].filter(Boolean).join("; ")}`;
}

const seconds = (s: number) => (s < 90 ? `${s} s` : `${Math.round(s / 60)} min`);

/** One batch claim: progress (done / total, failing so far, rate, estimate), cancel, downloads and the results table. */
function BatchCard({ proofId, batch, canCancel, onChange }: { proofId: number; batch: BatchView; canCancel: boolean; onChange: () => void }) {
  const [open, setOpen] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const percent = batch.total ? Math.floor((100 * batch.done) / batch.total) : 0;
  const active = batch.status === "queued" || batch.status === "running";
  const base = `/api/proofs/${proofId}/batches/${batch.id}/results`;
  const cancel = async () => {
    setProblem(null);
    try {
      await apiFetch(`/api/proofs/${proofId}/batches/${batch.id}/cancel`, { method: "POST" });
      onChange();
    } catch (e) {
      setProblem((e as Error).message);
    }
  };
  return (
    <li className="rounded border border-stone-200 bg-white p-3" data-testid="batch-card">
      <p className="font-mono text-sm">{batch.statement}</p>
      <p className="text-xs text-stone-600">
        over {batch.fileName ?? "a file"} · {STATE[batch.status]} · checker {batch.checkerVersion}
      </p>
      <div className="mt-2 text-sm" aria-live="polite">
        <progress max={batch.total} value={batch.done} className="w-full" aria-label="batch progress" />
        <p data-testid="batch-progress">
          {batch.done} of {batch.total} checked ({percent}%) · failing so far: {batch.failing}
          {batch.unreadable > 0 && ` (${batch.unreadable} unreadable)`}
          {batch.rate !== null && ` · ${Math.round(batch.rate)} graphs/s`}
          {batch.etaSeconds !== null && ` · about ${seconds(batch.etaSeconds)} left`}
        </p>
        {batch.note && (
          <p className="mt-1 whitespace-pre-line text-xs text-stone-700" data-testid="batch-note">
            {batch.note}
          </p>
        )}
        {outcome(batch) && (
          <p className={`small-caps mt-1 font-semibold ${batch.failing ? "text-refuted" : ""}`} data-testid="batch-outcome">
            {outcome(batch)}
          </p>
        )}
      </div>
      <div className="mt-2 flex flex-wrap gap-3 text-sm">
        {active && canCancel && (
          <button type="button" onClick={() => void cancel()} className="rounded border border-stone-300 px-2 py-0.5 hover:bg-stone-100">
            Cancel
          </button>
        )}
        <a href={`${base}?format=csv`} className="text-lichen-700 underline" data-testid="download-csv">
          results (CSV)
        </a>
        <a href={`${base}?format=graph6`} className="text-lichen-700 underline" data-testid="download-failures">
          failing graphs (graph6)
        </a>
        <a href={`${base}?format=sparse6`} className="text-lichen-700 underline" data-testid="download-failures-sparse6">
          failing graphs (sparse6, loops and multiple edges included)
        </a>
        <button type="button" onClick={() => setOpen(!open)} className="text-lichen-700 underline" aria-expanded={open}>
          {open ? "hide the table" : "show each graph"}
        </button>
      </div>
      {problem && <p className="text-sm text-refuted">✗ {problem}</p>}
      {open && <BatchResultsTable proofId={proofId} batch={batch} />}
    </li>
  );
}

/** The step's batch claims, polled every second while one is still being checked. */
export function BatchList({ proofId, stepId, canCancel }: { proofId: number; stepId: number; canCancel: boolean }) {
  const key = `/api/proofs/${proofId}/steps/${stepId}/batches`;
  const { data, mutate } = useSWR<{ batches: BatchView[]; verification: VerificationService | null }>(key, jsonFetcher, {
    refreshInterval: (d) => (d?.batches.some((b) => b.status === "queued" || b.status === "running") ? 1_000 : 0),
  });
  const batches = data?.batches ?? [];
  if (batches.length === 0) return null;
  return (
    <section className="mt-6" aria-labelledby="batches-heading">
      <h2 id="batches-heading" className="text-lg font-semibold">
        Batch claims
      </h2>
      {data?.verification?.paused && (
        <p role="status" data-testid="batch-verification-paused" className="mt-2 rounded border border-amber-300 bg-amber-50 p-2 text-sm text-amber-900">
          {data.verification.message} Unfinished batch claims wait where they are.
        </p>
      )}
      <ul className="mt-2 space-y-3">
        {batches.map((b) => (
          <BatchCard key={b.id} proofId={proofId} batch={b} canCancel={canCancel} onChange={() => void mutate()} />
        ))}
      </ul>
    </section>
  );
}

"use client";
import { useState } from "react";
import useSWR from "swr";
import { jsonFetcher } from "@/components/proof/api-client";
import type { RevisionDiff, RevisionView } from "@/lib/data/steps";

type Revision = Omit<RevisionView, "body">;

/** The step's revisions, and a line diff between any two of them (− removed, + added). */
export function RevisionHistory({ proofId, stepId, revisions }: { proofId: number; stepId: number; revisions: Revision[] }) {
  const newest = revisions[0]?.number ?? 1;
  const [from, setFrom] = useState(Math.max(1, newest - 1));
  const [to, setTo] = useState(newest);
  const key = revisions.length > 1 && from !== to ? `/api/proofs/${proofId}/steps/${stepId}/diff?from=${from}&to=${to}` : null;
  const { data, error, isLoading } = useSWR<{ diff: RevisionDiff }>(key, jsonFetcher);
  const select = (value: number, set: (n: number) => void, label: string) => (
    <select value={value} onChange={(e) => set(Number(e.target.value))} aria-label={label} className="rounded border border-stone-300 bg-white px-1 font-mono text-sm">
      {revisions.map((r) => (
        <option key={r.id} value={r.number}>
          {r.number}
        </option>
      ))}
    </select>
  );
  return (
    <section className="mt-8" aria-labelledby="history-heading" data-testid="revision-history">
      <h2 id="history-heading" className="text-xl font-semibold">
        History
      </h2>
      <ol className="mt-2 space-y-1 text-sm">
        {revisions.map((r) => (
          <li key={r.id} className="font-mono text-xs text-stone-600">
            revision {r.number} · {r.authorName} · {r.createdAt.slice(0, 16).replace("T", " ")} UTC
            {r.baseRevisionId && ` · based on #${revisions.find((b) => b.id === r.baseRevisionId)?.number ?? "?"}`}
          </li>
        ))}
      </ol>
      {revisions.length > 1 && (
        <div className="mt-3">
          <p className="text-sm">
            Compare revision {select(from, setFrom, "compare from revision")} with {select(to, setTo, "compare to revision")}
          </p>
          {isLoading && <p className="text-sm text-stone-500">Loading the diff…</p>}
          {error && (
            <p role="alert" className="text-sm text-refuted">
              {(error as Error).message}
            </p>
          )}
          {data && (
            <pre className="mt-2 overflow-auto rounded border border-stone-200 bg-white p-2 font-mono text-xs" data-testid="revision-diff">
              {data.diff.parts.map((p, i) => {
                const sign = p.added ? "+ " : p.removed ? "− " : "  ";
                const cls = p.added ? "bg-lichen-50 text-lichen-800" : p.removed ? "bg-red-50 text-refuted line-through" : "text-stone-600";
                return (
                  <span key={i} className={`block ${cls}`}>
                    {p.value.replace(/\n$/, "").split("\n").map((line) => `${sign}${line}`).join("\n")}
                  </span>
                );
              })}
            </pre>
          )}
        </div>
      )}
    </section>
  );
}

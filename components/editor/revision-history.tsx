"use client";
import { useState } from "react";
import useSWR from "swr";
import { jsonFetcher } from "@/components/proof/api-client";
import type { RevisionDiff, RevisionView } from "@/lib/data/steps";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { remarkMarkRanges } from "@/lib/review/word-marks";
import { COMPARE_ANCHOR } from "@/lib/review/compare-link";

type Revision = Omit<RevisionView, "body">;

/**
 * The step's revisions, and any two of them compared: both typeset side by side with the changed words
 * marked (struck through on the older side, underlined on the newer), and the change of the claim set.
 */
export function RevisionHistory({
  proofId,
  stepId,
  revisions,
  initial,
}: {
  proofId: number;
  stepId: number;
  revisions: Revision[];
  /** The two revisions to compare first (from the page's `?compare=`, lib/review/compare-link.ts); else the last two. */
  initial?: { from: number; to: number } | null;
}) {
  const newest = revisions[0]?.number ?? 1;
  const [from, setFrom] = useState(initial?.from ?? Math.max(1, newest - 1));
  const [to, setTo] = useState(initial?.to ?? newest);
  const key = revisions.length > 1 && from !== to ? `/api/proofs/${proofId}/steps/${stepId}/diff?from=${from}&to=${to}` : null;
  const { data, error, isLoading } = useSWR<{ diff: RevisionDiff }>(key, jsonFetcher);
  const select = (value: number, set: (n: number) => void, label: string) => (
    <select
      value={value}
      onChange={(e) => set(Number(e.target.value))}
      aria-label={label}
      className="rounded border border-stone-300 bg-white px-1 font-mono text-sm"
    >
      {revisions.map((r) => (
        <option key={r.id} value={r.number}>
          {r.number}
        </option>
      ))}
    </select>
  );
  return (
    <section id={COMPARE_ANCHOR} className="mt-8 scroll-mt-4" aria-labelledby="history-heading" data-testid="revision-history">
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
          {isLoading && <p className="text-sm text-stone-500">Loading the comparison…</p>}
          {error && (
            <p role="alert" className="text-sm text-refuted">
              {(error as Error).message}
            </p>
          )}
          {data && <Comparison diff={data.diff} />}
        </div>
      )}
    </section>
  );
}

function Comparison({ diff }: { diff: RevisionDiff }) {
  const { words, claims } = diff;
  const claimLines = [
    ...claims.added.map((c) => `attached: ${c}`),
    ...claims.withdrawn.map((c) => `withdrawn: ${c}`),
    ...claims.redecided.map((c) => `re-decided: ${c}`),
  ];
  return (
    <div className="mt-2 space-y-3" data-testid="revision-compare">
      <p className="text-sm text-stone-700">
        Text:{" "}
        {words.counts.removed === 0 && words.counts.added === 0
          ? "unchanged"
          : `${words.counts.removed} word${words.counts.removed === 1 ? "" : "s"} removed, ${words.counts.added} added`}
        .{" "}
        <span className="text-stone-600">
          Removed words are <del className="word-removed">struck through</del> in revision {diff.from.number}; added words are{" "}
          <ins className="word-added">underlined</ins> in revision {diff.to.number}.
        </span>
      </p>
      <div className="grid gap-3 md:grid-cols-2">
        {[
          { side: diff.from, ranges: words.removed, className: "word-removed", title: `Revision ${diff.from.number}` },
          { side: diff.to, ranges: words.added, className: "word-added", title: `Revision ${diff.to.number}` },
        ].map(({ side, ranges, className, title }) => (
          <section
            key={className}
            aria-label={title}
            className="min-w-0 rounded border border-stone-200 bg-white p-3"
            data-testid={className === "word-removed" ? "compare-older" : "compare-newer"}
          >
            <h3 className="mb-1 font-mono text-xs text-stone-600">{title}</h3>
            <MathMarkdown source={side.body} marks={[[remarkMarkRanges, { ranges, className }]]} />
          </section>
        ))}
      </div>
      <div className="text-sm" data-testid="compare-claims">
        <p className="font-semibold">Claims</p>
        {claimLines.length === 0 ? (
          <p className="text-stone-600">
            The claim set is the same ({claims.kept} claim{claims.kept === 1 ? "" : "s"}).
          </p>
        ) : (
          <ul className="list-disc pl-5">
            {claimLines.map((line) => (
              <li key={line}>{line}</li>
            ))}
            {claims.kept > 0 && <li className="text-stone-600">{claims.kept} unchanged</li>}
          </ul>
        )}
      </div>
      <details className="text-sm">
        <summary className="cursor-pointer text-lichen-700">Source, line by line</summary>
        <pre className="mt-2 overflow-auto rounded border border-stone-200 bg-white p-2 font-mono text-xs" data-testid="revision-diff">
          {diff.parts.map((p, i) => {
            const sign = p.added ? "+ " : p.removed ? "− " : "  ";
            const cls = p.added ? "underline" : p.removed ? "line-through" : "text-stone-600";
            return (
              <span key={i} className={`block ${cls}`}>
                {p.value
                  .replace(/\n$/, "")
                  .split("\n")
                  .map((line) => `${sign}${line}`)
                  .join("\n")}
              </span>
            );
          })}
        </pre>
      </details>
    </div>
  );
}

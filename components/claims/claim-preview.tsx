"use client";
import { useMemo } from "react";
import { parseGraph, type GraphFormat } from "@/lib/core/input/parse";
import { describeBound, parseBound } from "@/lib/core/arithmetic/bound";
import { summarizeGraph, describeGraphSummary, degree } from "@/lib/core/graph";
import { pictureOf } from "@/lib/verification/picture";
import { GraphPicture } from "@/components/graph/graph-picture";

/** Above this many vertices the preview gives the numbers without a drawing (the browser lays it out). */
const PREVIEW_DRAWN_VERTICES = 200;

/**
 * What the checker will read, before the claim is submitted: the graph's order, size, loops, multiple
 * edges, degree sequence and drawing, and the bound reduced to its normal form — parsed in the browser by
 * the same lib/core code the checker runs, so a misread input (1-based numbering, a repeated edge, a
 * mistyped bound) is caught by eye. A preview, not a verdict.
 */
export function ClaimPreview({ graphText, graphFormat, bound, onBaseOne }: { graphText: string; graphFormat: string; bound?: string; onBaseOne: () => void }) {
  const graph = useMemo(() => {
    if (!graphText.trim()) return null;
    try {
      const g = parseGraph(graphText, (graphFormat || "auto") as GraphFormat);
      const degrees = Array.from({ length: g.n }, (_, v) => degree(g, v)).sort((a, b) => b - a);
      return {
        ok: true as const,
        summary: describeGraphSummary(summarizeGraph(g, "G")),
        degrees,
        picture: g.n <= PREVIEW_DRAWN_VERTICES ? pictureOf(g, "G as read") : null,
      };
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      return { ok: false as const, message, baseOne: /numbered from 1/.test(message) };
    }
  }, [graphText, graphFormat]);
  const normal = useMemo(() => {
    if (bound === undefined || !bound.trim()) return null;
    try {
      return { ok: true as const, sentence: describeBound(parseBound(bound)).sentence };
    } catch (e) {
      return { ok: false as const, message: e instanceof Error ? e.message : String(e) };
    }
  }, [bound]);
  if (!graph && !normal) return null;
  return (
    <section
      aria-label="preview of the input as read"
      data-testid="claim-preview"
      className="space-y-2 rounded border border-dashed border-stone-300 p-3 text-sm"
    >
      <h3 className="font-semibold">As the checker will read it</h3>
      {graph?.ok && (
        <>
          <p data-testid="preview-graph">
            {graph.summary}; degree sequence <span className="font-mono">({graph.degrees.join(", ")})</span>
          </p>
          {graph.picture && <GraphPicture picture={graph.picture} />}
        </>
      )}
      {graph && !graph.ok && (
        <p role="alert" className="text-rust-700" data-testid="preview-graph-error">
          {graph.message}
          {graph.baseOne && (
            <button type="button" onClick={onBaseOne} className="ml-2 rounded border border-stone-400 px-2 py-0.5 text-xs">
              Read the vertices as 1..n
            </button>
          )}
        </p>
      )}
      {normal?.ok && <p data-testid="preview-bound">b {normal.sentence}</p>}
      {normal && !normal.ok && (
        <p role="alert" className="text-rust-700" data-testid="preview-bound-error">
          {normal.message}
        </p>
      )}
      <p className="text-xs text-stone-500">A preview of the input, not a verdict: the checker decides after you attach the claim.</p>
    </section>
  );
}

/**
 * Test support: a batch item as the export writes it (statement, list text, one result per graph, counts),
 * built by running the core's own batch check on the list, and the bundle header the tests seal it with.
 */
import { checkListedGraphs, batchStatement, type BatchStatement } from "../../lib/core/claims/batch";
import { splitGraphList, type GraphListFormat } from "../../lib/core/input/graph-list";
import { sha256Hex } from "../../lib/core/digest";
import type { BatchItemData } from "../../lib/core/certificates/batch-check";

/** The item for `statement` over the list `text`; `missing` (enumeration batches) is recorded as given. */
export function batchItemData(statement: BatchStatement, text: string, format: GraphListFormat, name: string, missing?: number): BatchItemData {
  const entries = splitGraphList(text, format);
  const results = checkListedGraphs(entries, format, statement, 0, entries.length, 1e8);
  const tally = { verified: 0, refuted: 0, undecided: 0, unreadable: 0 };
  for (const r of results) tally[r.verdict]++;
  return {
    step: "step 1(a)",
    statement,
    words: batchStatement(statement),
    status: "done",
    file: { name, format, text, textSha256: sha256Hex(text), sha256: sha256Hex(text) },
    counts: { total: results.length, ...tally, ...(missing !== undefined ? { missing } : {}) },
    results: results.map((r) => ({ entry: r.entry, line: r.line, verdict: r.verdict, certificate: r.certificate ? JSON.parse(r.certificate) : null })),
    checkerVersion: "test",
  };
}

/** A certified bundle's header (invented exporter). */
export const BUNDLE_HEADER = {
  kind: "certified" as const,
  exportedAt: "2026-01-01T00:00:00.000Z",
  exportedBy: "Ada Quenby",
  proofState: "ready to certify",
  checkerVersion: "test",
};

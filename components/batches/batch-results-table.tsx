"use client";
import { useMemo, useState } from "react";
import useSWR from "swr";
import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import { SortableTable } from "@/components/ui/sortable-table";
import { jsonFetcher } from "@/components/proof/api-client";
import type { BatchResultView, BatchView } from "@/lib/data/batches";

const MARK: Record<BatchResultView["verdict"], string> = { verified: "✓ verified", refuted: "✗ refuted", undecided: "? undecided", unreadable: "⚠ unreadable" };
const column = createColumnHelper<BatchResultView>();

/** Each listed graph with its verdict and certificate; filterable to the failures. */
export function BatchResultsTable({ proofId, batch }: { proofId: number; batch: BatchView }) {
  const [failingOnly, setFailingOnly] = useState(batch.failing > 0);
  const url = `/api/proofs/${proofId}/batches/${batch.id}/results${failingOnly ? "?only=failing" : ""}`;
  const { data, error } = useSWR<{ results: BatchResultView[] }>(`${url}#${batch.done}`, () => jsonFetcher<{ results: BatchResultView[] }>(url));
  const columns = useMemo(
    () => [
      column.accessor("line", { header: "Line" }),
      column.accessor("verdict", {
        header: "Verdict",
        cell: (c) => <span className={c.getValue() === "verified" ? "" : "text-refuted"}>{MARK[c.getValue()]}</span>,
      }),
      column.accessor((r) => r.graph6 ?? r.sparse6 ?? "—", {
        id: "graph",
        header: "Graph (graph6, or sparse6 with loops or multiple edges)",
        cell: (c) => <code className="font-mono text-xs">{c.getValue()}</code>,
      }),
      column.accessor((r) => (r.vertices === null ? "—" : `${r.vertices} / ${r.edges}`), { id: "size", header: "Vertices / edges" }),
      column.accessor("reason", { header: "Why", cell: (c) => <span className="text-xs">{c.getValue()}</span> }),
      column.accessor("certificate", {
        header: "Certificate",
        cell: (c) =>
          c.getValue() ? (
            <details>
              <summary className="cursor-pointer text-xs text-lichen-700">show</summary>
              <pre className="max-h-40 max-w-md overflow-auto text-xs">{JSON.stringify(c.getValue(), null, 1)}</pre>
            </details>
          ) : (
            "—"
          ),
      }),
    ],
    [],
  );
  const [sorting, setSorting] = useState<SortingState>([]);
  const table = useReactTable({
    data: data?.results ?? [],
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  return (
    <div className="mt-3">
      <label className="text-sm">
        <input type="checkbox" checked={failingOnly} onChange={(e) => setFailingOnly(e.target.checked)} className="mr-2" data-testid="failing-only" />
        failures only (refuted, undecided, unreadable)
      </label>
      {error && <p className="text-sm text-refuted">✗ The results could not be loaded: {(error as Error).message}</p>}
      <div className="mt-2 max-h-96 overflow-auto">
        <SortableTable table={table} label="each graph of the list with its verdict" rowClassName="align-top" rowTestId="batch-result-row" />
      </div>
      {data && data.results.length === 5000 && <p className="text-xs text-stone-500">The first 5000 are shown; download the CSV for all of them.</p>}
    </div>
  );
}

"use client";
/** A sortable, filterable table of a queue (@tanstack/react-table v8): a text filter and one column filter. */
import { useMemo, useState } from "react";
import { SortableTable } from "@/components/ui/sortable-table";
import Link from "next/link";
import { getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import type { QueueDisputeRow, QueueStepRow, ReviewerProgress } from "@/lib/data/review-queues";
import { DisputeStateBadge } from "./badges";
import { TextInput } from "@/components/ui/text-input";
import { Choice } from "@/components/ui/choice";

type Kind = "steps" | "disputes" | "progress" | "myDisputes";
const TABLE_LABEL: Record<Kind, string> = { steps: "Steps to review", disputes: "Disputes", progress: "Reviewers’ progress", myDisputes: "Your disputes" };
type Row = QueueStepRow | QueueDisputeRow | ReviewerProgress;

const day = (iso: string) => new Date(iso).toLocaleDateString("en-GB", { dateStyle: "medium" });
const stepLink = (r: { proofId: number; stepId: number; stepLabel: string }) => (
  <Link className="font-mono text-lichen-700 underline" href={`/queue/${r.proofId}/${r.stepId}`}>
    Step {r.stepLabel}
  </Link>
);

const columns: Record<Kind, ColumnDef<Row>[]> = {
  steps: [
    { id: "step", header: "Step", accessorFn: (r) => (r as QueueStepRow).stepLabel, cell: (c) => stepLink(c.row.original as QueueStepRow) },
    { id: "case", header: "Case", accessorFn: (r) => (r as QueueStepRow).caseTitle },
    { id: "proof", header: "Proof", accessorFn: (r) => (r as QueueStepRow).proofTitle },
    { id: "revision", header: "Revision", accessorFn: (r) => (r as QueueStepRow).revision },
    {
      id: "reason",
      header: "Why",
      accessorFn: (r) => (r as QueueStepRow).reason,
      cell: (c) =>
        c.getValue() === "vouch superseded" ? (
          <span className="[font-variant-caps:all-small-caps] text-undecided">◌ vouch superseded</span>
        ) : (
          <span className="[font-variant-caps:all-small-caps]">○ not read yet</span>
        ),
      filterFn: "equalsString",
    },
    { id: "since", header: "Since", accessorFn: (r) => (r as QueueStepRow).since, cell: (c) => day(String(c.getValue())) },
  ],
  disputes: [
    { id: "step", header: "Step", accessorFn: (r) => (r as QueueDisputeRow).stepLabel, cell: (c) => stepLink(c.row.original as QueueDisputeRow) },
    { id: "proof", header: "Proof", accessorFn: (r) => (r as QueueDisputeRow).proofTitle },
    {
      id: "state",
      header: "State",
      accessorFn: (r) => (r as QueueDisputeRow).state,
      cell: (c) => <DisputeStateBadge state={(c.row.original as QueueDisputeRow).state} />,
      filterFn: "equalsString",
    },
    { id: "reviewer", header: "Reviewer", accessorFn: (r) => (r as QueueDisputeRow).reviewerName },
    { id: "revision", header: "Revision", accessorFn: (r) => (r as QueueDisputeRow).revision },
    { id: "since", header: "Since", accessorFn: (r) => (r as QueueDisputeRow).since, cell: (c) => day(String(c.getValue())) },
  ],
  myDisputes: [],
  progress: [
    { id: "reviewer", header: "Reviewer", accessorFn: (r) => (r as ReviewerProgress).reviewerName },
    { id: "proof", header: "Proof", accessorFn: (r) => (r as ReviewerProgress).proofTitle, filterFn: "equalsString" },
    { id: "scope", header: "Scope", accessorFn: (r) => (r as ReviewerProgress).scope },
    { id: "inScope", header: "Steps", accessorFn: (r) => (r as ReviewerProgress).inScope },
    { id: "vouched", header: "Vouched", accessorFn: (r) => (r as ReviewerProgress).vouched },
    { id: "stale", header: "Superseded", accessorFn: (r) => (r as ReviewerProgress).stale },
    { id: "disputes", header: "⚑ Unresolved disputes", accessorFn: (r) => (r as ReviewerProgress).unresolvedDisputes },
    { id: "waiting", header: "Waiting", accessorFn: (r) => (r as ReviewerProgress).waiting },
  ],
};
// A referee's own disputes: the reviewer column would only repeat their own name.
columns.myDisputes = columns.disputes.filter((c) => c.id !== "reviewer");
const facet: Record<Kind, string> = { steps: "reason", disputes: "state", myDisputes: "state", progress: "proof" };

export function QueueTable({ kind, rows, empty, testId }: { kind: Kind; rows: Row[]; empty: string; testId: string }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [globalFilter, setGlobalFilter] = useState("");
  const [facetValue, setFacetValue] = useState("");
  const columnFilters = useMemo(() => (facetValue ? [{ id: facet[kind], value: facetValue }] : []), [facetValue, kind]);
  const table = useReactTable({
    data: rows,
    columns: columns[kind],
    state: { sorting, globalFilter, columnFilters },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const facetColumn = table.getColumn(facet[kind]);
  const options = [...new Set(rows.map((r) => String(facetColumn?.accessorFn?.(r, 0) ?? "")))].sort();
  if (rows.length === 0)
    return (
      <p className="text-sm italic text-stone-500" data-testid={testId}>
        {empty}
      </p>
    );
  return (
    <div className="space-y-2" data-testid={testId}>
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <label>
          Filter <TextInput value={globalFilter} onValue={setGlobalFilter} className="rounded border border-stone-300 px-2 py-1" placeholder="any text" />
        </label>
        <label>
          {String(facetColumn?.columnDef.header)}{" "}
          <Choice
            value={facetValue}
            onChange={(e) => setFacetValue(e.target.value)}
            className="rounded border border-stone-300 px-2 py-1"
            options={[["", "all"], ...options.map((o) => [o, o] as const)]}
          />
        </label>
      </div>
      <SortableTable table={table} label={TABLE_LABEL[kind]} rowTestId="queue-row" />
    </div>
  );
}

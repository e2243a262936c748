"use client";
import { useMemo, useState } from "react";
import { SortableTable } from "@/components/ui/sortable-table";
import Link from "next/link";
import {
  createColumnHelper,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type SortingState,
} from "@tanstack/react-table";
import type { ClaimRowView } from "@/lib/data/claim-lists";
import { VerdictBadge } from "@/components/claims/verdict-badge";
import { compareStepLabels } from "@/lib/proof-tree";
import { ClaimInputsShort, claimInputHref } from "@/components/claims/claim-inputs";

const col = createColumnHelper<ClaimRowView>();
// Step numbers sort as 1.2 < 1.10 < 2.1.

/** Every claim of the proof: sort by any column, filter by kind and verdict, jump to the step. */
export function ClaimsTable({ proofId, claims }: { proofId: number; claims: ClaimRowView[] }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "stepNumber", desc: false }]);
  const [filters, setFilters] = useState<ColumnFiltersState>([]);
  const columns = useMemo(
    () => [
      col.accessor("stepNumber", {
        header: "Step",
        sortingFn: (a, b) => compareStepLabels(a.original.stepNumber, b.original.stepNumber),
        cell: (c) => (
          <Link href={`/proofs/${proofId}/steps/${c.row.original.stepId}`} className="font-mono text-lichen-700 hover:underline">
            {c.getValue()}
          </Link>
        ),
      }),
      col.accessor("caseTitle", { header: "Case" }),
      col.accessor("kind", { header: "Kind", filterFn: "equals", cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
      col.accessor("status", { header: "Verdict", filterFn: "equals", cell: (c) => <VerdictBadge status={c.getValue()} /> }),
      col.accessor("statement", { header: "Claim", cell: (c) => c.getValue() ?? "…" }),
      col.accessor((r) => r.inputs.short, {
        id: "inputs",
        header: "Inputs",
        cell: (c) => (
          <ClaimInputsShort inputs={c.row.original.inputs} download={c.row.original.inputs.large ? claimInputHref(proofId, c.row.original.id) : undefined} />
        ),
      }),
      col.accessor("method", {
        header: "Method",
        cell: (c) => (
          <span className="text-xs">
            {c.getValue() ?? ""}
            {c.row.original.certificateKind && <span className="text-stone-600"> · certificate: {c.row.original.certificateKind}</span>}
          </span>
        ),
      }),
    ],
    [proofId],
  );
  const table = useReactTable({
    data: claims,
    columns,
    state: { sorting, columnFilters: filters },
    onSortingChange: setSorting,
    onColumnFiltersChange: setFilters,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const options = (key: "kind" | "status") => [...new Set(claims.map((c) => c[key]))].sort();
  const filterSelect = (key: "kind" | "status", label: string) => (
    <label className="text-sm">
      {label}{" "}
      <select
        className="rounded border border-stone-300 bg-white px-1 font-mono text-xs"
        value={(table.getColumn(key)?.getFilterValue() as string) ?? ""}
        onChange={(e) => table.getColumn(key)?.setFilterValue(e.target.value || undefined)}
      >
        <option value="">all</option>
        {options(key).map((o) => (
          <option key={o}>{o}</option>
        ))}
      </select>
    </label>
  );
  if (claims.length === 0) return <p className="text-stone-600">No claims in this proof yet.</p>;
  return (
    <div data-testid="claims-table">
      <div className="mb-2 flex flex-wrap gap-4">
        {filterSelect("kind", "Kind")}
        {filterSelect("status", "Verdict")}
        <span className="text-sm text-stone-500">
          {table.getRowModel().rows.length} of {claims.length} claims
        </span>
      </div>
      <SortableTable table={table} label="All claims" rowClassName="align-top" />
    </div>
  );
}

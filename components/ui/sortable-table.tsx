"use client";

import { flexRender, type Table } from "@tanstack/react-table";
import { TableScroll } from "./table-scroll";

/**
 * Renders a @tanstack/react-table instance as a plain table whose headers sort on click. Sorting is
 * announced with aria-sort and shown with an arrow (never colour alone). A wide table scrolls inside its frame.
 * Knows nothing of the data.
 */
export function SortableTable<T>({
  table,
  label,
  rowClassName = "",
  rowTestId,
}: {
  table: Table<T>;
  label: string;
  rowClassName?: string;
  rowTestId?: string;
}) {
  return (
    <TableScroll label={label}>
      <table className="w-full border-collapse text-sm">
        <thead>
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id} className="border-b border-stone-300 text-left">
              {g.headers.map((h) => {
                const sorted = h.column.getIsSorted();
                return (
                  <th key={h.id} className="px-2 py-1" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}>
                    <button type="button" onClick={h.column.getToggleSortingHandler()} className="font-semibold hover:underline">
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      <span aria-hidden="true"> {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                    </button>
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className={`border-b border-stone-100 ${rowClassName}`} data-testid={rowTestId}>
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-2 py-1">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </TableScroll>
  );
}

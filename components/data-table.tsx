"use client";

import { flexRender, type Table } from "@tanstack/react-table";
import { EmptyRow, tableClassName } from "@/components/table";

/**
 * The body of a TanStack table as Hangarleaf shows it: sortable headers as buttons (aria-sort says
 * the order), one row per item, and a line saying so when nothing matches.
 */
export function DataTable<T>({ table, empty, describedBy }: { table: Table<T>; empty: string; describedBy?: string }) {
  const rows = table.getRowModel().rows;
  return (
    <table className={tableClassName} aria-describedby={describedBy}>
      <thead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => {
              const sorted = header.column.getIsSorted();
              return (
                <th key={header.id} scope="col" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}>
                  {header.column.getCanSort() ? (
                    <button
                      type="button"
                      className="inline-flex min-h-11 items-center gap-1 font-bold uppercase"
                      onClick={header.column.getToggleSortingHandler()}
                    >
                      {flexRender(header.column.columnDef.header, header.getContext())}
                      <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                    </button>
                  ) : (
                    flexRender(header.column.columnDef.header, header.getContext())
                  )}
                </th>
              );
            })}
          </tr>
        ))}
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.id}>
            {row.getVisibleCells().map((cell) => (
              <td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
            ))}
          </tr>
        ))}
        {rows.length === 0 ? <EmptyRow columns={table.getVisibleLeafColumns().length}>{empty}</EmptyRow> : null}
      </tbody>
    </table>
  );
}

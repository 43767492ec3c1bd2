import type { ReactNode } from "react";

// No "use client": server pages pass their cell functions straight in, and the client DataTable
// takes the same class and empty row from here.

/** The class of every Hangarleaf table (app/globals.css). */
export const tableClassName = "data-table";

export interface TableColumn<T> {
  header: ReactNode;
  cell: (row: T, index: number) => ReactNode;
  /** Classes of the column's cells, the same for every row or chosen per row. */
  className?: string | ((row: T) => string);
  /** For columns made from a list (one per subject); the position otherwise. */
  key?: string;
}

/** The line a table shows in place of rows when there are none. */
export function EmptyRow({ columns, children }: { columns: number; children: ReactNode }) {
  return (
    <tr>
      <td colSpan={columns}>{children}</td>
    </tr>
  );
}

/**
 * A plain table of rows: one header cell per column (scope="col"), one row per item, and with
 * `empty` a line saying so when there are no rows. A column given as false is left out, for
 * columns only some roles see.
 */
export function Table<T>({
  columns,
  rows,
  rowKey,
  empty,
}: {
  columns: readonly (TableColumn<T> | false)[];
  rows: readonly T[];
  rowKey: (row: T, index: number) => string | number;
  empty?: ReactNode;
}) {
  const shown = columns.filter((c): c is TableColumn<T> => c !== false);
  return (
    <table className={tableClassName}>
      <thead>
        <tr>
          {shown.map((c, i) => (
            <th key={c.key ?? i} scope="col">
              {c.header}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((row, r) => (
          <tr key={rowKey(row, r)}>
            {shown.map((c, i) => (
              <td key={c.key ?? i} className={typeof c.className === "function" ? c.className(row) : c.className}>
                {c.cell(row, r)}
              </td>
            ))}
          </tr>
        ))}
        {rows.length === 0 && empty !== undefined ? <EmptyRow columns={shown.length}>{empty}</EmptyRow> : null}
      </tbody>
    </table>
  );
}

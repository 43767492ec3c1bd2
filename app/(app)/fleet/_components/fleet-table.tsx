"use client";

import {
  createColumnHelper,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type SortingState,
} from "@tanstack/react-table";
import Link from "next/link";
import { useMemo, useState } from "react";
import { DataTable } from "@/components/data-table";
import type { AssetDto } from "@/lib/contracts/fleet";
import { assetKinds, assetKindWords } from "@/lib/domain/fleet/fleet";
import { AssetStatusBadge } from "./asset-status";

const column = createColumnHelper<AssetDto>();

/** The fleet, sortable, filtered by kind and by words of its identifier, model or serial. */
export function FleetTable({ assets }: { assets: AssetDto[] }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [filters, setFilters] = useState<ColumnFiltersState>([]);
  const [words, setWords] = useState("");
  const columns = useMemo(
    () => [
      column.accessor("identifier", {
        header: "Asset",
        cell: (i) => (
          <Link href={`/fleet/${i.row.original.id}`} className="inline-flex min-h-11 items-center font-mono font-bold">
            {i.getValue()}
          </Link>
        ),
      }),
      column.accessor("kind", { header: "Kind", filterFn: "equalsString", cell: (i) => assetKindWords[i.getValue()] }),
      column.accessor("model", { header: "Model" }),
      column.accessor("serial", { header: "Serial", cell: (i) => i.getValue() || "—" }),
      column.accessor("status", { header: "Status", cell: (i) => <AssetStatusBadge status={i.getValue()} /> }),
      column.accessor((a) => (a.installedOn ? a.installedOn.identifier : a.location), {
        id: "where",
        header: "Where",
        cell: (i) => (i.row.original.installedOn ? `On ${i.row.original.installedOn.identifier}` : i.getValue() || "—"),
      }),
      column.accessor("openFindingCount", {
        header: "Open findings",
        cell: (i) => <span className={i.getValue() ? "font-bold text-danger" : ""}>{i.getValue()}</span>,
      }),
    ],
    [],
  );
  const rows = useMemo(() => {
    const w = words.trim().toLowerCase();
    return w ? assets.filter((a) => `${a.identifier} ${a.model} ${a.serial}`.toLowerCase().includes(w)) : assets;
  }, [assets, words]);
  // TanStack Table returns new functions each render by design; the React Compiler lint knows it.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, columnFilters: filters },
    onSortingChange: setSorting,
    onColumnFiltersChange: setFilters,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const kind = (filters.find((f) => f.id === "kind")?.value as string | undefined) ?? "";
  return (
    <div className="flex flex-col gap-3">
      <div className="panel grid gap-3 sm:grid-cols-2" role="search" aria-label="Filter the fleet">
        <label className="field">
          <span className="label">Identifier, model or serial</span>
          <input className="input" value={words} onChange={(e) => setWords(e.target.value)} placeholder="e.g. HL-TR1" />
        </label>
        <label className="field">
          <span className="label">Kind</span>
          <select
            className="input"
            value={kind}
            onChange={(e) =>
              setFilters((f) => [...f.filter((x) => x.id !== "kind"), ...(e.target.value ? [{ id: "kind", value: e.target.value }] : [])])
            }
          >
            <option value="">Every kind</option>
            {assetKinds.map((k) => (
              <option key={k} value={k}>
                {assetKindWords[k]}
              </option>
            ))}
          </select>
        </label>
      </div>
      <div className="panel overflow-x-auto">
        <DataTable table={table} empty="No asset matches." />
      </div>
    </div>
  );
}

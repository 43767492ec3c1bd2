"use client";

import {
  createColumnHelper,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type SortingState,
} from "@tanstack/react-table";
import Link from "next/link";
import { useMemo, useState } from "react";
import { DataTable } from "@/components/data-table";
import { StatusBadge, statusLabel } from "@/components/status-badge";
import type { CardListStatus, CardSummaryDto, SubjectDto } from "@/lib/contracts/cards";
import { useCardList } from "./use-cards";

const column = createColumnHelper<CardSummaryDto>();

export function CardsTable({
  initialCards,
  subjects,
  author,
  initialModel = "",
  scopedFor = null,
}: {
  initialCards: CardSummaryDto[];
  subjects: SubjectDto[];
  author: boolean;
  initialModel?: string;
  /** The aircraft the list was opened for; it says so while the model filter holds. */
  scopedFor?: string | null;
}) {
  const [status, setStatus] = useState<CardListStatus | "">("");
  const { data: cards = [], isFetching, error } = useCardList(status, initialCards);
  const [sorting, setSorting] = useState<SortingState>([{ id: "title", desc: false }]);
  const [filters, setFilters] = useState<ColumnFiltersState>([]);
  const [model, setModel] = useState(initialModel);

  const columns = useMemo(
    () => [
      column.accessor("title", {
        header: "Title",
        filterFn: "includesString",
        cell: (info) => (
          <Link href={`/cards/${info.row.original.id}`} className="inline-flex min-h-11 items-center font-semibold">
            {info.getValue()}
          </Link>
        ),
      }),
      column.accessor("subjectName", { header: "Subject", filterFn: "equalsString", cell: (i) => i.getValue() ?? "—" }),
      column.accessor("ataChapter", { header: "ATA", filterFn: "equalsString", cell: (i) => i.getValue() || "—" }),
      column.accessor((c) => c.applicability.join(", "), { id: "applicability", header: "Applies to", cell: (i) => i.getValue() || "—" }),
      column.accessor("stepCount", { header: "Steps" }),
      column.accessor("status", {
        header: "State",
        cell: (info) => (
          <span className="flex flex-wrap gap-1">
            <StatusBadge kind="card" status={info.getValue()}>
              {info.getValue() === "published" ? `${statusLabel("card", "published")} v${info.row.original.publishedNumber}` : undefined}
            </StatusBadge>
            {info.row.original.hasDraft ? (
              <span className="badge bg-amber-pale text-ink">Draft v{info.row.original.latestNumber} open</span>
            ) : null}
            {info.row.original.openRechecks ? (
              <span className="badge bg-danger-pale text-danger">Recheck {info.row.original.openRechecks}</span>
            ) : null}
          </span>
        ),
      }),
      ...(author ? [column.accessor("ownerName", { header: "Owner", cell: (i) => i.getValue() ?? "—" })] : []),
    ],
    [author],
  );

  const rows = useMemo(
    () => (model ? cards.filter((c) => c.applicability.some((a) => a.toLowerCase().includes(model.toLowerCase()))) : cards),
    [cards, model],
  );
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
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageSize: 25 } },
  });
  const filterValue = (id: string) => (filters.find((f) => f.id === id)?.value as string | undefined) ?? "";
  const setFilter = (id: string, value: string) => setFilters((f) => [...f.filter((x) => x.id !== id), ...(value ? [{ id, value }] : [])]);
  const chapters = [...new Set(cards.map((c) => c.ataChapter).filter(Boolean))].sort();

  return (
    <div className="flex flex-col gap-4">
      {scopedFor && model ? (
        <p className="notice-todo flex flex-wrap items-center gap-3" role="status">
          <span className="mr-auto">
            Showing the cards that apply to {scopedFor} (model {model}).
          </span>
          <button type="button" className="btn btn-secondary" onClick={() => setModel("")}>
            Show every card
          </button>
        </p>
      ) : null}
      <div className="panel grid gap-3 sm:grid-cols-2 lg:grid-cols-5" role="search" aria-label="Filter task cards">
        <label className="field lg:col-span-2">
          <span className="label">Title</span>
          <input
            className="input"
            value={filterValue("title")}
            onChange={(e) => setFilter("title", e.target.value)}
            placeholder="Search by title"
          />
        </label>
        <label className="field">
          <span className="label">Subject</span>
          <select className="input" value={filterValue("subjectName")} onChange={(e) => setFilter("subjectName", e.target.value)}>
            <option value="">All subjects</option>
            {subjects.map((s) => (
              <option key={s.id} value={s.name}>
                {s.name}
              </option>
            ))}
          </select>
        </label>
        <label className="field">
          <span className="label">ATA chapter</span>
          <select className="input" value={filterValue("ataChapter")} onChange={(e) => setFilter("ataChapter", e.target.value)}>
            <option value="">All</option>
            {chapters.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
        </label>
        <label className="field">
          <span className="label">Applies to</span>
          <input className="input" value={model} onChange={(e) => setModel(e.target.value)} placeholder="Model" />
        </label>
        {author ? (
          <label className="field">
            <span className="label">State</span>
            <select className="input" value={status} onChange={(e) => setStatus(e.target.value as CardListStatus | "")}>
              <option value="">Drafts and published</option>
              <option value="published">Published</option>
              <option value="draft">Drafts</option>
              <option value="archived">Archived</option>
            </select>
          </label>
        ) : null}
      </div>
      <p id="cards-count" aria-live="polite" className="hint">
        {error
          ? "The list could not be loaded. Check the connection."
          : isFetching
            ? "Loading…"
            : `${table.getFilteredRowModel().rows.length} cards`}
      </p>
      <div className="panel overflow-x-auto">
        <DataTable table={table} empty="No task cards match." describedBy="cards-count" />
      </div>
      {table.getPageCount() > 1 ? (
        <div className="flex items-center gap-3">
          <button type="button" className="btn btn-secondary" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            Previous
          </button>
          <span>
            Page {table.getState().pagination.pageIndex + 1} of {table.getPageCount()}
          </span>
          <button type="button" className="btn btn-secondary" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next
          </button>
        </div>
      ) : null}
    </div>
  );
}

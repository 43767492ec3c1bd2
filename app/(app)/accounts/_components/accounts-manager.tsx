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
import { useMemo, useState } from "react";
import { DataTable } from "@/components/data-table";
import { StatusBadge, statusLabel, statusesOf } from "@/components/status-badge";
import { ApiError } from "@/lib/client/api";
import { roleLabels, roles, type Role } from "@/lib/domain/access/permissions";
import type { AccountDto } from "@/lib/contracts/accounts";
import { CreateAccountForm } from "./create-account-form";
import { useAccounts, useResendInvitation, useUpdateAccount } from "./use-accounts";

const column = createColumnHelper<AccountDto>();

function formatDate(iso: string | null): string {
  return iso ? new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" }) : "never";
}

export function AccountsManager({ initialAccounts, currentUserId }: { initialAccounts: AccountDto[]; currentUserId: string }) {
  const { data: accounts, isFetching } = useAccounts(initialAccounts);
  const update = useUpdateAccount();
  const resend = useResendInvitation();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [sorting, setSorting] = useState<SortingState>([{ id: "name", desc: false }]);
  const [globalFilter, setGlobalFilter] = useState("");
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);

  const report = (promise: Promise<unknown>, ok: string) =>
    promise
      .then(() => setMessage({ ok: true, text: ok }))
      .catch((error: unknown) => setMessage({ ok: false, text: error instanceof ApiError ? error.message : "That did not work." }));

  const columns = useMemo(
    () => [
      column.accessor("name", {
        header: "Name",
        cell: (info) => (
          <span className="flex flex-col">
            <strong>{info.getValue()}</strong>
            <span className="text-sm text-ink-soft">{info.row.original.email}</span>
          </span>
        ),
      }),
      column.accessor("role", {
        header: "Role",
        filterFn: "equals",
        cell: (info) => {
          const account = info.row.original;
          return (
            <select
              aria-label={`Role of ${account.name}`}
              className="input min-w-36"
              value={account.role}
              disabled={account.id === currentUserId || update.isPending}
              onChange={(event) => {
                const role = event.target.value as Role;
                void report(update.mutateAsync({ id: account.id, role }), `${account.name} is now ${roleLabels[role].toLowerCase()}.`);
              }}
            >
              {roles.map((r) => (
                <option key={r} value={r}>
                  {roleLabels[r]}
                </option>
              ))}
            </select>
          );
        },
      }),
      column.accessor("status", {
        header: "Status",
        filterFn: "equals",
        cell: (info) => <StatusBadge kind="account" status={info.getValue()} />,
      }),
      column.accessor((a) => a.classNames.join(", "), { id: "classes", header: "Classes", cell: (info) => info.getValue() || "—" }),
      column.accessor("lastSignInAt", {
        header: "Last sign-in",
        sortingFn: "datetime",
        sortUndefined: "last",
        cell: (info) => formatDate(info.getValue()),
      }),
      column.display({
        id: "actions",
        header: "Actions",
        cell: (info) => {
          const account = info.row.original;
          if (account.id === currentUserId) return <span className="text-sm text-ink-soft">This is you</span>;
          return (
            <span className="flex flex-wrap gap-2">
              {account.status === "invited" ? (
                <button
                  type="button"
                  className="btn btn-secondary btn-small"
                  onClick={() => void report(resend.mutateAsync(account.id), `A new invitation went to ${account.email}.`)}
                >
                  Resend invitation
                </button>
              ) : null}
              {account.status === "deactivated" ? (
                <button
                  type="button"
                  className="btn btn-secondary btn-small"
                  onClick={() =>
                    void report(update.mutateAsync({ id: account.id, status: "active" }), `${account.name} can sign in again.`)
                  }
                >
                  Reactivate
                </button>
              ) : (
                <button
                  type="button"
                  className="btn btn-danger btn-small"
                  onClick={() => {
                    if (!window.confirm(`Deactivate ${account.name}? They are signed out at once and cannot sign in.`)) return;
                    void report(update.mutateAsync({ id: account.id, status: "deactivated" }), `${account.name} is deactivated.`);
                  }}
                >
                  Deactivate
                </button>
              )}
            </span>
          );
        },
      }),
    ],
    // report closes over setMessage only; the mutations are stable objects per render
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [currentUserId, update.isPending],
  );

  // TanStack Table returns new functions each render by design; the React Compiler lint knows it.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: accounts,
    columns,
    state: { sorting, globalFilter, columnFilters },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    onColumnFiltersChange: setColumnFilters,
    globalFilterFn: (row, _id, value: string) => {
      const needle = value.trim().toLowerCase();
      return !needle || `${row.original.name} ${row.original.email} ${row.original.classNames.join(" ")}`.toLowerCase().includes(needle);
    },
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageSize: 10 } },
  });

  const setFilter = (id: string, value: string) =>
    setColumnFilters((filters) => [...filters.filter((f) => f.id !== id), ...(value ? [{ id, value }] : [])]);
  const filterValue = (id: string) => (columnFilters.find((f) => f.id === id)?.value as string | undefined) ?? "";
  const { pageIndex, pageSize } = table.getState().pagination;
  const shown = table.getFilteredRowModel().rows.length;

  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="accounts-title" className="panel flex flex-col gap-4">
        <h2 id="accounts-title">Everyone</h2>
        <div aria-live="polite">
          {message ? (
            <p className={message.ok ? "notice-ok" : "notice-error"} role="status">
              {message.text}
            </p>
          ) : null}
        </div>
        <div className="grid gap-3 md:grid-cols-[2fr_1fr_1fr]">
          <div className="field">
            <label htmlFor="accounts-search" className="label">
              Find
            </label>
            <input
              id="accounts-search"
              className="input"
              type="search"
              placeholder="Name, e-mail or class"
              value={globalFilter}
              onChange={(e) => setGlobalFilter(e.target.value)}
            />
          </div>
          <div className="field">
            <label htmlFor="accounts-role" className="label">
              Role
            </label>
            <select id="accounts-role" className="input" value={filterValue("role")} onChange={(e) => setFilter("role", e.target.value)}>
              <option value="">All roles</option>
              {roles.map((r) => (
                <option key={r} value={r}>
                  {roleLabels[r]}
                </option>
              ))}
            </select>
          </div>
          <div className="field">
            <label htmlFor="accounts-status" className="label">
              Status
            </label>
            <select
              id="accounts-status"
              className="input"
              value={filterValue("status")}
              onChange={(e) => setFilter("status", e.target.value)}
            >
              <option value="">Any status</option>
              {statusesOf("account").map((value) => (
                <option key={value} value={value}>
                  {statusLabel("account", value)}
                </option>
              ))}
            </select>
          </div>
        </div>
        <div className="overflow-x-auto">
          <DataTable table={table} empty="No account matches." describedBy="accounts-count" />
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <span id="accounts-count" aria-live="polite">
            {shown} {shown === 1 ? "account" : "accounts"}
            {shown > pageSize ? ` · page ${pageIndex + 1} of ${table.getPageCount()}` : ""}
            {isFetching ? " · updating…" : ""}
          </span>
          <span className="ml-auto flex gap-2">
            <button
              type="button"
              className="btn btn-secondary btn-small"
              onClick={() => table.previousPage()}
              disabled={!table.getCanPreviousPage()}
            >
              Previous page
            </button>
            <button
              type="button"
              className="btn btn-secondary btn-small"
              onClick={() => table.nextPage()}
              disabled={!table.getCanNextPage()}
            >
              Next page
            </button>
          </span>
        </div>
      </section>
      <CreateAccountForm />
    </div>
  );
}

import type { Metadata } from "next";
import Link from "next/link";
import { Table } from "@/components/table";
import { requirePageUser } from "@/app/_adapters/session";
import { statusLabel } from "@/components/status-badge";
import type { RunStatus } from "@/lib/domain/runs/fold";
import { listReviewQueue } from "@/lib/server/runs/queries";

export const metadata: Metadata = { title: "Review" };

const tabStatuses: RunStatus[] = ["submitted", "in_progress", "returned", "signed_off"];
const tabs = tabStatuses.map((status) => ({ status, label: statusLabel("run", status, "review") }));

export default async function ReviewPage({ searchParams }: { searchParams: Promise<{ status?: string }> }) {
  const user = await requirePageUser("runs:review", "/review");
  const wanted = (await searchParams).status;
  const status = tabs.find((t) => t.status === wanted)?.status ?? "submitted";
  const runs = await listReviewQueue({ actor: user, status });
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="mr-auto">Review</h1>
        <Link href="/cards" className="btn btn-secondary">
          Assign a task card
        </Link>
      </div>
      <nav aria-label="Runs by status" className="flex flex-wrap gap-2">
        {tabs.map((t) => (
          <Link
            key={t.status}
            href={`/review?status=${t.status}`}
            aria-current={t.status === status ? "page" : undefined}
            className={`btn ${t.status === status ? "btn-primary" : "btn-secondary"}`}
          >
            {t.label}
          </Link>
        ))}
      </nav>
      <div className="panel overflow-x-auto">
        <Table
          rows={runs}
          rowKey={(r) => r.runId}
          empty="No runs here."
          columns={[
            {
              header: "Student",
              cell: (r) => (
                <Link href={`/review/${r.runId}`} className="inline-flex min-h-11 items-center font-semibold">
                  {r.studentName}
                </Link>
              ),
            },
            {
              header: "Task card",
              cell: (r) => (
                <>
                  {r.title} <span className="text-ink-soft">v{r.versionNumber}</span>
                </>
              ),
            },
            { header: "Subject", cell: (r) => r.subjectName ?? "—" },
            { header: "Due", className: (r) => (r.workStatus === "overdue" ? "font-bold text-danger" : ""), cell: (r) => r.dueOn ?? "—" },
            {
              header: "Last change",
              className: "whitespace-nowrap",
              cell: (r) => (r.lastEventAt ? r.lastEventAt.slice(0, 16).replace("T", " ") : "—"),
            },
          ]}
        />
      </div>
    </div>
  );
}

import type { Metadata } from "next";
import Link from "next/link";
import { Table } from "@/components/table";
import { requirePageUser } from "@/app/_adapters/session";
import { statusLabel } from "@/components/status-badge";
import type { RunStatus } from "@/lib/domain/runs/fold";
import { listReviewQueue } from "@/lib/server/runs/queries";
import { listBuyOffCalls } from "@/lib/server/runs/buy-offs";
import { schoolTimeZone } from "@/lib/server/settings";
import { dateTimeIn } from "@/lib/domain/time";

export const metadata: Metadata = { title: "Review" };

const tabStatuses: RunStatus[] = ["submitted", "in_progress", "returned", "signed_off"];
const tabs = tabStatuses.map((status) => ({ status, label: statusLabel("run", status, "review") }));

export default async function ReviewPage({ searchParams }: { searchParams: Promise<{ status?: string; tab?: string }> }) {
  const user = await requirePageUser("runs:review", "/review");
  const wanted = await searchParams;
  const buyOffs = wanted.tab === "buy-offs";
  const status = tabs.find((t) => t.status === wanted.status)?.status ?? "submitted";
  const [runs, points] = await Promise.all([
    buyOffs ? Promise.resolve([]) : listReviewQueue({ actor: user, status }),
    listBuyOffCalls({ actor: user }),
  ]);
  const called = points.filter((p) => p.calledAt).length;
  const zone = await schoolTimeZone();
  const shortTime = (iso: string | null) => (iso ? dateTimeIn(zone, iso) : "—");
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="mr-auto">Review</h1>
        <Link href="/cards" className="btn btn-secondary">
          Assign a task card
        </Link>
      </div>
      <nav aria-label="Runs by status" className="flex flex-wrap gap-2">
        <Link
          href="/review?tab=buy-offs"
          aria-current={buyOffs ? "page" : undefined}
          className={`btn ${buyOffs ? "btn-primary" : "btn-secondary"}`}
        >
          Waiting for buy-off ({points.length}){called ? ` · ${called} called` : ""}
        </Link>
        {tabs.map((t) => (
          <Link
            key={t.status}
            href={`/review?status=${t.status}`}
            aria-current={!buyOffs && t.status === status ? "page" : undefined}
            className={`btn ${!buyOffs && t.status === status ? "btn-primary" : "btn-secondary"}`}
          >
            {t.label}
          </Link>
        ))}
      </nav>
      {buyOffs ? (
        <section aria-label="Inspection points waiting for buy-off" className="panel overflow-x-auto">
          <p className="hint mb-2">
            Inspection points a student has done at the aircraft; the later steps of the card wait for your buy-off. The ones the student
            called you to come first.
          </p>
          <Table
            rows={points}
            rowKey={(p) => `${p.runId}:${p.stepId}`}
            empty="No inspection point is waiting for you."
            columns={[
              {
                header: "Student",
                cell: (p) => (
                  <Link href={`/review/${p.runId}`} className="inline-flex min-h-11 items-center font-semibold">
                    {p.studentName}
                  </Link>
                ),
              },
              {
                header: "Task card",
                cell: (p) => (
                  <>
                    {p.title} <span className="text-ink-soft">v{p.versionNumber}</span>
                  </>
                ),
              },
              { header: "Step", cell: (p) => `Step ${p.stepNumber}` },
              { header: "Where", cell: (p) => p.note || "—" },
              {
                header: "Called",
                className: (p) => (p.calledAt ? "whitespace-nowrap font-bold" : "whitespace-nowrap"),
                cell: (p) => (p.calledAt ? `Called ${shortTime(p.calledAt)}` : `Done ${shortTime(p.lastEventAt)}, not called`),
              },
            ]}
          />
        </section>
      ) : (
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
                cell: (r) => shortTime(r.lastEventAt),
              },
            ]}
          />
        </div>
      )}
    </div>
  );
}

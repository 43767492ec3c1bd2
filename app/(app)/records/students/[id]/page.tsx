import type { Metadata } from "next";
import Link from "next/link";
import { studentCoverage } from "@/lib/server/standard";
import { CoverageSection } from "./_components/coverage-section";
import { AttendanceSection } from "./_components/attendance-section";
import { studentAttendance } from "@/lib/server/attendance";
import { notFound } from "next/navigation";
import { Table } from "@/components/table";
import { can } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { isUuid } from "@/lib/server/http";
import { studentRecord } from "@/lib/server/runs/records";
import { measuredValueLine } from "@/lib/domain/runs/measured";
import { recordHours, revisionsLine, signedAtText } from "@/lib/domain/runs/record-csv";
import { getSchoolSettings } from "@/lib/server/settings";
import { readinessOf } from "@/lib/domain/standard/readiness";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Training record" };

const hours = (minutes: number) => `${recordHours(minutes)} h`;

export default async function StudentRecordPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser("records:view", `/records/students/${id}`);
  if (!isUuid(id)) notFound();
  const record = await studentRecord({ actor: user, studentId: id }).catch(notFoundOnMissing);
  const { timeZone: zone, plannedHours } = await getSchoolSettings();
  const coverage = await studentCoverage({ actor: user, studentId: id }).catch(notFoundOnMissing);
  const attendance = await studentAttendance({ actor: user, studentId: id }).catch(notFoundOnMissing);
  const readiness = readinessOf(coverage, attendance.minutesBySection, plannedHours);
  const own = user.id === id;
  return (
    <div className="flex flex-col gap-5">
      {can(user, "records:view-all") ? (
        <nav aria-label="Breadcrumb">
          <Link href="/records" className="inline-flex min-h-11 items-center">
            Records
          </Link>
        </nav>
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="mr-auto">{own ? "My training record" : `Training record: ${record.student.name}`}</h1>
        <a className="btn btn-secondary" href={`/api/records/students/${id}?format=csv`}>
          Export CSV
        </a>
        <a className="btn btn-secondary" href={`/api/records/students/${id}?format=pdf`} target="_blank" rel="noreferrer">
          Export PDF
        </a>
      </div>
      <dl className="grid gap-3 sm:grid-cols-3">
        {[
          ["Task cards signed off", String(record.totals.signedOff)],
          ["Estimated hours", hours(record.totals.estimatedMinutes)],
          ["Actual hours", hours(record.totals.actualMinutes)],
        ].map(([term, value]) => (
          <div key={term} className="panel">
            <dt className="text-ink-soft">{term}</dt>
            <dd className="text-3xl font-bold">{value}</dd>
          </div>
        ))}
      </dl>
      <CoverageSection coverage={coverage} readiness={readiness} zone={zone} />
      <AttendanceSection attendance={attendance} plannedHours={plannedHours} zone={zone} />
      <section aria-label="Signed off by subject" className="flex flex-col gap-3">
        <h2>Signed off, by curriculum subject</h2>
        {record.subjects.map((s) => (
          <div key={s.subjectName} className="panel overflow-x-auto">
            <h3 className="text-lg font-bold">{s.subjectName}</h3>
            <Table
              rows={s.signedOff}
              rowKey={(c) => c.runId}
              columns={[
                {
                  header: "Task card",
                  cell: (c) => (
                    <>
                      {c.title} <span className="text-ink-soft">v{c.versionNumber}</span>
                    </>
                  ),
                },
                {
                  header: "Manual revisions cited",
                  cell: (c) =>
                    c.revisionsCited.length ? (
                      <ul>
                        {c.revisionsCited.map((r) => (
                          <li key={r.revisionId}>{revisionsLine([r])}</li>
                        ))}
                      </ul>
                    ) : (
                      "—"
                    ),
                },
                {
                  header: "Measured values",
                  cell: (c) =>
                    c.measured.length ? (
                      <ul className="flex flex-col gap-1">
                        {c.measured.map((m) => (
                          <li key={m.stepId} className={m.verdict === "within_limits" ? "" : "font-bold text-danger"}>
                            {measuredValueLine(m)}
                          </li>
                        ))}
                      </ul>
                    ) : (
                      "—"
                    ),
                },
                { header: "Signed off", className: "whitespace-nowrap", cell: (c) => signedAtText(c.signedAt, zone) },
                { header: "By", cell: (c) => c.instructorName },
                { header: "Estimated", cell: (c) => (c.estimatedMinutes != null ? hours(c.estimatedMinutes) : "—") },
                { header: "Actual", cell: (c) => hours(c.actualMinutes) },
              ]}
            />
          </div>
        ))}
        {record.subjects.length === 0 ? <p className="hint">No task card is signed off yet.</p> : null}
      </section>
      <section aria-label="Open work and work sent back for rework" className="panel">
        <h2>Open and sent back for rework</h2>
        <ul className="flex flex-col gap-1">
          {[...record.returned, ...record.open].map((r) => (
            <li key={r.runId}>
              {own ? (
                <a href={`/cart/run?id=${r.runId}`}>{r.title}</a>
              ) : can(user, "runs:review") ? (
                <Link href={`/review/${r.runId}`}>{r.title}</Link>
              ) : (
                r.title
              )}{" "}
              · {r.workStatus.replace("_", " ")}
              {r.dueOn ? ` · due ${r.dueOn}` : ""}
            </li>
          ))}
          {record.open.length + record.returned.length === 0 ? <li className="hint">Nothing open.</li> : null}
        </ul>
      </section>
    </div>
  );
}

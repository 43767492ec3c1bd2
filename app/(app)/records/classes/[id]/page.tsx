import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BarFigure } from "@/components/bar-figure";
import { Table } from "@/components/table";
import { classCoverage } from "@/lib/server/standard";
import { ClassCoverageSection } from "./_components/class-coverage";
import { requirePageUser } from "@/app/_adapters/session";
import { isUuid } from "@/lib/server/http";
import { classRecord } from "@/lib/server/runs/records";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Class progress" };

export default async function ClassRecordPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser("records:view-all", `/records/classes/${id}`);
  if (!isUuid(id)) notFound();
  const record = await classRecord({ actor: user, classId: id }).catch(notFoundOnMissing);
  const coverage = await classCoverage({ actor: user, classId: id }).catch(notFoundOnMissing);
  const totals = record.subjects.map((subject) => {
    const cells = record.students.map((s) => s.bySubject[subject] ?? { signedOff: 0, assigned: 0 });
    return { subject, signedOff: cells.reduce((n, c) => n + c.signedOff, 0), assigned: cells.reduce((n, c) => n + c.assigned, 0) };
  });
  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb">
        <Link href="/records" className="inline-flex min-h-11 items-center">
          Records
        </Link>
      </nav>
      <h1>{record.class.name}: progress</h1>
      <section aria-label="Progress by subject" className="panel overflow-x-auto">
        <h2>Progress by subject</h2>
        {totals.length ? (
          <BarFigure
            title="Signed off of assigned"
            rowHeader="Subject"
            summary={`Task cards signed off of those assigned, per subject: ${totals.map((t) => `${t.subject} ${t.signedOff} of ${t.assigned}`).join("; ")}.`}
            stacked
            rows={totals.map((t) => ({
              label: t.subject,
              values: { signedOff: t.signedOff, open: t.assigned - t.signedOff },
              note: `${t.signedOff}/${t.assigned}`,
            }))}
            series={[
              { key: "signedOff", label: "Signed off", colour: "#1d6a35" },
              { key: "open", label: "Assigned, not signed off", colour: "#e3f0f1" },
            ]}
          />
        ) : (
          <p className="hint">Nothing assigned to this class yet.</p>
        )}
      </section>
      <ClassCoverageSection coverage={coverage} />
      <section aria-label="Students" className="panel overflow-x-auto">
        <h2>Students</h2>
        <Table
          rows={record.students}
          rowKey={(s) => s.id}
          columns={[
            {
              header: "Student",
              cell: (s) => (
                <Link href={`/records/students/${s.id}`} className="inline-flex min-h-11 items-center font-semibold">
                  {s.name}
                </Link>
              ),
            },
            ...record.subjects.map((subject) => ({
              key: `subject:${subject}`,
              header: subject,
              cell: (s: (typeof record.students)[number]) => {
                const cell = s.bySubject[subject];
                return cell ? `${cell.signedOff}/${cell.assigned}` : "—";
              },
            })),
            { header: "Overdue", className: (s) => (s.overdue ? "font-bold text-danger" : ""), cell: (s) => s.overdue },
          ]}
        />
      </section>
    </div>
  );
}

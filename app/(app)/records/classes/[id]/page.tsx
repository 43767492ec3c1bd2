import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Table } from "@/components/table";
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
  const totals = record.subjects.map((subject) => {
    const cells = record.students.map((s) => s.bySubject[subject] ?? { signedOff: 0, assigned: 0 });
    return { subject, signedOff: cells.reduce((n, c) => n + c.signedOff, 0), assigned: cells.reduce((n, c) => n + c.assigned, 0) };
  });
  const barWidth = 520;
  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb">
        <Link href="/records" className="inline-flex min-h-11 items-center">
          Records
        </Link>
      </nav>
      <h1>{record.class.name}: progress</h1>
      <section aria-label="Progress by subject" className="panel overflow-x-auto">
        <h2>Signed off of assigned, by subject</h2>
        {totals.length ? (
          <svg
            role="img"
            aria-label="Bar chart: task cards signed off of those assigned, per subject"
            width={barWidth + 330}
            height={totals.length * 44 + 10}
            className="max-w-full"
          >
            {totals.map((t, i) => {
              const share = t.assigned ? t.signedOff / t.assigned : 0;
              return (
                <g key={t.subject} transform={`translate(0, ${i * 44 + 6})`}>
                  <text x={0} y={22} fontSize={15} fill="#0d1726">
                    {t.subject.length > 28 ? `${t.subject.slice(0, 27)}…` : t.subject}
                  </text>
                  <rect x={230} y={4} width={barWidth} height={28} fill="#e3f0f1" stroke="#3a4657" />
                  <rect x={230} y={4} width={Math.round(barWidth * share)} height={28} fill="#1d6a35" />
                  <text x={240 + barWidth} y={24} fontSize={15} fontWeight={700} fill="#0d1726">
                    {t.signedOff}/{t.assigned}
                  </text>
                </g>
              );
            })}
          </svg>
        ) : (
          <p className="hint">Nothing assigned to this class yet.</p>
        )}
      </section>
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

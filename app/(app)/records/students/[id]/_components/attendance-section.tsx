import { BarFigure } from "@/components/bar-figure";
import { Table } from "@/components/table";
import type { StudentAttendanceDto } from "@/lib/contracts/attendance";
import { attendanceWords, sectionNames } from "@/lib/domain/attendance";
import { dateTimeIn } from "@/lib/domain/time";

const hours = (minutes: number) => `${(minutes / 60).toFixed(1)} h`;

/** Hours attended per section, then each session with the entry that counts (a correction says so). */
export function AttendanceSection({
  attendance,
  plannedHours,
  zone,
}: {
  attendance: StudentAttendanceDto;
  plannedHours: Partial<Record<string, number>>;
  zone: string;
}) {
  if (!attendance.sessions.length) return null;
  const planned = sectionNames.filter((s) => plannedHours[s] !== undefined);
  return (
    <section aria-labelledby="attendance" className="panel flex flex-col gap-3">
      <h2 id="attendance">Attendance and hours</h2>
      <dl className="grid gap-3 sm:grid-cols-3">
        {sectionNames.map((s) => (
          <div key={s}>
            <dt className="text-ink-soft">{s}</dt>
            <dd className="text-2xl font-bold">
              {hours(attendance.minutesBySection[s])}
              {plannedHours[s] !== undefined ? (
                <span className="text-base font-normal text-ink-soft"> of {plannedHours[s]} h planned</span>
              ) : null}
            </dd>
          </div>
        ))}
      </dl>
      {planned.length ? (
        <BarFigure
          title="Hours attended against the plan"
          rowHeader="Section"
          summary={`Hours attended against the school's planned hours: ${planned.map((s) => `${s} ${hours(attendance.minutesBySection[s])} of ${plannedHours[s]} h`).join("; ")}.`}
          rows={planned.map((s) => ({
            label: s,
            values: { attended: Math.round(attendance.minutesBySection[s] / 6) / 10, planned: plannedHours[s]! },
          }))}
          series={[
            { key: "attended", label: "Attended", colour: "#0a5660", unit: " h" },
            { key: "planned", label: "Planned by the school", colour: "#c9ccd1", unit: " h" },
          ]}
        />
      ) : null}
      <Table
        rows={attendance.sessions}
        rowKey={(s) => s.id}
        columns={[
          { header: "Session", cell: (s) => `${s.subject} (${s.className})` },
          { header: "When", cell: (s) => `${dateTimeIn(zone, s.startsAt)} · ${s.section}` },
          {
            header: "Attendance",
            cell: (s) =>
              s.entry
                ? `${attendanceWords[s.entry.status]}, ${s.entry.minutes} of ${s.minutes} min${s.entry.makeup ? `; make-up: ${s.entry.makeup}` : ""}${s.entry.correctionReason ? `; corrected: ${s.entry.correctionReason}` : ""}`
                : "Not marked yet",
            className: (s) => (s.entry?.status === "absent" ? "font-bold text-danger" : ""),
          },
        ]}
      />
    </section>
  );
}

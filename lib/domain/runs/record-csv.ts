// A student's training record as text: the CSV export and the phrases the PDF and the screen share. Pure.
import { dateTimeIn, zoneLabel } from "@/lib/domain/time";
import type { SignOffDto, StudentRecordDto } from "@/lib/contracts/runs";
import { toCsv } from "@/lib/domain/runs/csv";
import { verdictWords } from "@/lib/domain/runs/measured";

export const recordHours = (minutes: number) => (minutes / 60).toFixed(1);

/**
 * A sign-off time as the screens show it, on the school's clock with the zone named: "2026-12-01
 * 08:05 CST". The CSV keeps UTC (its header says so): a spreadsheet compares times without zones.
 */
export const signedAtText = (iso: string, zone = "UTC") => `${dateTimeIn(zone, iso)} ${zoneLabel(zone, new Date(iso))}`;

/** "HT-20 Trainer Maintenance Manual Rev 4, pages 2, 5; …" */
export function revisionsLine(cited: SignOffDto["revisionsCited"]): string {
  return cited
    .map((r) => `${r.manualTitle} ${r.label}${r.pages.length ? `, page${r.pages.length > 1 ? "s" : ""} ${r.pages.join(", ")}` : ""}`)
    .join("; ");
}

export const recordCsvHeader = [
  "Student",
  "Subject",
  "Task card",
  "Version",
  "Revisions cited",
  "Signed off (UTC)",
  "Instructor",
  "Estimated hours",
  "Actual hours",
  "Step",
  "Measured",
  "Value",
  "Limit",
  "Verdict",
  "Tool",
] as const;

/**
 * One line per measured step of each signed-off card (a card that measures nothing has one line,
 * its last six cells empty). Every line carries its card's cells, so a line read alone (filtered
 * on "OUT OF LIMITS", say) still says whose, which version and who signed it; the hours therefore
 * repeat on each line of a card.
 */
export function studentRecordCsv(record: StudentRecordDto): string {
  const rows = record.subjects.flatMap((s) =>
    s.signedOff.flatMap((c) => {
      const card = [
        record.student.name,
        s.subjectName,
        c.title,
        c.versionNumber,
        revisionsLine(c.revisionsCited),
        c.signedAt.slice(0, 16).replace("T", " "),
        c.instructorName,
        c.estimatedMinutes != null ? recordHours(c.estimatedMinutes) : "",
        recordHours(c.actualMinutes),
      ];
      if (!c.measured.length) return [[...card, "", "", "", "", "", ""]];
      return c.measured.map((m) => [
        ...card,
        m.stepNumber,
        m.label,
        m.value ?? "",
        m.limit.text,
        verdictWords[m.verdict],
        m.toolNumber ?? "",
      ]);
    }),
  );
  return toCsv(recordCsvHeader, rows);
}

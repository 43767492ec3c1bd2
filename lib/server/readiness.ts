// A student's readiness for the oral and practical test: coverage, attendance and the school's
// planned hours read together, as JSON, CSV or PDF.
import "server-only";
import { PDFDocument } from "pdf-lib";
import type { Actor } from "@/lib/domain/access/permissions";
import { hoursText, kindWords, coverageWords, readinessOf, type Readiness } from "@/lib/domain/standard/readiness";
import { dayIn } from "@/lib/domain/time";
import { studentAttendance } from "@/lib/server/attendance";
import { CardWriter, embedCardFonts, grey } from "@/lib/server/pdf/card-pdf";
import { getSchoolSettings } from "@/lib/server/settings";
import { studentCoverage } from "@/lib/server/standard";

export async function studentReadiness({ actor, studentId }: { actor: Actor; studentId: string }): Promise<Readiness> {
  const coverage = await studentCoverage({ actor, studentId });
  const [attendance, settings] = await Promise.all([studentAttendance({ actor, studentId }), getSchoolSettings()]);
  return readinessOf(coverage, attendance.minutesBySection, settings.plannedHours);
}

export async function readinessPdf(r: Readiness, printedAt = new Date()): Promise<Uint8Array> {
  const { timeZone } = await getSchoolSettings();
  const doc = await PDFDocument.create();
  doc.setTitle(`Readiness: ${r.student.name}`);
  doc.setProducer("Hangarleaf");
  const fonts = await embedCardFonts(doc);
  const w = new CardWriter(doc, fonts.regular, fonts.bold, `Readiness of ${r.student.name} - printed ${dayIn(timeZone, printedAt)}`);
  w.text("READINESS FOR THE ORAL AND PRACTICAL TEST", { size: 9, bold: true, color: grey });
  w.text(r.student.name, { size: 17, bold: true });
  w.text(
    r.ready
      ? "Every skill element is demonstrated and every planned hour attended."
      : `${r.remaining} element${r.remaining === 1 ? "" : "s"} of the standard still to demonstrate.`,
    { size: 11, bold: true },
  );
  if (r.excerpt)
    w.text("The standard here includes the demo's excerpt, to be verified against the current FAA-S-ACS-1; it is not the whole standard.", {
      size: 9,
      color: grey,
    });
  w.text(
    "The instructor, the school's procedures and the current standard decide when a student is ready; this lists what the records show.",
    {
      size: 9,
      color: grey,
    },
  );
  w.gap(8);
  for (const s of r.sections) {
    w.text(s.section, { size: 13, bold: true });
    const counts = (["skill", "knowledge", "risk"] as const)
      .filter((k) => s.counts[k].total)
      .map((k) => `${kindWords[k]} ${s.counts[k].demonstrated} of ${s.counts[k].total}`)
      .join(" · ");
    if (counts) w.text(`Demonstrated: ${counts}`, { indent: 12 });
    w.text(
      `Attended ${hoursText(s.attendedMinutes)} h${s.plannedHours !== null ? ` of ${s.plannedHours} h planned` : " (no hours planned)"}`,
      { indent: 12 },
    );
    if (!s.remaining.length) w.text("Nothing left to demonstrate in this section.", { indent: 12 });
    for (const e of s.remaining) {
      w.text(`${e.code}  ${e.title}`, { bold: true, indent: 12 });
      w.text(`${kindWords[e.kind]}; ${e.area}. ${coverageWords[e.status]}${e.practisedIn ? `: ${e.practisedIn}` : ""}`, { indent: 24 });
    }
    w.gap(6);
  }
  if (!r.sections.length) w.text("The school has no standard imported yet.");
  w.finish();
  return doc.save();
}

import "server-only";
import { asc, eq } from "drizzle-orm";
import { PDFDocument } from "pdf-lib";
import { getDb } from "@/db";
import { curriculumSubjects, runs, signOffs, taskCardVersions, users } from "@/db/schema";
import type { Actor } from "@/lib/domain/access/permissions";
import type { ClassRecordDto, SignOffDto, StudentRecordDto } from "@/lib/contracts/runs";
import { AppError } from "@/lib/domain/errors";
import { CardWriter, embedCardFonts, grey, markdownToPlain } from "@/lib/server/pdf/card-pdf";
import { measuredValueLine, measuredValues } from "@/lib/domain/runs/measured";
import { recordHours, revisionsLine, signedAtText } from "@/lib/domain/runs/record-csv";
import { dayIn } from "@/lib/domain/time";
import { schoolTimeZone } from "@/lib/server/settings";
import { stepSchema } from "@/lib/domain/validation/cards";
import { foldStoredRuns, listRunsOfStudent } from "@/lib/server/runs/queries";
import { activeStudentsOf, classOfStaff, readsRecordOf } from "@/lib/server/runs/scope";

const noSubject = "No subject";

/** A student's record: students see their own; instructors those of the students they teach; admins anyone's. */
export async function studentRecord({ actor, studentId }: { actor: Actor; studentId: string }): Promise<StudentRecordDto> {
  const db = getDb();
  if (!(await readsRecordOf(db, actor, studentId))) throw new AppError("not_found", "That record was not found.");
  const [student] = await db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role })
    .from(users)
    .where(eq(users.id, studentId));
  if (!student || student.role !== "student") throw new AppError("not_found", "That record was not found.");
  const signed = await db
    .select({
      runId: runs.id,
      title: taskCardVersions.title,
      versionNumber: taskCardVersions.number,
      subjectName: curriculumSubjects.name,
      signedAt: signOffs.signedAt,
      instructorName: users.name,
      estimatedMinutes: taskCardVersions.estimatedMinutes,
      actualMinutes: signOffs.actualMinutes,
      revisionsCited: signOffs.revisionsCited,
      steps: taskCardVersions.steps,
    })
    .from(signOffs)
    .innerJoin(runs, eq(runs.id, signOffs.runId))
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, signOffs.versionId))
    .leftJoin(curriculumSubjects, eq(curriculumSubjects.id, taskCardVersions.subjectId))
    .innerJoin(users, eq(users.id, signOffs.instructorId))
    .where(eq(runs.studentId, studentId))
    .orderBy(asc(curriculumSubjects.name), asc(signOffs.signedAt));
  // The measured values are folded from the events, as the review screen folds them: every signed-off
  // run's events in one read, each folded over its own version's steps.
  const stepsOf = new Map(signed.map((s) => [s.runId, ((s.steps ?? []) as unknown[]).map((step) => stepSchema.parse(step))]));
  const folds = await foldStoredRuns(
    db,
    signed.map((s) => ({ runId: s.runId, steps: stepsOf.get(s.runId)! })),
  );
  const bySubject = new Map<string, StudentRecordDto["subjects"][number]["signedOff"]>();
  for (const { steps: _steps, revisionsCited, ...s } of signed) {
    const steps = stepsOf.get(s.runId)!.map((step) => ({ ...step, text: markdownToPlain(step.text) }));
    const list = bySubject.get(s.subjectName ?? noSubject) ?? [];
    list.push({
      ...s,
      signedAt: s.signedAt.toISOString(),
      revisionsCited: revisionsCited as SignOffDto["revisionsCited"],
      measured: measuredValues(steps, folds.get(s.runId)?.steps ?? {}),
    });
    bySubject.set(s.subjectName ?? noSubject, list);
  }
  const all = await listRunsOfStudent(db, studentId);
  return {
    student: { id: student.id, name: student.name, email: student.email },
    subjects: [...bySubject.entries()].map(([subjectName, signedOff]) => ({ subjectName, signedOff })),
    open: all.filter((r) => r.status === "not_started" || r.status === "in_progress" || r.status === "submitted"),
    returned: all.filter((r) => r.status === "returned"),
    totals: {
      signedOff: signed.length,
      estimatedMinutes: signed.reduce((n, s) => n + (s.estimatedMinutes ?? 0), 0),
      actualMinutes: signed.reduce((n, s) => n + s.actualMinutes, 0),
    },
  };
}

const hours = recordHours;

export async function studentRecordPdf(record: StudentRecordDto, printedAt = new Date()): Promise<Uint8Array> {
  const zone = await schoolTimeZone();
  const doc = await PDFDocument.create();
  doc.setTitle(`Training record: ${record.student.name}`);
  doc.setProducer("Hangarleaf");
  const fonts = await embedCardFonts(doc);
  const w = new CardWriter(doc, fonts.regular, fonts.bold, `Training record of ${record.student.name} - printed ${dayIn(zone, printedAt)}`);
  w.text("TRAINING RECORD", { size: 9, bold: true, color: grey });
  w.text(record.student.name, { size: 17, bold: true });
  w.text(
    `${record.totals.signedOff} task cards signed off · estimated ${hours(record.totals.estimatedMinutes)} h · actual ${hours(record.totals.actualMinutes)} h`,
    { size: 10, color: grey },
  );
  w.gap(8);
  for (const subject of record.subjects) {
    w.text(subject.subjectName, { size: 13, bold: true });
    for (const c of subject.signedOff) {
      w.text(`${c.title} (version ${c.versionNumber})`, { bold: true, indent: 12 });
      w.text(
        `Signed off ${signedAtText(c.signedAt, zone)} by ${c.instructorName}; ${c.estimatedMinutes != null ? `estimated ${hours(c.estimatedMinutes)} h, ` : ""}actual ${hours(c.actualMinutes)} h`,
        { indent: 24 },
      );
      w.text(`Manual revisions cited: ${revisionsLine(c.revisionsCited) || "none"}`, { indent: 24 });
      for (const m of c.measured) w.text(measuredValueLine(m), { indent: 24 });
      w.gap(4);
    }
    w.gap(6);
  }
  if (!record.subjects.length) w.text("No task card is signed off yet.");
  if (record.open.length || record.returned.length) {
    w.gap(6);
    w.text("Open and returned runs", { size: 13, bold: true });
    for (const r of [...record.returned, ...record.open])
      w.text(`${r.title} (version ${r.versionNumber}): ${r.workStatus.replace("_", " ")}${r.dueOn ? `, due ${r.dueOn}` : ""}`, {
        indent: 12,
      });
  }
  w.finish();
  return doc.save();
}

/** A class at a glance: each student's signed-off and assigned cards per subject. */
export async function classRecord({ actor, classId }: { actor: Actor; classId: string }): Promise<ClassRecordDto> {
  const db = getDb();
  const klass = await classOfStaff(db, actor, classId);
  const students = await activeStudentsOf(db, classId);
  const result: ClassRecordDto["students"] = [];
  const subjects = new Set<string>();
  for (const s of students) {
    const work = await listRunsOfStudent(db, s.id);
    const bySubject: ClassRecordDto["students"][number]["bySubject"] = {};
    for (const w of work) {
      const key = w.subjectName ?? noSubject;
      subjects.add(key);
      bySubject[key] ??= { signedOff: 0, assigned: 0 };
      bySubject[key].assigned++;
      if (w.status === "signed_off") bySubject[key].signedOff++;
    }
    result.push({ id: s.id, name: s.name, bySubject, overdue: work.filter((w) => w.workStatus === "overdue").length });
  }
  return { class: klass, subjects: [...subjects].sort(), students: result };
}

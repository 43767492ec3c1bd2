// Demo assignments and runs on the demo cards, so "my work", the review queue and the records have
// something to show on a fresh start. Invented content only. Written straight to the tables (as the
// cards are), with the events a cart would have sent; idempotent: an assignment that exists is kept.
import { randomUUID } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db";
import { assignments, classes, classMembers, manuals, revisions, runEvents, runs, signOffs, taskCardVersions, users } from "@/db/schema";
import { foldRun } from "@/lib/domain/runs/fold";
import { activeMinutes } from "@/lib/domain/runs/hours";
import { stepSchema, type Step } from "@/lib/domain/validation/cards";
import { unitLabel } from "@/lib/domain/calc/units";

type Progress = "none" | "started" | "submitted" | "signed_off";

interface DemoAssignment {
  card: string;
  by: string;
  className?: string;
  students?: string[];
  /** Days from the day the seed runs. */
  dueInDays: number;
  note: string;
  progress: Record<string, Progress>;
}

const demoAssignments: DemoAssignment[] = [
  {
    card: "Riveted splice patch on a practice skin panel",
    by: "instructor@hangarleaf.test",
    className: "AMT Day Cohort 2027",
    dueInDays: -2,
    note: "Sheet metal shop, bench 4",
    progress: { "student2@hangarleaf.test": "submitted", "student3@hangarleaf.test": "signed_off" },
  },
  {
    card: "Aileron control cable tension check",
    by: "instructor@hangarleaf.test",
    className: "AMT Day Cohort 2027",
    dueInDays: 9,
    note: "Hangar 2, trainer HL-TR1",
    progress: { "student3@hangarleaf.test": "started" },
  },
  {
    card: "Fluorescent penetrant inspection of a landing gear fitting",
    by: "instructor@hangarleaf.test",
    students: ["student@hangarleaf.test"],
    dueInDays: 14,
    note: "NDT room",
    progress: { "student@hangarleaf.test": "started" },
  },
  {
    // The tool room's demo lends the landing gear kit for this run and counts it in a tool short (seed-tools.ts).
    card: "Main landing gear inspection on jacks",
    by: "instructor@hangarleaf.test",
    students: ["student2@hangarleaf.test"],
    dueInDays: 5,
    note: "Hangar 1, trainer HL-TR2",
    progress: {},
  },
  {
    // The fleet's demo engine change: E-401 off HL-TR3, E-402 on, recorded from this signed-off run (seed-fleet.ts).
    card: "Turbine engine removal and installation on the stand",
    by: "instructor2@hangarleaf.test",
    students: ["student4@hangarleaf.test"],
    dueInDays: -3,
    note: "Bay 3, HL-TR3: engine change",
    progress: { "student4@hangarleaf.test": "signed_off" },
  },
];

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

/** A value inside the step's limits, written as a student would type it. */
function goodValue(step: Step): string {
  const m = step.measurement!;
  const value = m.nominal ?? (m.min != null && m.max != null ? (m.min + m.max) / 2 : m.min != null ? m.min * 1.2 : m.max! * 0.8);
  return `${Math.round(value * 10000) / 10000} ${unitLabel(m.unit)}`;
}

function eventsFor(steps: Step[], progress: Progress, studentId: string, instructorId: string) {
  // Not started: nothing happened on the cart yet.
  if (progress === "none") return [];
  const start = Date.now() - 3 * 86_400_000;
  let minute = 0;
  const made: Omit<typeof runEvents.$inferInsert, "runId">[] = [];
  const add = (type: string, userId: string, stepId: string | null, payload: Record<string, unknown> = {}) =>
    made.push({ id: randomUUID(), type, userId, stepId, payload, clientTime: new Date(start + (minute += 4) * 60_000) });
  const upTo = progress === "started" ? Math.ceil(steps.length / 2) : steps.length;
  for (const step of steps.slice(0, upTo)) {
    if (step.timerMinutes) {
      add("timer.started", studentId, step.id, { minutes: step.timerMinutes });
      minute += step.timerMinutes;
      add("timer.stopped", studentId, step.id);
    }
    if (step.measurement) add("value.recorded", studentId, step.id, { value: goodValue(step) });
    add("step.checked", studentId, step.id);
    if (step.inspectionPoint && progress === "signed_off") add("inspection.bought_off", instructorId, step.id);
  }
  if (progress === "submitted" || progress === "signed_off") add("run.submitted", studentId, null);
  if (progress === "signed_off") add("run.signed_off", instructorId, null, { comment: "Neat work." });
  return made;
}

/** What a sign-off records of the cited revisions (lib/server/runs/review.ts does the same from the DTO). */
async function revisionsCited(db: Db, steps: Step[]) {
  const refs = steps.flatMap((s) => s.references);
  if (!refs.length) return [];
  const rows = await db
    .select({ id: revisions.id, label: revisions.label, title: manuals.title })
    .from(revisions)
    .innerJoin(manuals, eq(manuals.id, revisions.manualId))
    .where(inArray(revisions.id, [...new Set(refs.map((r) => r.revisionId))]));
  return rows.map((r) => ({
    revisionId: r.id,
    manualTitle: r.title,
    label: r.label,
    pages: [...new Set(refs.filter((x) => x.revisionId === r.id).map((x) => x.page))].sort((a, b) => a - b),
  }));
}

export async function seedRuns(db: Db): Promise<number> {
  const people = new Map((await db.select({ id: users.id, email: users.email, role: users.role }).from(users)).map((u) => [u.email, u]));
  let added = 0;
  for (const a of demoAssignments) {
    const [version] = await db
      .select()
      .from(taskCardVersions)
      .where(and(eq(taskCardVersions.title, a.card), eq(taskCardVersions.number, 1), eq(taskCardVersions.status, "published")));
    const by = people.get(a.by);
    if (!version || !by) continue;
    const [exists] = await db
      .select({ id: assignments.id })
      .from(assignments)
      .where(and(eq(assignments.versionId, version.id), eq(assignments.note, a.note)));
    if (exists) continue;
    const [klass] = a.className ? await db.select({ id: classes.id }).from(classes).where(eq(classes.name, a.className)) : [];
    const studentEmails = a.students ?? [...people.values()].filter((p) => p.role === "student").map((p) => p.email);
    // The class's students, as assignment to a class does it in lib/server/runs/assign.ts.
    const members = klass
      ? (
          await db
            .select({ email: users.email })
            .from(classMembers)
            .innerJoin(users, eq(users.id, classMembers.userId))
            .where(and(eq(classMembers.classId, klass.id), eq(users.role, "student")))
        ).map((r) => r.email)
      : studentEmails;
    const steps = (version.steps as unknown[]).map((s) => stepSchema.parse(s));
    const cited = await revisionsCited(db, steps);
    await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(assignments)
        .values({
          cardId: version.cardId,
          versionId: version.id,
          classId: klass?.id ?? null,
          dueOn: day(a.dueInDays),
          note: a.note,
          assignedBy: by.id,
        })
        .returning({ id: assignments.id });
      for (const email of members) {
        const student = people.get(email)!;
        const progress = a.progress[email] ?? "none";
        const events = eventsFor(steps, progress, student.id, by.id);
        const state = foldRun(
          events.map((e) => ({
            id: e.id!,
            type: e.type as never,
            userId: e.userId,
            stepId: e.stepId ?? null,
            payload: e.payload as Record<string, unknown>,
            clientTime: (e.clientTime as Date).toISOString(),
          })),
          steps.map((s) => ({ id: s.id, inspectionPoint: s.inspectionPoint, measurement: s.measurement, timerMinutes: s.timerMinutes })),
          new Set([by.id]),
        );
        const times = events.map((e) => e.clientTime as Date);
        const [run] = await tx
          .insert(runs)
          .values({
            assignmentId: row!.id,
            studentId: student.id,
            versionId: version.id,
            status: state.status,
            startedAt: times[0] ?? null,
            lastEventAt: times.at(-1) ?? null,
            submittedAt: state.status === "submitted" ? times.at(-1)! : null,
            waitingStepId: state.waitingAt,
            calledAt: state.calledAt ? new Date(state.calledAt) : null,
          })
          .returning({ id: runs.id });
        // The demo's carts were online: each event reached the server as it was made.
        if (events.length)
          await tx.insert(runEvents).values(events.map((e) => ({ ...e, serverTime: e.clientTime as Date, runId: run!.id })));
        if (progress === "signed_off") {
          await tx.insert(signOffs).values({
            runId: run!.id,
            instructorId: by.id,
            versionId: version.id,
            revisionsCited: cited,
            actualMinutes: activeMinutes(events.filter((e) => e.userId === student.id).map((e) => (e.clientTime as Date).toISOString())),
            comment: "Neat work.",
          });
        }
      }
    });
    added++;
  }
  return added;
}

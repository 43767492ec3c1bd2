// Class sessions and their attendance registers. Entries are append-only (a trigger in
// 0017_attendance.sql): the newest entry of a student counts, and once the register is closed a
// change is a correction that must say why. Instructors keep the registers of classes they are
// staff of; admins of every class; a student reads their own.
import "server-only";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { getDb, type Db, type Tx } from "@/db";
import { attendanceEntries, classMembers, classSessions, classes, runs, users } from "@/db/schema";
import type { AttendanceEntryDto, SessionDetailDto, SessionDto, StudentAttendanceDto } from "@/lib/contracts/attendance";
import { can, type Actor } from "@/lib/domain/access/permissions";
import { attendanceStatuses, currentEntries, entryProblem, minutesBySection, type AttendanceStatus } from "@/lib/domain/attendance";
import { AppError } from "@/lib/domain/errors";
import type { attendanceSchema, createSessionSchema } from "@/lib/domain/validation/attendance";
import type { z } from "zod";
import { recordAudit } from "@/lib/server/audit";
import { readsRecordOf } from "@/lib/server/runs/scope";

/** A session as lists show it, without the register's counts. */
const sessionFields = (s: typeof classSessions.$inferSelect, className: string) => ({
  id: s.id,
  classId: s.classId,
  className,
  startsAt: s.startsAt.toISOString(),
  minutes: s.minutes,
  section: s.section,
  subject: s.subject,
  closedAt: s.closedAt?.toISOString() ?? null,
});

const sessionNotFound = () => new AppError("not_found", "That session was not found.");
const recorder = alias(users, "attendance_recorder");

/** Whether the actor keeps this class's registers: an admin, or an instructor who is staff of it. */
async function keepsRegister(db: Db | Tx, actor: Actor, classId: string): Promise<boolean> {
  if (can(actor, "classes:view-all")) return true;
  if (!can(actor, "attendance:take")) return false;
  const [row] = await db
    .select({ id: classMembers.userId })
    .from(classMembers)
    .where(and(eq(classMembers.classId, classId), eq(classMembers.userId, actor.id)));
  return !!row;
}

export async function createSession({ actor, input }: { actor: Actor; input: z.output<typeof createSessionSchema> }) {
  return getDb().transaction(async (tx) => {
    if (!(await keepsRegister(tx, actor, input.classId)))
      throw new AppError("invalid", "Choose a class you teach.", { fields: { classId: "Choose a class you teach." } });
    const [row] = await tx
      .insert(classSessions)
      .values({ ...input, startsAt: new Date(input.startsAt), createdBy: actor.id })
      .returning({ id: classSessions.id });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "session.created",
      subjectType: "class",
      subjectId: input.classId,
      details: { subject: input.subject },
    });
    return { id: row!.id };
  });
}

const toEntry = (e: typeof attendanceEntries.$inferSelect, recordedByName: string): AttendanceEntryDto => ({
  id: e.id,
  userId: e.userId,
  status: e.status as AttendanceStatus,
  minutes: e.minutes,
  makeup: e.makeup,
  makeupRunId: e.makeupRunId,
  correctionReason: e.correctionReason,
  recordedByName,
  recordedAt: e.recordedAt.toISOString(),
});

async function entriesOf(db: Db | Tx, sessionIds: string[], userId?: string) {
  if (!sessionIds.length) return [];
  const rows = await db
    .select({ e: attendanceEntries, by: recorder.name })
    .from(attendanceEntries)
    .innerJoin(recorder, eq(recorder.id, attendanceEntries.recordedBy))
    .where(and(inArray(attendanceEntries.sessionId, sessionIds), userId ? eq(attendanceEntries.userId, userId) : undefined))
    .orderBy(desc(attendanceEntries.recordedAt));
  return rows.map((r) => ({ sessionId: r.e.sessionId, ...toEntry(r.e, r.by) }));
}

async function studentsOf(db: Db | Tx, classId: string) {
  return db
    .select({ userId: users.id, name: users.name })
    .from(classMembers)
    .innerJoin(users, eq(users.id, classMembers.userId))
    .where(and(eq(classMembers.classId, classId), eq(users.role, "student")))
    .orderBy(asc(users.name));
}

/** Sessions of the classes the actor keeps registers of (or of one class), newest first, with the register's counts. */
export async function listSessions({ actor, classId }: { actor: Actor; classId?: string }): Promise<SessionDto[]> {
  const db = getDb();
  const mine = can(actor, "classes:view-all")
    ? undefined
    : inArray(classSessions.classId, db.select({ id: classMembers.classId }).from(classMembers).where(eq(classMembers.userId, actor.id)));
  const rows = await db
    .select({ s: classSessions, className: classes.name })
    .from(classSessions)
    .innerJoin(classes, eq(classes.id, classSessions.classId))
    .where(and(mine, classId ? eq(classSessions.classId, classId) : undefined))
    .orderBy(desc(classSessions.startsAt))
    .limit(500);
  const entries = await entriesOf(
    db,
    rows.map((r) => r.s.id),
  );
  const rosters = new Map<string, number>();
  for (const id of new Set(rows.map((r) => r.s.classId))) rosters.set(id, (await studentsOf(db, id)).length);
  return rows.map(({ s, className }) => {
    const current = currentEntries(entries.filter((e) => e.sessionId === s.id));
    const counts = Object.fromEntries([...attendanceStatuses, "unrecorded"].map((k) => [k, 0])) as SessionDto["counts"];
    for (const e of current.values()) counts[e.status]++;
    counts.unrecorded = Math.max(0, (rosters.get(s.classId) ?? 0) - current.size);
    return { ...sessionFields(s, className), counts };
  });
}

async function loadSession(db: Db | Tx, actor: Actor, id: string, { lock = false } = {}) {
  const query = db.select().from(classSessions).where(eq(classSessions.id, id));
  const [session] = lock ? await query.for("update") : await query;
  if (!session || !(await keepsRegister(db, actor, session.classId))) throw sessionNotFound();
  return session;
}

export async function getSession({ actor, id }: { actor: Actor; id: string }): Promise<SessionDetailDto> {
  const db = getDb();
  const session = await loadSession(db, actor, id);
  const [summary] = (await listSessions({ actor, classId: session.classId })).filter((s) => s.id === id);
  const entries = await entriesOf(db, [id]);
  const roster = await studentsOf(db, session.classId);
  return {
    ...summary!,
    roster: roster.map((s) => {
      const history = entries.filter((e) => e.userId === s.userId);
      return { userId: s.userId, name: s.name, current: history[0] ?? null, history };
    }),
  };
}

/**
 * Takes the register: each entry checked against the session's length and the class's students.
 * An entry that says what the register already says is not written again. Once the register is
 * closed, a change needs its reason and is audited as a correction.
 */
export async function recordAttendance({ actor, id, input }: { actor: Actor; id: string; input: z.output<typeof attendanceSchema> }) {
  await getDb().transaction(async (tx) => {
    const session = await loadSession(tx, actor, id, { lock: true });
    const students = new Set((await studentsOf(tx, session.classId)).map((s) => s.userId));
    const current = currentEntries(await entriesOf(tx, [id]));
    const fields: Record<string, string> = {};
    const rows: (typeof attendanceEntries.$inferInsert)[] = [];
    for (const [i, e] of input.entries.entries()) {
      const minutes = e.minutes ?? (e.status === "present" ? session.minutes : 0);
      const where = `entries.${i}`;
      if (!students.has(e.userId)) {
        fields[where] = "That person is not a student of this class.";
        continue;
      }
      const problem = entryProblem({ status: e.status, minutes }, session.minutes);
      if (problem) {
        fields[where] = problem;
        continue;
      }
      if (e.makeupRunId) {
        const [run] = await tx.select({ studentId: runs.studentId }).from(runs).where(eq(runs.id, e.makeupRunId));
        if (!run || run.studentId !== e.userId) {
          fields[where] = "The make-up run is not this student's.";
          continue;
        }
      }
      const known = current.get(e.userId);
      if (
        known &&
        known.status === e.status &&
        known.minutes === minutes &&
        known.makeup === e.makeup &&
        known.makeupRunId === e.makeupRunId
      )
        continue;
      rows.push({
        sessionId: id,
        userId: e.userId,
        status: e.status,
        minutes,
        makeup: e.makeup,
        makeupRunId: e.makeupRunId,
        correctionReason: session.closedAt ? input.reason : "",
        recordedBy: actor.id,
      });
    }
    if (Object.keys(fields).length) throw new AppError("invalid", Object.values(fields)[0]!, { fields });
    if (!rows.length) return;
    if (session.closedAt && !input.reason)
      throw new AppError("invalid", "The register is closed: say why it is corrected.", {
        fields: { reason: "Say why the closed register is corrected." },
      });
    await tx.insert(attendanceEntries).values(rows);
    await recordAudit(tx, {
      actorId: actor.id,
      action: session.closedAt ? "attendance.corrected" : "attendance.recorded",
      subjectType: "class",
      subjectId: session.classId,
      details: { subject: session.subject, entries: rows.length, ...(session.closedAt ? { reason: input.reason } : {}) },
    });
  });
  return getSession({ actor, id });
}

export async function closeSession({ actor, id }: { actor: Actor; id: string }) {
  await getDb().transaction(async (tx) => {
    const session = await loadSession(tx, actor, id, { lock: true });
    if (session.closedAt) throw new AppError("conflict", "This register is already closed.");
    await tx.update(classSessions).set({ closedAt: new Date(), closedBy: actor.id }).where(eq(classSessions.id, id));
    await recordAudit(tx, {
      actorId: actor.id,
      action: "session.closed",
      subjectType: "class",
      subjectId: session.classId,
      details: { subject: session.subject },
    });
  });
  return getSession({ actor, id });
}

/** A student's sessions (of every class they are in) with the entry that counts, and minutes per section. */
export async function studentAttendance({ actor, studentId }: { actor: Actor; studentId: string }): Promise<StudentAttendanceDto> {
  const db = getDb();
  const [student] = await db.select({ id: users.id, name: users.name, role: users.role }).from(users).where(eq(users.id, studentId));
  if (!student || student.role !== "student" || !(await readsRecordOf(db, actor, studentId)))
    throw new AppError("not_found", "That student was not found.");
  const rows = await db
    .select({ s: classSessions, className: classes.name })
    .from(classSessions)
    .innerJoin(classes, eq(classes.id, classSessions.classId))
    .where(
      inArray(classSessions.classId, db.select({ id: classMembers.classId }).from(classMembers).where(eq(classMembers.userId, studentId))),
    )
    .orderBy(desc(classSessions.startsAt))
    .limit(2000);
  const entries = await entriesOf(
    db,
    rows.map((r) => r.s.id),
    studentId,
  );
  const bySession = new Map<string, AttendanceEntryDto>();
  for (const e of entries) if (!bySession.has(e.sessionId)) bySession.set(e.sessionId, e); // newest first
  return {
    student: { id: student.id, name: student.name },
    minutesBySection: minutesBySection(
      rows.map((r) => r.s),
      bySession,
    ),
    sessions: rows.map(({ s, className }) => ({ ...sessionFields(s, className), entry: bySession.get(s.id) ?? null })),
  };
}

// Assigning a published card version to named students or a whole class.
import "server-only";
import { and, asc, desc, eq, inArray, isNull, ne, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db";
import { assignments, bookings, classes, classMembers, runAssets, runs, taskCards, taskCardVersions, users } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import { can, type Actor } from "@/lib/domain/access/permissions";
import type { AssignmentDetailDto, AssignmentDto } from "@/lib/contracts/runs";
import { runStatusLabels } from "@/lib/domain/vocabulary";
import { AppError } from "@/lib/domain/errors";
import { type RunStatus } from "@/lib/domain/runs/fold";
import { assignableStudents } from "@/lib/server/runs/scope";
import { dayIn } from "@/lib/domain/time";
import { schoolTimeZone } from "@/lib/server/settings";

export interface AssignInput {
  cardId: string;
  versionNumber?: number;
  classId: string | null;
  studentIds: string[];
  dueOn: string | null;
  note: string;
  /** The hangar booking it is done in (its asset is named on each run). */
  bookingId?: string | null;
  confirmDuplicates?: boolean;
}

/** Runs for every student of the class and every student named; a student already on it keeps theirs. */
export async function createAssignment({ actor, input }: { actor: Actor; input: AssignInput }): Promise<{ id: string; runs: number }> {
  return getDb().transaction(async (tx) => {
    const published = await tx
      .select({ id: taskCardVersions.id, number: taskCardVersions.number, title: taskCardVersions.title, archivedAt: taskCards.archivedAt })
      .from(taskCardVersions)
      .innerJoin(taskCards, eq(taskCards.id, taskCardVersions.cardId))
      .where(and(eq(taskCardVersions.cardId, input.cardId), eq(taskCardVersions.status, "published")))
      .orderBy(desc(taskCardVersions.number));
    if (!published.length)
      throw new AppError("invalid", "That card has no published version to assign.", { fields: { cardId: "Publish the card first." } });
    if (published[0]!.archivedAt)
      throw new AppError("invalid", "That card is archived.", { fields: { cardId: "Archived cards cannot be assigned." } });
    const version = input.versionNumber ? published.find((v) => v.number === input.versionNumber) : published[0];
    if (!version)
      throw new AppError("invalid", `Version ${input.versionNumber} of that card is not published.`, {
        fields: { versionNumber: "Not a published version." },
      });
    const [booking] = input.bookingId
      ? await tx
          .select({ id: bookings.id, assetId: bookings.assetId })
          .from(bookings)
          .where(and(eq(bookings.id, input.bookingId), isNull(bookings.cancelledAt)))
      : [];
    if (input.bookingId && !booking)
      throw new AppError("invalid", "That booking was not found or is cancelled.", {
        fields: { bookingId: "Choose a booking in the hangar plan." },
      });

    const studentIds = new Set<string>();
    if (input.classId) {
      const [found] = await tx.select({ id: classes.id }).from(classes).where(eq(classes.id, input.classId));
      const member = can(actor, "classes:view-all")
        ? true
        : (
            await tx
              .select({ u: classMembers.userId })
              .from(classMembers)
              .where(and(eq(classMembers.classId, input.classId), eq(classMembers.userId, actor.id)))
          ).length > 0;
      // An instructor outside the class learns nothing about it, as on the class pages.
      if (!found || !member)
        throw new AppError("invalid", "That class was not found among yours.", { fields: { classId: "Not one of your classes." } });
      const members = await tx
        .select({ id: users.id })
        .from(classMembers)
        .innerJoin(users, eq(users.id, classMembers.userId))
        .where(and(eq(classMembers.classId, input.classId), eq(users.role, "student"), ne(users.status, "deactivated")));
      members.forEach((m) => studentIds.add(m.id));
    }
    if (input.studentIds.length) {
      const named = await tx
        .select({ id: users.id })
        .from(users)
        .where(and(inArray(users.id, input.studentIds), eq(users.role, "student"), ne(users.status, "deactivated")));
      const mine = await assignableStudents(
        tx,
        actor,
        named.map((n) => n.id),
      );
      // Someone else's student is answered like a stranger: an instructor learns nothing of other classes.
      if (named.length !== new Set(input.studentIds).size || mine.size !== named.length) {
        throw new AppError("invalid", "Some of the people chosen are not active students of your classes.", {
          fields: { studentIds: "Only active students of your classes can be assigned." },
        });
      }
      named.forEach((m) => studentIds.add(m.id));
    }
    if (!studentIds.size)
      throw new AppError("invalid", "That class has no active students yet.", { fields: { classId: "No students in it." } });

    // The same card twice on one student's list is nearly always a slip: say who, and assign only
    // when asked again.
    if (!input.confirmDuplicates) {
      const open = await tx
        .select({ name: users.name, status: runs.status, number: taskCardVersions.number })
        .from(runs)
        .innerJoin(assignments, eq(assignments.id, runs.assignmentId))
        .innerJoin(users, eq(users.id, runs.studentId))
        .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
        .where(
          and(
            eq(assignments.cardId, input.cardId),
            isNull(assignments.withdrawnAt),
            ne(runs.status, "signed_off"),
            inArray(runs.studentId, [...studentIds]),
          ),
        )
        .orderBy(asc(users.name));
      if (open.length) {
        const named = open.map((o) => `${o.name} (${runStatusLabels[o.status].toLowerCase()}, version ${o.number})`);
        const list = named.length > 5 ? `${named.slice(0, 5).join(", ")} and ${named.length - 5} more` : named.join(", ");
        const message = `${open.length === 1 ? "This student already has" : `${open.length} of these students already have`} this card open: ${list}. Assign it again anyway?`;
        throw new AppError("conflict", message, { fields: { confirmDuplicates: message } });
      }
    }

    const [assignment] = await tx
      .insert(assignments)
      .values({
        cardId: input.cardId,
        versionId: version.id,
        classId: input.classId,
        dueOn: input.dueOn,
        note: input.note,
        assignedBy: actor.id,
        bookingId: booking?.id ?? null,
      })
      .returning({ id: assignments.id });
    const made = await tx
      .insert(runs)
      .values([...studentIds].map((studentId) => ({ assignmentId: assignment!.id, studentId, versionId: version.id })))
      .onConflictDoNothing()
      .returning({ id: runs.id });
    // Done in a booking: the booked asset is what each run works on, named once for everyone.
    if (booking && made.length)
      await tx
        .insert(runAssets)
        .values(made.map((r) => ({ runId: r.id, assetId: booking.assetId, namedBy: actor.id })))
        .onConflictDoNothing();
    await recordAudit(tx, {
      actorId: actor.id,
      action: "assignment.created",
      subjectType: "assignment",
      subjectId: assignment!.id,
      details: { title: version.title, version: version.number, classId: input.classId, students: studentIds.size, dueOn: input.dueOn },
    });
    return { id: assignment!.id, runs: made.length };
  });
}

/** The assignments an actor manages: made by them, or for a class they are staff of (all, for an admin). */
function managedBy(actor: Actor) {
  return can(actor, "classes:view-all")
    ? undefined
    : sql`(${assignments.assignedBy} = ${actor.id} or ${assignments.classId} in (select class_id from class_members where user_id = ${actor.id}))`;
}

/** Assignments the actor made or that reach a class they are staff of (all, for an admin). */
export async function listAssignments({ actor, cardId, id }: { actor: Actor; cardId?: string; id?: string }): Promise<AssignmentDto[]> {
  const mine = managedBy(actor);
  const rows = await getDb()
    .select({
      id: assignments.id,
      cardId: assignments.cardId,
      title: taskCardVersions.title,
      versionNumber: taskCardVersions.number,
      className: classes.name,
      dueOn: assignments.dueOn,
      note: assignments.note,
      assignedByName: users.name,
      createdAt: assignments.createdAt,
      withdrawnAt: assignments.withdrawnAt,
      withdrawReason: assignments.withdrawReason,
      counts: sql<Record<
        RunStatus,
        number
      > | null>`(select jsonb_object_agg(s.status, s.n) from (select status, count(*)::int as n from runs r where r.assignment_id = ${assignments.id} group by status) s)`,
    })
    .from(assignments)
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, assignments.versionId))
    .leftJoin(classes, eq(classes.id, assignments.classId))
    .leftJoin(users, eq(users.id, assignments.assignedBy))
    .where(and(cardId ? eq(assignments.cardId, cardId) : undefined, id ? eq(assignments.id, id) : undefined, mine))
    .orderBy(desc(assignments.createdAt))
    .limit(200);
  const zero: Record<RunStatus, number> = { not_started: 0, in_progress: 0, submitted: 0, returned: 0, signed_off: 0 };
  return rows.map((r) => ({
    ...r,
    createdAt: r.createdAt.toISOString(),
    withdrawnAt: r.withdrawnAt?.toISOString() ?? null,
    counts: { ...zero, ...(r.counts ?? {}) },
  }));
}

const assignmentNotFound = () => new AppError("not_found", "That assignment was not found.");

/** One assignment with its students; 404 for one the actor does not manage, as for one that does not exist. */
export async function getAssignment({ actor, id }: { actor: Actor; id: string }): Promise<AssignmentDetailDto> {
  const [found] = await listAssignments({ actor, id });
  if (!found) throw assignmentNotFound();
  const students = await getDb()
    .select({ runId: runs.id, studentId: runs.studentId, name: users.name, status: runs.status })
    .from(runs)
    .innerJoin(users, eq(users.id, runs.studentId))
    .where(eq(runs.assignmentId, id))
    .orderBy(asc(users.name));
  return { ...found, students };
}

async function lockManaged(tx: Tx, actor: Actor, id: string) {
  const [row] = await tx
    .select()
    .from(assignments)
    .where(and(eq(assignments.id, id), managedBy(actor)))
    .for("update");
  if (!row) throw assignmentNotFound();
  if (row.withdrawnAt) throw new AppError("conflict", "That assignment was withdrawn; it cannot be changed any more.");
  return row;
}

/** A new due date (later: an extension; none: no due date) and note. A date in the past is refused by the schema. */
export async function updateAssignment({
  actor,
  id,
  dueOn,
  note,
}: {
  actor: Actor;
  id: string;
  dueOn: string | null;
  note: string;
}): Promise<AssignmentDetailDto> {
  await getDb().transaction(async (tx) => {
    const before = await lockManaged(tx, actor, id);
    if (before.dueOn === dueOn && before.note === note) return;
    await tx.update(assignments).set({ dueOn, note, updatedAt: new Date() }).where(eq(assignments.id, id));
    await recordAudit(tx, {
      actorId: actor.id,
      action: "assignment.changed",
      subjectType: "assignment",
      subjectId: id,
      details: { dueOn: { from: before.dueOn, to: dueOn }, note: { from: before.note, to: note } },
    });
  });
  return getAssignment({ actor, id });
}

/**
 * Withdraws an assignment: runs not signed off leave the students' work and the review queues
 * (their events are kept, and new ones are refused with the reason), signed-off runs stay in the
 * records. Nothing is deleted.
 */
export async function withdrawAssignment({
  actor,
  id,
  reason,
}: {
  actor: Actor;
  id: string;
  reason: string;
}): Promise<AssignmentDetailDto> {
  await getDb().transaction(async (tx) => {
    await lockManaged(tx, actor, id);
    await tx
      .update(assignments)
      .set({ withdrawnAt: new Date(), withdrawnBy: actor.id, withdrawReason: reason, updatedAt: new Date() })
      .where(eq(assignments.id, id));
    const counts = await tx
      .select({ status: runs.status, n: sql<number>`count(*)::int` })
      .from(runs)
      .where(eq(runs.assignmentId, id))
      .groupBy(runs.status);
    await recordAudit(tx, {
      actorId: actor.id,
      action: "assignment.withdrawn",
      subjectType: "assignment",
      subjectId: id,
      details: { reason, runs: Object.fromEntries(counts.map((c) => [c.status, c.n])) },
    });
  });
  return getAssignment({ actor, id });
}

/** Refuses new work on a run whose assignment was withdrawn (409), saying when and why. */
export async function assertNotWithdrawn(db: Db | Tx, assignmentId: string) {
  const [row] = await db
    .select({ at: assignments.withdrawnAt, reason: assignments.withdrawReason, by: users.name })
    .from(assignments)
    .leftJoin(users, eq(users.id, assignments.withdrawnBy))
    .where(eq(assignments.id, assignmentId));
  if (row?.at) {
    const reason = row.reason.replace(/[.!?]+$/, "");
    const on = dayIn(await schoolTimeZone(), row.at);
    throw new AppError(
      "conflict",
      `This assignment was withdrawn${row.by ? ` by ${row.by}` : ""} on ${on}${reason ? `: ${reason}` : ""}. The work already done is kept.`,
    );
  }
}

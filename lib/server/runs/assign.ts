// Assigning a published card version to named students or a whole class.
import "server-only";
import { and, desc, eq, inArray, ne, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { assignments, classes, classMembers, runs, taskCards, taskCardVersions, users } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import { can, type Actor } from "@/lib/domain/access/permissions";
import type { AssignmentDto } from "@/lib/contracts/runs";
import { AppError } from "@/lib/domain/errors";
import { type RunStatus } from "@/lib/domain/runs/fold";
import { assignableStudents } from "@/lib/server/runs/scope";

export interface AssignInput {
  cardId: string;
  versionNumber?: number;
  classId: string | null;
  studentIds: string[];
  dueOn: string | null;
  note: string;
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

    const [assignment] = await tx
      .insert(assignments)
      .values({
        cardId: input.cardId,
        versionId: version.id,
        classId: input.classId,
        dueOn: input.dueOn,
        note: input.note,
        assignedBy: actor.id,
      })
      .returning({ id: assignments.id });
    const made = await tx
      .insert(runs)
      .values([...studentIds].map((studentId) => ({ assignmentId: assignment!.id, studentId, versionId: version.id })))
      .onConflictDoNothing()
      .returning({ id: runs.id });
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

/** Assignments the actor made or that reach a class they are staff of (all, for an admin). */
export async function listAssignments({ actor, cardId }: { actor: Actor; cardId?: string }): Promise<AssignmentDto[]> {
  const mine = can(actor, "classes:view-all")
    ? undefined
    : sql`(${assignments.assignedBy} = ${actor.id} or ${assignments.classId} in (select class_id from class_members where user_id = ${actor.id}))`;
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
      counts: sql<Record<
        RunStatus,
        number
      > | null>`(select jsonb_object_agg(s.status, s.n) from (select status, count(*)::int as n from runs r where r.assignment_id = ${assignments.id} group by status) s)`,
    })
    .from(assignments)
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, assignments.versionId))
    .leftJoin(classes, eq(classes.id, assignments.classId))
    .leftJoin(users, eq(users.id, assignments.assignedBy))
    .where(and(cardId ? eq(assignments.cardId, cardId) : undefined, mine))
    .orderBy(desc(assignments.createdAt))
    .limit(200);
  const zero: Record<RunStatus, number> = { not_started: 0, in_progress: 0, submitted: 0, returned: 0, signed_off: 0 };
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), counts: { ...zero, ...(r.counts ?? {}) } }));
}

import "server-only";
import { and, asc, eq, ne, sql, type SQL } from "drizzle-orm";
import type { Db, Tx } from "@/db";
import { assignments, classes, classMembers, runs, users } from "@/db/schema";
import { can, type Actor } from "@/lib/domain/access/permissions";
import { AppError } from "@/lib/domain/errors";

// Whose work an instructor may review, buy off, sign off and read records of: the students of the
// classes they are staff of, and the runs of assignments they made themselves. An admin reaches
// every class. Everywhere else the answer is "not found", as for a student's run to another student.

/** Ids of the students who share a class with the actor. */
const studentsOfMyClasses = (actor: Actor) =>
  sql`(select s.user_id from class_members s join class_members me on me.class_id = s.class_id where me.user_id = ${actor.id})`;

/**
 * A condition on a query that joins `runs` and `assignments`: the runs the actor reviews. Undefined
 * (no condition) for an admin.
 */
export function reviewScope(actor: Actor): SQL | undefined {
  if (can(actor, "classes:view-all")) return undefined;
  return sql`(${assignments.assignedBy} = ${actor.id} or ${runs.studentId} in ${studentsOfMyClasses(actor)})`;
}

/** Whether the actor reviews this run (they have the role, and it is in their scope). */
export async function reviewsRun(db: Db | Tx, actor: Actor, run: { studentId: string; assignmentId: string }): Promise<boolean> {
  if (!can(actor, "runs:review")) return false;
  if (can(actor, "classes:view-all")) return true;
  const result = await db.execute<{ ok: boolean }>(
    sql`select (exists (select 1 from assignments a where a.id = ${run.assignmentId} and a.assigned_by = ${actor.id})
            or ${run.studentId} in ${studentsOfMyClasses(actor)}) as ok`,
  );
  return result.rows[0]?.ok === true;
}

/** Whether the actor may read this student's record: their own, or a student they review. */
export async function readsRecordOf(db: Db | Tx, actor: Actor, studentId: string): Promise<boolean> {
  if (studentId === actor.id) return true;
  if (!can(actor, "records:view-all")) return false;
  if (can(actor, "classes:view-all")) return true;
  const result = await db.execute<{ ok: boolean }>(
    sql`select (${studentId} in ${studentsOfMyClasses(actor)}
            or exists (select 1 from runs r join assignments a on a.id = r.assignment_id where r.student_id = ${studentId} and a.assigned_by = ${actor.id})) as ok`,
  );
  return result.rows[0]?.ok === true;
}

/** Of these students, the ones the actor may assign work to (all for an admin). */
export async function assignableStudents(db: Db | Tx, actor: Actor, studentIds: string[]): Promise<Set<string>> {
  if (can(actor, "classes:view-all")) return new Set(studentIds);
  if (!studentIds.length) return new Set();
  const result = await db.execute<{ id: string }>(
    sql`select user_id as id from class_members where class_id in (select class_id from class_members where user_id = ${actor.id})
        and user_id in (${sql.join(
          studentIds.map((id) => sql`${id}::uuid`),
          sql`, `,
        )})`,
  );
  return new Set(result.rows.map((r) => r.id));
}

/** The class, when the actor reads its records: an instructor who is its staff, or an admin. 404 otherwise. */
export async function classOfStaff(db: Db | Tx, actor: Actor, classId: string): Promise<{ id: string; name: string }> {
  const [klass] = await db.select({ id: classes.id, name: classes.name }).from(classes).where(eq(classes.id, classId));
  const member =
    klass &&
    can(actor, "records:view-all") &&
    (can(actor, "classes:view-all") ||
      (
        await db
          .select({ id: classMembers.userId })
          .from(classMembers)
          .where(and(eq(classMembers.classId, classId), eq(classMembers.userId, actor.id)))
      ).length > 0);
  if (!klass || !member) throw new AppError("not_found", "That class was not found.");
  return klass;
}

/** The class's students who are not deactivated, by name. */
export function activeStudentsOf(db: Db | Tx, classId: string) {
  return db
    .select({ id: users.id, name: users.name })
    .from(classMembers)
    .innerJoin(users, eq(users.id, classMembers.userId))
    .where(and(eq(classMembers.classId, classId), eq(users.role, "student"), ne(users.status, "deactivated")))
    .orderBy(asc(users.name));
}

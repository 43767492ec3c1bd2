import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { classes, classMembers, users } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import { can, type Actor } from "@/lib/domain/access/permissions";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";

const isUniqueViolation = (error: unknown) => databaseErrorCode(error) === "23505";

const nameTaken = (name: string) =>
  new AppError("conflict", `A class named "${name}" already exists.`, { fields: { name: "Already in use." } });

/** Admins see every class; instructors the classes they are members of. */
export async function listClasses({ actor }: { actor: Actor }) {
  const db = getDb();
  const seesAll = can(actor, "classes:view-all");
  const rows = await db
    .select({
      id: classes.id,
      name: classes.name,
      description: classes.description,
      startsOn: classes.startsOn,
      endsOn: classes.endsOn,
      students: sql<number>`count(${users.id}) filter (where ${users.role} = 'student')`.mapWith(Number),
      staff: sql<number>`count(${users.id}) filter (where ${users.role} <> 'student')`.mapWith(Number),
    })
    .from(classes)
    .leftJoin(classMembers, eq(classMembers.classId, classes.id))
    .leftJoin(users, eq(users.id, classMembers.userId))
    .where(seesAll ? undefined : sql`exists (select 1 from ${classMembers} m where m.class_id = ${classes.id} and m.user_id = ${actor.id})`)
    .groupBy(classes.id)
    .orderBy(asc(classes.name));
  return rows;
}

export async function getClassById({ actor, id }: { actor: Actor; id: string }) {
  const db = getDb();
  const [row] = await db.select().from(classes).where(eq(classes.id, id)).limit(1);
  if (!row) throw new AppError("not_found", "That class was not found.");
  const members = await db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, status: users.status })
    .from(classMembers)
    .innerJoin(users, eq(users.id, classMembers.userId))
    .where(eq(classMembers.classId, id))
    .orderBy(asc(users.role), asc(users.name));
  // An instructor outside the class learns nothing about it, not even that it exists.
  if (!can(actor, "classes:view-all") && !members.some((m) => m.id === actor.id)) {
    throw new AppError("not_found", "That class was not found.");
  }
  return { ...row, members };
}

export async function createClass({
  actor,
  input,
}: {
  actor: Actor;
  input: { name: string; description: string; startsOn: string | null; endsOn: string | null };
}) {
  try {
    return await getDb().transaction(async (tx) => {
      const [created] = await tx.insert(classes).values(input).returning();
      if (!created) throw new AppError("internal");
      await recordAudit(tx, {
        actorId: actor.id,
        action: "class.created",
        subjectType: "class",
        subjectId: created.id,
        details: { name: created.name },
      });
      return created;
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw nameTaken(input.name);
    throw error;
  }
}

export async function updateClass({
  actor,
  id,
  changes,
}: {
  actor: Actor;
  id: string;
  changes: { name?: string; description?: string; startsOn?: string | null; endsOn?: string | null };
}) {
  try {
    return await getDb().transaction(async (tx) => {
      const [current] = await tx.select().from(classes).where(eq(classes.id, id)).for("update");
      if (!current) throw new AppError("not_found", "That class was not found.");
      const next = { ...current, ...Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined)) };
      if (next.startsOn && next.endsOn && next.startsOn > next.endsOn) {
        throw new AppError("invalid", "The class cannot end before it starts.", { fields: { endsOn: "Ends before it starts." } });
      }
      const [updated] = await tx
        .update(classes)
        .set({ name: next.name, description: next.description, startsOn: next.startsOn, endsOn: next.endsOn })
        .where(eq(classes.id, id))
        .returning();
      await recordAudit(tx, { actorId: actor.id, action: "class.updated", subjectType: "class", subjectId: id, details: changes });
      return updated;
    });
  } catch (error) {
    if (isUniqueViolation(error) && changes.name) throw nameTaken(changes.name);
    throw error;
  }
}

export async function addClassMembers({ actor, classId, userIds }: { actor: Actor; classId: string; userIds: string[] }) {
  return getDb().transaction(async (tx) => {
    const [found] = await tx.select({ id: classes.id }).from(classes).where(eq(classes.id, classId)).limit(1);
    if (!found) throw new AppError("not_found", "That class was not found.");
    const unique = [...new Set(userIds)];
    const known = await tx.select({ id: users.id }).from(users).where(inArray(users.id, unique));
    if (known.length !== unique.length) {
      throw new AppError("invalid", "Some of the chosen accounts do not exist.", { fields: { userIds: "Unknown account." } });
    }
    const added = await tx
      .insert(classMembers)
      .values(unique.map((userId) => ({ classId, userId })))
      .onConflictDoNothing()
      .returning({ userId: classMembers.userId });
    if (added.length) {
      await recordAudit(tx, {
        actorId: actor.id,
        action: "class.members_added",
        subjectType: "class",
        subjectId: classId,
        details: { userIds: added.map((a) => a.userId) },
      });
    }
    return { added: added.length };
  });
}

export async function removeClassMember({ actor, classId, userId }: { actor: Actor; classId: string; userId: string }) {
  return getDb().transaction(async (tx) => {
    const removed = await tx
      .delete(classMembers)
      .where(and(eq(classMembers.classId, classId), eq(classMembers.userId, userId)))
      .returning({ userId: classMembers.userId });
    if (!removed.length) throw new AppError("not_found", "That person is not in this class.");
    await recordAudit(tx, {
      actorId: actor.id,
      action: "class.member_removed",
      subjectType: "class",
      subjectId: classId,
      details: { userId },
    });
    return { removed: 1 };
  });
}

/** The classes a person belongs to, for their home page. */
export async function listClassesOfUser({ userId }: { userId: string }) {
  return getDb()
    .select({ id: classes.id, name: classes.name, startsOn: classes.startsOn, endsOn: classes.endsOn })
    .from(classMembers)
    .innerJoin(classes, eq(classes.id, classMembers.classId))
    .where(eq(classMembers.userId, userId))
    .orderBy(asc(classes.name));
}

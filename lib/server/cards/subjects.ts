// The school's curriculum subjects cards are filed under.
import "server-only";
import { asc, eq } from "drizzle-orm";
import { getDb } from "@/db";
import { curriculumSubjects } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import { type Actor } from "@/lib/domain/access/permissions";
import type { SubjectDto } from "@/lib/contracts/cards";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";

export async function listSubjects(): Promise<SubjectDto[]> {
  return getDb()
    .select({ id: curriculumSubjects.id, name: curriculumSubjects.name })
    .from(curriculumSubjects)
    .orderBy(asc(curriculumSubjects.name));
}

export async function createSubject({ actor, name }: { actor: Actor; name: string }): Promise<SubjectDto> {
  try {
    return await getDb().transaction(async (tx) => {
      const [row] = await tx
        .insert(curriculumSubjects)
        .values({ name })
        .returning({ id: curriculumSubjects.id, name: curriculumSubjects.name });
      await recordAudit(tx, {
        actorId: actor.id,
        action: "subject.created",
        subjectType: "subject",
        subjectId: row!.id,
        details: { name },
      });
      return row!;
    });
  } catch (error) {
    if (databaseErrorCode(error) === "23505") {
      throw new AppError("conflict", `A subject named "${name}" already exists.`, { fields: { name: "Already in the list." } });
    }
    throw error;
  }
}

export async function renameSubject({ actor, id, name }: { actor: Actor; id: string; name: string }): Promise<SubjectDto> {
  try {
    return await getDb().transaction(async (tx) => {
      const [row] = await tx
        .update(curriculumSubjects)
        .set({ name })
        .where(eq(curriculumSubjects.id, id))
        .returning({ id: curriculumSubjects.id, name: curriculumSubjects.name });
      if (!row) throw new AppError("not_found", "That subject was not found.");
      await recordAudit(tx, { actorId: actor.id, action: "subject.renamed", subjectType: "subject", subjectId: id, details: { name } });
      return row;
    });
  } catch (error) {
    if (databaseErrorCode(error) === "23505") {
      throw new AppError("conflict", `A subject named "${name}" already exists.`, { fields: { name: "Already in the list." } });
    }
    throw error;
  }
}

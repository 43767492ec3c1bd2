// Bookmarks and notes on manual pages. A mark stays on the revision and page it was made on; when
// a later revision is read, it is followed there through the page comparisons (the same content,
// moved, changed since, or removed), so a bookmark never silently points at other content.
import "server-only";
import { and, asc, eq, inArray, or, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { classMembers, classes, pageMarks, revisions, users } from "@/db/schema";
import type { PageMarkDto } from "@/lib/contracts/marks";
import { can, type Actor } from "@/lib/domain/access/permissions";
import { AppError } from "@/lib/domain/errors";
import type { MarkKind } from "@/lib/domain/validation/library";
import { pageInRevision } from "@/lib/server/revisions/follow";

const maxMarksPerManual = 500;

/** The actor's own marks on the manual and the notes shown to their classes, placed in `revisionId`. */
export async function listMarks({
  actor,
  manualId,
  revisionId,
}: {
  actor: Actor;
  manualId: string;
  revisionId: string;
}): Promise<PageMarkDto[]> {
  const db = getDb();
  const myClasses = db.select({ id: classMembers.classId }).from(classMembers).where(eq(classMembers.userId, actor.id));
  const rows = await db
    .select({
      mark: pageMarks,
      authorName: users.name,
      className: classes.name,
      revisionLabel: revisions.label,
    })
    .from(pageMarks)
    .innerJoin(users, eq(users.id, pageMarks.userId))
    .innerJoin(revisions, eq(revisions.id, pageMarks.revisionId))
    .leftJoin(classes, eq(classes.id, pageMarks.classId))
    .where(
      and(
        eq(pageMarks.manualId, manualId),
        or(eq(pageMarks.userId, actor.id), and(eq(pageMarks.kind, "note"), inArray(pageMarks.classId, myClasses))),
      ),
    )
    .orderBy(asc(pageMarks.createdAt))
    .limit(maxMarksPerManual * 2);
  // One comparison walk per (revision, page): marks on the same page share it.
  const placed = new Map<string, PageMarkDto["here"]>();
  const place = async (from: string, page: number): Promise<PageMarkDto["here"]> => {
    if (from === revisionId) return { page, status: "unchanged" };
    const key = `${from}:${page}`;
    if (!placed.has(key)) {
      const followed = await pageInRevision(from, page, revisionId);
      placed.set(
        key,
        followed
          ? {
              page: followed.page,
              status: followed.page === null ? "removed" : followed.status === "removed" ? "removed" : followed.status,
            }
          : null,
      );
    }
    return placed.get(key)!;
  };
  const out: PageMarkDto[] = [];
  for (const r of rows) {
    out.push({
      id: r.mark.id,
      kind: r.mark.kind as MarkKind,
      text: r.mark.text,
      authorName: r.authorName,
      mine: r.mark.userId === actor.id,
      className: r.className,
      made: { revisionId: r.mark.revisionId, revisionLabel: r.revisionLabel, page: r.mark.pageNumber },
      here: await place(r.mark.revisionId, r.mark.pageNumber),
      createdAt: r.mark.createdAt.toISOString(),
    });
  }
  return out;
}

export async function addMark({
  actor,
  input,
}: {
  actor: Actor;
  input: { revisionId: string; page: number; kind: MarkKind; text: string; classId: string | null };
}): Promise<{ id: string }> {
  return getDb().transaction(async (tx) => {
    const [revision] = await tx
      .select({ manualId: revisions.manualId, status: revisions.status, pageCount: revisions.pageCount })
      .from(revisions)
      .where(eq(revisions.id, input.revisionId));
    if (!revision || revision.status !== "ready")
      throw new AppError("invalid", "That revision is not in the library.", { fields: { revisionId: "Unknown revision." } });
    if (revision.pageCount !== null && input.page > revision.pageCount)
      throw new AppError("invalid", `This revision has ${revision.pageCount} pages.`, { fields: { page: "No such page." } });
    if (input.classId) {
      // Shown to a class: only its staff (an instructor who is a member) or an admin.
      const staff =
        can(actor, "classes:view-all") ||
        (actor.role === "instructor" &&
          (
            await tx
              .select({ u: classMembers.userId })
              .from(classMembers)
              .where(and(eq(classMembers.classId, input.classId), eq(classMembers.userId, actor.id)))
          ).length > 0);
      if (!staff)
        throw new AppError("invalid", "A note can be shown only to a class you teach.", {
          fields: { classId: "Not one of your classes." },
        });
    }
    const [{ n }] = (
      await tx.execute<{ n: number }>(
        sql`select count(*)::int as n from page_marks where user_id = ${actor.id} and manual_id = ${revision.manualId}`,
      )
    ).rows as [{ n: number }];
    if (n >= maxMarksPerManual)
      throw new AppError("conflict", `You have ${maxMarksPerManual} marks in this manual already; remove some first.`);
    // One bookmark per page is enough: a second press says it is there.
    if (input.kind === "bookmark") {
      const [existing] = await tx
        .select({ id: pageMarks.id })
        .from(pageMarks)
        .where(
          and(
            eq(pageMarks.userId, actor.id),
            eq(pageMarks.revisionId, input.revisionId),
            eq(pageMarks.pageNumber, input.page),
            eq(pageMarks.kind, "bookmark"),
          ),
        );
      if (existing) return existing;
    }
    const [made] = await tx
      .insert(pageMarks)
      .values({
        userId: actor.id,
        manualId: revision.manualId,
        revisionId: input.revisionId,
        pageNumber: input.page,
        kind: input.kind,
        text: input.text,
        classId: input.classId,
      })
      .returning({ id: pageMarks.id });
    return made!;
  });
}

/** Removes one's own mark; another person's is answered as not found. */
export async function removeMark({ actor, id }: { actor: Actor; id: string }) {
  const gone = await getDb()
    .delete(pageMarks)
    .where(and(eq(pageMarks.id, id), eq(pageMarks.userId, actor.id)))
    .returning({ id: pageMarks.id });
  if (!gone.length) throw new AppError("not_found", "That bookmark or note was not found.");
}

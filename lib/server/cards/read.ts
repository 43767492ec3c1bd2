// Reading cards: the list, one card with its versions, one version, as the API sends them.
import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db";
import { citationRechecks, curriculumSubjects, manuals, revisions, taskCards, taskCardVersions, users } from "@/db/schema";
import { type Actor } from "@/lib/domain/access/permissions";
import type { CardDto, CardListStatus, CardSummaryDto, CardVersionDto, ReferenceDto, StepDto } from "@/lib/contracts/cards";
import { AppError } from "@/lib/domain/errors";
import { cardProblems, sortNotices, stepSchema } from "@/lib/domain/validation/cards";
import { notFound, isAuthor, editsCard, coauthorsOf } from "@/lib/server/cards/access";

/** Card list rows. Students see published, unarchived cards as they were last published. */
export async function listCards({
  actor,
  filters = {},
}: {
  actor: Actor;
  filters?: { status?: CardListStatus; subject?: string; ata?: string; model?: string; q?: string };
}): Promise<CardSummaryDto[]> {
  const author = isAuthor(actor);
  const conditions = [sql`true`];
  if (!author) conditions.push(sql`c.archived_at is null`);
  if (filters.status === "archived") conditions.push(sql`c.archived_at is not null`);
  else if (filters.status) conditions.push(sql`c.archived_at is null`);
  if (filters.status === "draft") conditions.push(sql`lv.status = 'draft'`);
  if (filters.status === "published") conditions.push(sql`pv.number is not null`);
  if (!filters.status && author) conditions.push(sql`c.archived_at is null`);
  if (filters.subject) conditions.push(sql`lv.subject_id = ${filters.subject}`);
  if (filters.ata) conditions.push(sql`lv.ata_chapter = ${filters.ata}`);
  if (filters.model) conditions.push(sql`exists (select 1 from unnest(lv.applicability) a where lower(a) = lower(${filters.model}))`);
  if (filters.q) conditions.push(sql`lv.title ilike ${"%" + filters.q.replace(/[\\%_]/g, (c) => "\\" + c) + "%"}`);

  const result = await getDb().execute<{
    id: string;
    archived_at: Date | null;
    owner_name: string | null;
    number: number;
    status: "draft" | "published";
    title: string;
    ata_chapter: string;
    applicability: string[];
    subject_id: string | null;
    subject_name: string | null;
    step_count: number;
    updated_at: Date;
    published_number: number | null;
    open_rechecks: number;
  }>(sql`
    select c.id, c.archived_at, u.name as owner_name,
           lv.number, lv.status, lv.title, lv.ata_chapter, lv.applicability, lv.subject_id, s.name as subject_name,
           jsonb_array_length(lv.steps) as step_count, greatest(c.updated_at, lv.updated_at) as updated_at,
           pv.number as published_number,
           (select count(*) from citation_rechecks r where r.card_id = c.id and r.outcome = 'open') as open_rechecks
      from task_cards c
      join lateral (
        select * from task_card_versions v
         where v.card_id = c.id ${author ? sql`` : sql`and v.status = 'published'`}
         order by v.number desc limit 1
      ) lv on true
      left join lateral (
        select v.number from task_card_versions v where v.card_id = c.id and v.status = 'published' order by v.number desc limit 1
      ) pv on true
      left join curriculum_subjects s on s.id = lv.subject_id
      left join users u on u.id = c.owner_id
     where ${sql.join(conditions, sql` and `)}
     order by lower(lv.title), c.id
     limit 1000`);

  return result.rows.map((r) => ({
    id: r.id,
    title: r.title,
    status: r.archived_at ? "archived" : r.published_number != null ? "published" : "draft",
    hasDraft: r.status === "draft" && r.published_number != null,
    latestNumber: r.number,
    publishedNumber: r.published_number,
    subjectId: r.subject_id,
    subjectName: r.subject_name,
    ataChapter: r.ata_chapter,
    applicability: r.applicability,
    ownerName: r.owner_name,
    stepCount: Number(r.step_count),
    openRechecks: Number(r.open_rechecks),
    updatedAt: new Date(r.updated_at).toISOString(),
  }));
}

export type VersionRow = typeof taskCardVersions.$inferSelect & { subjectName: string | null; publishedByName: string | null };

async function loadVersions(db: Db | Tx, where: ReturnType<typeof eq>): Promise<VersionRow[]> {
  const publisher = sql<string | null>`(select name from users where users.id = ${taskCardVersions.publishedBy})`;
  const rows = await db
    .select({ version: taskCardVersions, subjectName: curriculumSubjects.name, publishedByName: publisher })
    .from(taskCardVersions)
    .leftJoin(curriculumSubjects, eq(curriculumSubjects.id, taskCardVersions.subjectId))
    .where(where)
    .orderBy(asc(taskCardVersions.number));
  return rows.map((r) => ({ ...r.version, subjectName: r.subjectName, publishedByName: r.publishedByName }));
}

/** Manual titles, revision labels and currency for every revision the steps cite. */
export async function describeRevisions(db: Db | Tx, revisionIds: string[]) {
  if (!revisionIds.length)
    return new Map<
      string,
      { manualId: string; manualTitle: string; label: string; current: boolean; status: string; pageCount: number | null }
    >();
  const rows = await db
    .select({
      id: revisions.id,
      manualId: revisions.manualId,
      label: revisions.label,
      status: revisions.status,
      pageCount: revisions.pageCount,
      manualTitle: manuals.title,
      currentRevisionId: manuals.currentRevisionId,
    })
    .from(revisions)
    .innerJoin(manuals, eq(manuals.id, revisions.manualId))
    .where(inArray(revisions.id, [...new Set(revisionIds)]));
  return new Map(
    rows.map((r) => [
      r.id,
      {
        manualId: r.manualId,
        manualTitle: r.manualTitle,
        label: r.label,
        current: r.currentRevisionId === r.id,
        status: r.status,
        pageCount: r.pageCount,
      },
    ]),
  );
}

/**
 * Steps whose citations a new revision touched and whose fix is not published yet: the recheck is
 * open, or its decision sits in a draft nobody has published.
 */
async function openRecheckSteps(db: Db | Tx, cardId: string): Promise<Set<string>> {
  const rows = await db
    .select({ stepId: citationRechecks.stepId })
    .from(citationRechecks)
    .where(
      and(
        eq(citationRechecks.cardId, cardId),
        sql`(${citationRechecks.outcome} = 'open' or exists (select 1 from task_card_versions v where v.id = ${citationRechecks.resultVersionId} and v.status = 'draft'))`,
      ),
    );
  return new Set(rows.map((r) => r.stepId));
}

async function toVersionDto(db: Db | Tx, row: VersionRow): Promise<CardVersionDto> {
  const steps = (row.steps as unknown[]).map((s) => stepSchema.parse(s));
  const rechecking = await openRecheckSteps(db, row.cardId);
  const described = await describeRevisions(
    db,
    steps.flatMap((s) => s.references.map((r) => r.revisionId)),
  );
  const stepDtos: StepDto[] = steps.map((s) => ({
    ...s,
    underRecheck: rechecking.has(s.id),
    notices: sortNotices(s.notices),
    references: s.references.map((r): ReferenceDto => {
      const d = described.get(r.revisionId);
      return {
        manualId: d?.manualId ?? "",
        manualTitle: d?.manualTitle ?? "Unknown manual",
        revisionId: r.revisionId,
        revisionLabel: d?.label ?? "?",
        current: d?.current ?? false,
        page: r.page,
        quote: r.quote,
      };
    }),
  }));
  return {
    id: row.id,
    cardId: row.cardId,
    number: row.number,
    status: row.status,
    title: row.title,
    applicability: row.applicability,
    ataChapter: row.ataChapter,
    subjectId: row.subjectId,
    subjectName: row.subjectName,
    estimatedMinutes: row.estimatedMinutes,
    tools: row.tools,
    consumables: row.consumables,
    protectiveEquipment: row.protectiveEquipment,
    steps: stepDtos,
    problems:
      row.status === "draft"
        ? cardProblems({
            title: row.title,
            applicability: row.applicability,
            ataChapter: row.ataChapter,
            subjectId: row.subjectId,
            estimatedMinutes: row.estimatedMinutes,
            tools: row.tools,
            consumables: row.consumables,
            protectiveEquipment: row.protectiveEquipment,
            steps,
          })
        : [],
    editCount: row.editCount,
    publishedAt: row.publishedAt?.toISOString() ?? null,
    publishedByName: row.publishedByName,
    updatedAt: row.updatedAt.toISOString(),
  };
}

async function loadCardRow(db: Db | Tx, id: string) {
  const [card] = await db
    .select({ id: taskCards.id, ownerId: taskCards.ownerId, ownerName: users.name, archivedAt: taskCards.archivedAt })
    .from(taskCards)
    .leftJoin(users, eq(users.id, taskCards.ownerId))
    .where(eq(taskCards.id, id))
    .limit(1);
  return card;
}

export async function getCard({ actor, id }: { actor: Actor; id: string }): Promise<CardDto> {
  const db = getDb();
  const card = await loadCardRow(db, id);
  if (!card) throw notFound();
  const author = isAuthor(actor);
  const versions = (await loadVersions(db, eq(taskCardVersions.cardId, id))).filter((v) => author || v.status === "published");
  // A student learns nothing of a card that was never published or was archived.
  if (!author && (!versions.length || card.archivedAt)) throw notFound();
  const draftRow = versions.find((v) => v.status === "draft");
  const publishedRow = versions.filter((v) => v.status === "published").at(-1);
  const [open] = await db
    .select({ n: sql<number>`count(*)`.mapWith(Number) })
    .from(citationRechecks)
    .where(and(eq(citationRechecks.cardId, id), eq(citationRechecks.outcome, "open")));
  return {
    id: card.id,
    ownerId: card.ownerId,
    ownerName: card.ownerName,
    coauthors: author ? await coauthorsOf(db, id) : [],
    canEdit: await editsCard(db, actor, card),
    archivedAt: card.archivedAt?.toISOString() ?? null,
    openRechecks: author ? (open?.n ?? 0) : 0,
    versions: versions.map((v) => ({
      number: v.number,
      status: v.status,
      publishedAt: v.publishedAt?.toISOString() ?? null,
      updatedAt: v.updatedAt.toISOString(),
    })),
    draft: draftRow ? await toVersionDto(db, draftRow) : null,
    published: publishedRow ? await toVersionDto(db, publishedRow) : null,
  };
}

/** One version. Students may read any published version (an assignment pins one, even if archived later). */
export async function getCardVersion({ actor, cardId, number }: { actor: Actor; cardId: string; number: number }): Promise<CardVersionDto> {
  const db = getDb();
  const [row] = await loadVersions(db, and(eq(taskCardVersions.cardId, cardId), eq(taskCardVersions.number, number))!);
  if (!row || (!isAuthor(actor) && row.status !== "published"))
    throw new AppError("not_found", "That version of the task card was not found.");
  return toVersionDto(db, row);
}

/** A version by id, for runs and assignments: the caller has already checked who may see it. */
export async function getVersionById(versionId: string, db: Db | Tx = getDb()): Promise<CardVersionDto> {
  const [row] = await loadVersions(db, eq(taskCardVersions.id, versionId));
  if (!row) throw new AppError("not_found", "That version of the task card was not found.");
  return toVersionDto(db, row);
}

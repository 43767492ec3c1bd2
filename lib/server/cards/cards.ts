import "server-only";
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db";
import { cardCitations, cardCoauthors, citationRechecks, curriculumSubjects, manuals, revisions, taskCards, taskCardVersions, users } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import { can, type Actor } from "@/lib/domain/access/permissions";
import type { CardDto, CardListStatus, CardSummaryDto, CardVersionDto, ReferenceDto, StepDto, SubjectDto } from "@/lib/contracts/cards";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";
import { idParam, parseWith } from "@/lib/server/http";
import {
  cardContentSchema, publishableCardSchema, sortNotices, stepSchema, versionNumberSchema, type CardContent, type Step,
} from "@/lib/domain/validation/cards";


const notFound = () => new AppError("not_found", "That task card was not found.");
const frozen = () =>
  new AppError("conflict", "That version is published and cannot change. Edit the card to make a new draft version.");

/** The database refuses changes to a published version (SQLSTATE HLF01); say so as a 409. */
function asConflict(error: unknown): never {
  if (databaseErrorCode(error) === "HLF01") throw frozen();
  if (databaseErrorCode(error) === "23505") {
    throw new AppError("conflict", "Someone else opened a draft of this card at the same moment. Reload the card.");
  }
  throw error;
}

/** A card of 100 long steps is larger than the 64 KiB other bodies get. */
export const cardBodyLimit = 512 * 1024;

/** The `[id]` and `[v]` of a version route; anything that cannot name a version is a 404. */
export async function versionParams(params: Promise<{ id: string; v: string }>) {
  const { id, v } = await params;
  const parsed = versionNumberSchema.safeParse(v);
  if (!parsed.success) throw new AppError("not_found", "That version of the task card was not found.");
  return { cardId: idParam(id, "That task card"), number: parsed.data };
}

const isAuthor = (actor: Actor) => can(actor, "cards:author");

// ---------------------------------------------------------------- subjects

export async function listSubjects(): Promise<SubjectDto[]> {
  return getDb().select({ id: curriculumSubjects.id, name: curriculumSubjects.name }).from(curriculumSubjects).orderBy(asc(curriculumSubjects.name));
}

export async function createSubject({ actor, name }: { actor: Actor; name: string }): Promise<SubjectDto> {
  try {
    return await getDb().transaction(async (tx) => {
      const [row] = await tx.insert(curriculumSubjects).values({ name }).returning({ id: curriculumSubjects.id, name: curriculumSubjects.name });
      await recordAudit(tx, { actorId: actor.id, action: "subject.created", subjectType: "subject", subjectId: row!.id, details: { name } });
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
      const [row] = await tx.update(curriculumSubjects).set({ name }).where(eq(curriculumSubjects.id, id)).returning({ id: curriculumSubjects.id, name: curriculumSubjects.name });
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

// ---------------------------------------------------------------- reading

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

type VersionRow = typeof taskCardVersions.$inferSelect & { subjectName: string | null; publishedByName: string | null };

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
async function describeRevisions(db: Db | Tx, revisionIds: string[]) {
  if (!revisionIds.length) return new Map<string, { manualId: string; manualTitle: string; label: string; current: boolean; status: string; pageCount: number | null }>();
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
  return new Map(rows.map((r) => [r.id, { manualId: r.manualId, manualTitle: r.manualTitle, label: r.label, current: r.currentRevisionId === r.id, status: r.status, pageCount: r.pageCount }]));
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
  const described = await describeRevisions(db, steps.flatMap((s) => s.references.map((r) => r.revisionId)));
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
    versions: versions.map((v) => ({ number: v.number, status: v.status, publishedAt: v.publishedAt?.toISOString() ?? null, updatedAt: v.updatedAt.toISOString() })),
    draft: draftRow ? await toVersionDto(db, draftRow) : null,
    published: publishedRow ? await toVersionDto(db, publishedRow) : null,
  };
}

/** One version. Students may read any published version (an assignment pins one, even if archived later). */
export async function getCardVersion({ actor, cardId, number }: { actor: Actor; cardId: string; number: number }): Promise<CardVersionDto> {
  const db = getDb();
  const [row] = await loadVersions(db, and(eq(taskCardVersions.cardId, cardId), eq(taskCardVersions.number, number))!);
  if (!row || (!isAuthor(actor) && row.status !== "published")) throw new AppError("not_found", "That version of the task card was not found.");
  return toVersionDto(db, row);
}

/** A version by id, for runs and assignments: the caller has already checked who may see it. */
export async function getVersionById(versionId: string, db: Db | Tx = getDb()): Promise<CardVersionDto> {
  const [row] = await loadVersions(db, eq(taskCardVersions.id, versionId));
  if (!row) throw new AppError("not_found", "That version of the task card was not found.");
  return toVersionDto(db, row);
}

// ---------------------------------------------------------------- writing

/**
 * Checks every cited page against the library and returns the citation rows. A citation must name
 * a ready revision and a page it has: a card never points students at a page that does not exist.
 */
async function citationsFor(tx: Tx, versionId: string, steps: Step[]) {
  const described = await describeRevisions(tx, steps.flatMap((s) => s.references.map((r) => r.revisionId)));
  const rows: (typeof cardCitations.$inferInsert)[] = [];
  steps.forEach((step, i) => {
    for (const ref of step.references) {
      const d = described.get(ref.revisionId);
      if (!d) throw new AppError("invalid", `Step ${i + 1} cites a revision that is not in the library.`, { fields: { steps: "Unknown revision." } });
      if (d.status !== "ready") {
        throw new AppError("invalid", `Step ${i + 1} cites ${d.manualTitle} ${d.label}, which is not ready to read yet.`, { fields: { steps: "Revision not ready." } });
      }
      if (d.pageCount != null && ref.page > d.pageCount) {
        throw new AppError("invalid", `Step ${i + 1} cites page ${ref.page} of ${d.manualTitle} ${d.label}, which has ${d.pageCount} pages.`, { fields: { steps: "No such page." } });
      }
      rows.push({ versionId, stepId: step.id, stepNumber: i + 1, manualId: d.manualId, revisionId: ref.revisionId, pageNumber: ref.page, quote: ref.quote });
    }
  });
  return rows;
}

async function assertSubjectExists(tx: Tx, subjectId: string | null) {
  if (!subjectId) return;
  const [found] = await tx.select({ id: curriculumSubjects.id }).from(curriculumSubjects).where(eq(curriculumSubjects.id, subjectId));
  if (!found) throw new AppError("invalid", "That curriculum subject is not in the list.", { fields: { subjectId: "Unknown subject." } });
}

function contentColumns(content: CardContent) {
  return {
    title: content.title,
    applicability: content.applicability,
    ataChapter: content.ataChapter,
    subjectId: content.subjectId,
    estimatedMinutes: content.estimatedMinutes,
    tools: content.tools,
    consumables: content.consumables,
    protectiveEquipment: content.protectiveEquipment,
    steps: content.steps.map((s) => ({ ...s, notices: sortNotices(s.notices) })),
  };
}

async function writeContent(tx: Tx, versionId: string, content: CardContent, editCount: number) {
  await assertSubjectExists(tx, content.subjectId);
  const rows = await citationsFor(tx, versionId, content.steps);
  await tx.update(taskCardVersions).set({ ...contentColumns(content), editCount: editCount + 1 }).where(eq(taskCardVersions.id, versionId));
  await tx.delete(cardCitations).where(eq(cardCitations.versionId, versionId));
  if (rows.length) await tx.insert(cardCitations).values(rows);
}

export function versionToContent(v: Pick<VersionRow, "title" | "applicability" | "ataChapter" | "subjectId" | "estimatedMinutes" | "tools" | "consumables" | "protectiveEquipment" | "steps">): CardContent {
  return parseWith(cardContentSchema, {
    title: v.title,
    applicability: v.applicability,
    ataChapter: v.ataChapter,
    subjectId: v.subjectId,
    estimatedMinutes: v.estimatedMinutes,
    tools: v.tools,
    consumables: v.consumables,
    protectiveEquipment: v.protectiveEquipment,
    steps: v.steps,
  });
}

export async function createCard({ actor, content, ownerId }: { actor: Actor; content: CardContent; ownerId?: string }): Promise<CardDto> {
  const id = await getDb().transaction(async (tx) => {
    const [card] = await tx.insert(taskCards).values({ ownerId: ownerId ?? actor.id }).returning({ id: taskCards.id });
    const [version] = await tx.insert(taskCardVersions).values({ cardId: card!.id, number: 1, title: content.title, createdBy: actor.id }).returning({ id: taskCardVersions.id });
    await writeContent(tx, version!.id, content, -1);
    await recordAudit(tx, { actorId: actor.id, action: "card.created", subjectType: "task_card", subjectId: card!.id, details: { title: content.title } });
    return card!.id;
  });
  return getCard({ actor, id });
}

/**
 * Locks the card for a change by the actor: its owner, a co-author the owner named, or an admin.
 * Other authors may read and duplicate it (403 here, since they can see the card).
 */
async function lockCard(tx: Tx, cardId: string, actor: Actor) {
  const [card] = await tx.select({ id: taskCards.id, ownerId: taskCards.ownerId, archivedAt: taskCards.archivedAt }).from(taskCards).where(eq(taskCards.id, cardId)).for("update");
  if (!card) throw notFound();
  if (!(await editsCard(tx, actor, card))) {
    throw new AppError("forbidden", "Only the card's owner, its co-authors or an admin can change this card. Duplicate it to make your own.");
  }
  return card;
}

async function editsCard(db: Db | Tx, actor: Actor, card: { id: string; ownerId: string | null }): Promise<boolean> {
  if (!isAuthor(actor)) return false;
  if (can(actor, "cards:edit-any") || card.ownerId === actor.id) return true;
  const [row] = await db
    .select({ userId: cardCoauthors.userId })
    .from(cardCoauthors)
    .where(and(eq(cardCoauthors.cardId, card.id), eq(cardCoauthors.userId, actor.id)));
  return !!row;
}

async function coauthorsOf(db: Db | Tx, cardId: string): Promise<{ id: string; name: string }[]> {
  return db
    .select({ id: users.id, name: users.name })
    .from(cardCoauthors)
    .innerJoin(users, eq(users.id, cardCoauthors.userId))
    .where(eq(cardCoauthors.cardId, cardId))
    .orderBy(asc(users.name));
}

/** The owner (or an admin) names who may edit the card beside them: active instructors or admins. */
export async function setCoauthors({ actor, cardId, userIds }: { actor: Actor; cardId: string; userIds: string[] }) {
  const wanted = [...new Set(userIds)];
  await getDb().transaction(async (tx) => {
    const [card] = await tx.select({ id: taskCards.id, ownerId: taskCards.ownerId }).from(taskCards).where(eq(taskCards.id, cardId)).for("update");
    if (!card) throw notFound();
    if (card.ownerId !== actor.id && !can(actor, "cards:edit-any")) throw new AppError("forbidden", "Only the card's owner or an admin names its co-authors.");
    const people = wanted.length
      ? await tx.select({ id: users.id, role: users.role, status: users.status }).from(users).where(inArray(users.id, wanted))
      : [];
    const fit = people.filter((p) => p.status === "active" && (p.role === "instructor" || p.role === "admin") && p.id !== card.ownerId);
    if (fit.length !== wanted.filter((id) => id !== card.ownerId).length) {
      throw new AppError("invalid", "Co-authors are active instructors or admins.", { fields: { userIds: "Choose active instructors." } });
    }
    await tx.delete(cardCoauthors).where(eq(cardCoauthors.cardId, cardId));
    if (fit.length) await tx.insert(cardCoauthors).values(fit.map((p) => ({ cardId, userId: p.id })));
    await recordAudit(tx, { actorId: actor.id, action: "card.coauthors_set", subjectType: "task_card", subjectId: cardId, details: { coauthors: fit.map((p) => p.id) } });
  });
  return coauthorsOf(getDb(), cardId);
}

/** The card's open draft, made from its newest version when there is none. */
async function openDraft(tx: Tx, actor: Actor, cardId: string) {
  const versions = await tx.select().from(taskCardVersions).where(eq(taskCardVersions.cardId, cardId)).orderBy(desc(taskCardVersions.number));
  const draft = versions.find((v) => v.status === "draft");
  if (draft) return { draft, opened: false };
  const latest = versions[0];
  if (!latest) throw notFound();
  const [created] = await tx
    .insert(taskCardVersions)
    .values({ ...contentColumns(versionToContent(latest)), cardId, number: latest.number + 1, createdBy: actor.id, editCount: 0 })
    .returning();
  const cited = await tx.select().from(cardCitations).where(eq(cardCitations.versionId, latest.id));
  if (cited.length) {
    await tx.insert(cardCitations).values(cited.map(({ id: _id, createdAt: _c, updatedAt: _u, ...c }) => ({ ...c, versionId: created!.id })));
  }
  return { draft: created!, opened: true };
}

/**
 * Saves the card's draft. Editing a published card opens a new draft version from it; the
 * published version itself never changes. `editCount` guards against overwriting a newer save.
 */
export async function saveDraft({ actor, cardId, content, editCount }: { actor: Actor; cardId: string; content: CardContent; editCount?: number }): Promise<CardVersionDto> {
  try {
    const versionId = await getDb().transaction(async (tx) => {
      const card = await lockCard(tx, cardId, actor);
      if (card.archivedAt) throw new AppError("conflict", "That card is archived. Bring it back from the archive to edit it.");
      const { draft, opened } = await openDraft(tx, actor, cardId);
      // A draft opened by this save has no other editor yet; the count the editor holds is the
      // published version's.
      if (!opened && editCount !== undefined && draft.editCount !== editCount) {
        throw new AppError("conflict", "This draft was changed elsewhere since you opened it. Reload to see the newer copy.");
      }
      await writeContent(tx, draft.id, content, draft.editCount);
      await tx.update(taskCards).set({ updatedAt: new Date() }).where(eq(taskCards.id, cardId));
      return draft.id;
    });
    const [row] = await loadVersions(getDb(), eq(taskCardVersions.id, versionId));
    return toVersionDto(getDb(), row!);
  } catch (error) {
    asConflict(error);
  }
}

/** Changes one version by number: allowed for a draft, 409 for a published version. */
export async function updateVersion({ actor, cardId, number, content, editCount }: { actor: Actor; cardId: string; number: number; content: CardContent; editCount?: number }) {
  const [row] = await getDb()
    .select({ status: taskCardVersions.status })
    .from(taskCardVersions)
    .where(and(eq(taskCardVersions.cardId, cardId), eq(taskCardVersions.number, number)));
  if (!row) throw new AppError("not_found", "That version of the task card was not found.");
  if (row.status === "published") throw frozen();
  return saveDraft({ actor, cardId, content, editCount });
}

/**
 * Runs a change on the card's draft (opened from the published version when there is none) inside
 * one transaction: `change` edits the content in place and may return work to do after the save.
 */
export async function applyToDraft({
  actor,
  cardId,
  change,
}: {
  actor: Actor;
  cardId: string;
  change: (tx: Tx, content: CardContent, draftId: string) => Promise<(() => Promise<void>) | void>;
}): Promise<CardVersionDto> {
  try {
    const versionId = await getDb().transaction(async (tx) => {
      const card = await lockCard(tx, cardId, actor);
      if (card.archivedAt) throw new AppError("conflict", "That card is archived. Bring it back from the archive first.");
      const { draft } = await openDraft(tx, actor, cardId);
      const content = versionToContent(draft);
      const after = await change(tx, content, draft.id);
      await writeContent(tx, draft.id, content, draft.editCount);
      if (after) await after();
      await tx.update(taskCards).set({ updatedAt: new Date() }).where(eq(taskCards.id, cardId));
      return draft.id;
    });
    const [row] = await loadVersions(getDb(), eq(taskCardVersions.id, versionId));
    return toVersionDto(getDb(), row!);
  } catch (error) {
    asConflict(error);
  }
}

/** "Cite while reading": adds one page to a step of the card's draft. */
export async function citePage({ actor, cardId, stepId, revisionId, page, quote }: { actor: Actor; cardId: string; stepId: string; revisionId: string; page: number; quote: string }) {
  try {
    return await getDb().transaction(async (tx) => {
      const card = await lockCard(tx, cardId, actor);
      if (card.archivedAt) throw new AppError("conflict", "That card is archived.");
      const { draft } = await openDraft(tx, actor, cardId);
      const content = versionToContent(draft);
      const step = content.steps.find((s) => s.id === stepId);
      if (!step) throw new AppError("invalid", "That step is not on the card's draft any more.", { fields: { stepId: "Unknown step." } });
      const already = step.references.some((r) => r.revisionId === revisionId && r.page === page);
      if (!already) {
        if (step.references.length >= 20) throw new AppError("invalid", "A step cites at most 20 pages.", { fields: { stepId: "Too many references." } });
        step.references.push({ revisionId, page, quote });
        await writeContent(tx, draft.id, content, draft.editCount);
      }
      return { versionNumber: draft.number, stepNumber: content.steps.indexOf(step) + 1, added: !already };
    });
  } catch (error) {
    asConflict(error);
  }
}

export async function publishDraft({ actor, cardId }: { actor: Actor; cardId: string }): Promise<CardVersionDto> {
  try {
    const versionId = await getDb().transaction(async (tx) => {
      const card = await lockCard(tx, cardId, actor);
      if (card.archivedAt) throw new AppError("conflict", "That card is archived. Bring it back from the archive to publish it.");
      const [draft] = await tx.select().from(taskCardVersions).where(and(eq(taskCardVersions.cardId, cardId), eq(taskCardVersions.status, "draft")));
      if (!draft) throw new AppError("conflict", "There is no draft to publish: the newest version is already published.");
      const content = parseWith(publishableCardSchema, versionToContent(draft));
      // Citations are checked again: a page cited last week must still exist in a ready revision.
      await citationsFor(tx, draft.id, content.steps);
      await tx.update(taskCardVersions).set({ status: "published", publishedAt: new Date(), publishedBy: actor.id }).where(eq(taskCardVersions.id, draft.id));
      await tx.update(taskCards).set({ updatedAt: new Date() }).where(eq(taskCards.id, cardId));
      await recordAudit(tx, { actorId: actor.id, action: "card.published", subjectType: "task_card", subjectId: cardId, details: { title: draft.title, version: draft.number } });
      return draft.id;
    });
    const [row] = await loadVersions(getDb(), eq(taskCardVersions.id, versionId));
    return toVersionDto(getDb(), row!);
  } catch (error) {
    asConflict(error);
  }
}

/** Throws away the open draft; the published versions stay. A card with nothing published keeps its draft. */
export async function discardDraft({ actor, cardId }: { actor: Actor; cardId: string }) {
  await getDb().transaction(async (tx) => {
    await lockCard(tx, cardId, actor);
    const versions = await tx.select({ id: taskCardVersions.id, status: taskCardVersions.status }).from(taskCardVersions).where(eq(taskCardVersions.cardId, cardId));
    const draft = versions.find((v) => v.status === "draft");
    if (!draft) throw new AppError("conflict", "There is no draft to discard.");
    if (!versions.some((v) => v.status === "published")) throw new AppError("conflict", "This card has never been published: archive it instead.");
    // Recheck decisions made in this draft are undone with it: those citations wait again.
    await tx
      .update(citationRechecks)
      .set({ outcome: "open", chosenPage: null, resolvedBy: null, resolvedAt: null, resultVersionId: null })
      .where(eq(citationRechecks.resultVersionId, draft.id));
    await tx.delete(taskCardVersions).where(eq(taskCardVersions.id, draft.id));
    await recordAudit(tx, { actorId: actor.id, action: "card.draft_discarded", subjectType: "task_card", subjectId: cardId });
  });
}

export async function duplicateCard({ actor, cardId }: { actor: Actor; cardId: string }): Promise<CardDto> {
  const db = getDb();
  const [latest] = await db.select().from(taskCardVersions).where(eq(taskCardVersions.cardId, cardId)).orderBy(desc(taskCardVersions.number)).limit(1);
  if (!latest) throw notFound();
  const content = versionToContent(latest);
  const title = `Copy of ${content.title}`.slice(0, 160);
  // New step ids: the copy's steps are its own, so revision impact never mixes the two cards up.
  const steps = content.steps.map((s) => ({ ...s, id: crypto.randomUUID() }));
  const created = await createCard({ actor, content: { ...content, title, steps } });
  await db.update(taskCards).set({ duplicatedFrom: cardId }).where(eq(taskCards.id, created.id));
  await recordAudit(db, { actorId: actor.id, action: "card.duplicated", subjectType: "task_card", subjectId: created.id, details: { from: cardId, title } });
  return created;
}

export async function setArchived({ actor, cardId, archived }: { actor: Actor; cardId: string; archived: boolean }) {
  await getDb().transaction(async (tx) => {
    await lockCard(tx, cardId, actor);
    await tx.update(taskCards).set({ archivedAt: archived ? new Date() : null }).where(eq(taskCards.id, cardId));
    await recordAudit(tx, { actorId: actor.id, action: archived ? "card.archived" : "card.restored", subjectType: "task_card", subjectId: cardId });
  });
  return getCard({ actor, id: cardId });
}

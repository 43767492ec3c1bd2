// Writing a card's draft: create, save, cite a page, discard, duplicate, archive. A published
// version never changes; editing one opens a new draft version from it.
import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { getDb, type Tx } from "@/db";
import { cardCitations, citationRechecks, curriculumSubjects, taskCards, taskCardVersions } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import { type Actor } from "@/lib/domain/access/permissions";
import type { CardDto, CardVersionDto } from "@/lib/contracts/cards";
import { AppError } from "@/lib/domain/errors";
import { parseWith } from "@/lib/server/http";
import { cardContentSchema, sortNotices, type CardContent, type Step } from "@/lib/domain/validation/cards";
import { notFound, frozen, asConflict, lockCard } from "@/lib/server/cards/access";
import { type VersionRow, describeRevisions, getCard, getVersionById } from "@/lib/server/cards/read";

/**
 * Checks every cited page against the library and returns the citation rows. A citation must name
 * a ready revision and a page it has: a card never points students at a page that does not exist.
 */
export async function citationsFor(tx: Tx, versionId: string, steps: Step[]) {
  const described = await describeRevisions(
    tx,
    steps.flatMap((s) => s.references.map((r) => r.revisionId)),
  );
  const rows: (typeof cardCitations.$inferInsert)[] = [];
  steps.forEach((step, i) => {
    for (const ref of step.references) {
      const d = described.get(ref.revisionId);
      if (!d)
        throw new AppError("invalid", `Step ${i + 1} cites a revision that is not in the library.`, {
          fields: { steps: "Unknown revision." },
        });
      if (d.status !== "ready") {
        throw new AppError("invalid", `Step ${i + 1} cites ${d.manualTitle} ${d.label}, which is not ready to read yet.`, {
          fields: { steps: "Revision not ready." },
        });
      }
      if (d.pageCount != null && ref.page > d.pageCount) {
        throw new AppError(
          "invalid",
          `Step ${i + 1} cites page ${ref.page} of ${d.manualTitle} ${d.label}, which has ${d.pageCount} pages.`,
          { fields: { steps: "No such page." } },
        );
      }
      rows.push({
        versionId,
        stepId: step.id,
        stepNumber: i + 1,
        manualId: d.manualId,
        revisionId: ref.revisionId,
        pageNumber: ref.page,
        quote: ref.quote,
      });
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
  await tx
    .update(taskCardVersions)
    .set({ ...contentColumns(content), editCount: editCount + 1 })
    .where(eq(taskCardVersions.id, versionId));
  await tx.delete(cardCitations).where(eq(cardCitations.versionId, versionId));
  if (rows.length) await tx.insert(cardCitations).values(rows);
}

export function versionToContent(
  v: Pick<
    VersionRow,
    "title" | "applicability" | "ataChapter" | "subjectId" | "estimatedMinutes" | "tools" | "consumables" | "protectiveEquipment" | "steps"
  >,
): CardContent {
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
    const [card] = await tx
      .insert(taskCards)
      .values({ ownerId: ownerId ?? actor.id })
      .returning({ id: taskCards.id });
    const [version] = await tx
      .insert(taskCardVersions)
      .values({ cardId: card!.id, number: 1, title: content.title, createdBy: actor.id })
      .returning({ id: taskCardVersions.id });
    await writeContent(tx, version!.id, content, -1);
    await recordAudit(tx, {
      actorId: actor.id,
      action: "card.created",
      subjectType: "task_card",
      subjectId: card!.id,
      details: { title: content.title },
    });
    return card!.id;
  });
  return getCard({ actor, id });
}

/** The card's open draft, made from its newest version when there is none. */
async function openDraft(tx: Tx, actor: Actor, cardId: string) {
  const versions = await tx
    .select()
    .from(taskCardVersions)
    .where(eq(taskCardVersions.cardId, cardId))
    .orderBy(desc(taskCardVersions.number));
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
    await tx
      .insert(cardCitations)
      .values(cited.map(({ id: _id, createdAt: _c, updatedAt: _u, ...c }) => ({ ...c, versionId: created!.id })));
  }
  return { draft: created!, opened: true };
}

/**
 * Saves the card's draft. Editing a published card opens a new draft version from it; the
 * published version itself never changes. `editCount` guards against overwriting a newer save.
 */
export async function saveDraft({
  actor,
  cardId,
  content,
  editCount,
}: {
  actor: Actor;
  cardId: string;
  content: CardContent;
  editCount?: number;
}): Promise<CardVersionDto> {
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
    return getVersionById(versionId);
  } catch (error) {
    asConflict(error);
  }
}

/** Changes one version by number: allowed for a draft, 409 for a published version. */
export async function updateVersion({
  actor,
  cardId,
  number,
  content,
  editCount,
}: {
  actor: Actor;
  cardId: string;
  number: number;
  content: CardContent;
  editCount?: number;
}) {
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
    return getVersionById(versionId);
  } catch (error) {
    asConflict(error);
  }
}

/** "Cite while reading": adds one page to a step of the card's draft. */
export async function citePage({
  actor,
  cardId,
  stepId,
  revisionId,
  page,
  quote,
}: {
  actor: Actor;
  cardId: string;
  stepId: string;
  revisionId: string;
  page: number;
  quote: string;
}) {
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
        if (step.references.length >= 20)
          throw new AppError("invalid", "A step cites at most 20 pages.", { fields: { stepId: "Too many references." } });
        step.references.push({ revisionId, page, quote });
        await writeContent(tx, draft.id, content, draft.editCount);
      }
      return { versionNumber: draft.number, stepNumber: content.steps.indexOf(step) + 1, added: !already };
    });
  } catch (error) {
    asConflict(error);
  }
}

/** Throws away the open draft; the published versions stay. A card with nothing published keeps its draft. */
export async function discardDraft({ actor, cardId }: { actor: Actor; cardId: string }) {
  await getDb().transaction(async (tx) => {
    await lockCard(tx, cardId, actor);
    const versions = await tx
      .select({ id: taskCardVersions.id, status: taskCardVersions.status })
      .from(taskCardVersions)
      .where(eq(taskCardVersions.cardId, cardId));
    const draft = versions.find((v) => v.status === "draft");
    if (!draft) throw new AppError("conflict", "There is no draft to discard.");
    if (!versions.some((v) => v.status === "published"))
      throw new AppError("conflict", "This card has never been published: archive it instead.");
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
  const [latest] = await db
    .select()
    .from(taskCardVersions)
    .where(eq(taskCardVersions.cardId, cardId))
    .orderBy(desc(taskCardVersions.number))
    .limit(1);
  if (!latest) throw notFound();
  const content = versionToContent(latest);
  const title = `Copy of ${content.title}`.slice(0, 160);
  // New step ids: the copy's steps are its own, so revision impact never mixes the two cards up.
  const steps = content.steps.map((s) => ({ ...s, id: crypto.randomUUID() }));
  const created = await createCard({ actor, content: { ...content, title, steps } });
  await db.update(taskCards).set({ duplicatedFrom: cardId }).where(eq(taskCards.id, created.id));
  await recordAudit(db, {
    actorId: actor.id,
    action: "card.duplicated",
    subjectType: "task_card",
    subjectId: created.id,
    details: { from: cardId, title },
  });
  return created;
}

export async function setArchived({ actor, cardId, archived }: { actor: Actor; cardId: string; archived: boolean }) {
  await getDb().transaction(async (tx) => {
    await lockCard(tx, cardId, actor);
    await tx
      .update(taskCards)
      .set({ archivedAt: archived ? new Date() : null })
      .where(eq(taskCards.id, cardId));
    await recordAudit(tx, {
      actorId: actor.id,
      action: archived ? "card.archived" : "card.restored",
      subjectType: "task_card",
      subjectId: cardId,
    });
  });
  return getCard({ actor, id: cardId });
}

import "server-only";
// What a new revision means for the task cards: compare it with the revision before it, store the
// comparison, flag every citation of a published card whose page changed, moved or went, with a
// suggested page, and tell each owning instructor once.
import { and, asc, desc, eq, inArray, isNull, lt, ne, or, sql } from "drizzle-orm";
import { getDb } from "@/db";
import {
  cardCitations,
  citationRechecks,
  manuals,
  pages,
  revisionComparisons,
  revisions,
  taskCards,
  taskCardVersions,
  users,
} from "@/db/schema";
import { getEnv } from "@/lib/server/env";
import { sendJob } from "@/lib/server/jobs";
import { queueMail } from "@/lib/server/mail";
import { revisionImpactMail } from "@/lib/server/mail/messages";
import { comparePages, suggestPage, type Comparison, type PageChange } from "@/lib/domain/revisions/compare";

const log = (message: string) => console.log(`[compare] ${message}`);

export async function queueComparison({ revisionId }: { revisionId: string }) {
  await sendJob("compareRevision", { revisionId });
}

/**
 * After a revision is ready: compare it, and the next newer ready revision of the same manual too,
 * since that one's "revision before" may be this one if it finished late.
 */
export async function queueComparisonsAfterReady({ revisionId }: { revisionId: string }) {
  const db = getDb();
  const [me] = await db
    .select({ manualId: revisions.manualId, date: revisions.revisionDate, createdAt: revisions.createdAt })
    .from(revisions)
    .where(eq(revisions.id, revisionId));
  if (!me) return;
  await queueComparison({ revisionId });
  const [newer] = await db
    .select({ id: revisions.id })
    .from(revisions)
    .where(
      and(
        eq(revisions.manualId, me.manualId),
        eq(revisions.status, "ready"),
        ne(revisions.id, revisionId),
        or(
          sql`${revisions.revisionDate} > ${me.date}`,
          and(eq(revisions.revisionDate, me.date), sql`${revisions.createdAt} > ${me.createdAt}`),
        ),
      ),
    )
    .orderBy(asc(revisions.revisionDate), asc(revisions.createdAt))
    .limit(1);
  if (newer) await queueComparison({ revisionId: newer.id });
}

async function pageTexts(revisionId: string): Promise<string[]> {
  const rows = await getDb()
    .select({ n: pages.pageNumber, text: pages.text })
    .from(pages)
    .where(eq(pages.revisionId, revisionId))
    .orderBy(asc(pages.pageNumber));
  return rows.map((r) => r.text);
}

/** The ready revision of the same manual just before this one (by revision date, then upload). */
async function previousRevision(revision: { id: string; manualId: string; revisionDate: string; createdAt: Date }) {
  const [row] = await getDb()
    .select({ id: revisions.id, label: revisions.label })
    .from(revisions)
    .where(
      and(
        eq(revisions.manualId, revision.manualId),
        eq(revisions.status, "ready"),
        ne(revisions.id, revision.id),
        or(
          lt(revisions.revisionDate, revision.revisionDate),
          and(eq(revisions.revisionDate, revision.revisionDate), lt(revisions.createdAt, revision.createdAt)),
        ),
      ),
    )
    .orderBy(desc(revisions.revisionDate), desc(revisions.createdAt))
    .limit(1);
  return row ?? null;
}

export interface CompareOutcome {
  previousRevisionId: string | null;
  summary: Comparison["summary"] | null;
  flagged: number;
  mailed: number;
}

/** The compare-revision job. Safe to run again: it skips what is done and flags each citation once. */
export async function compareRevision({ revisionId }: { revisionId: string }): Promise<CompareOutcome> {
  const db = getDb();
  const [revision] = await db
    .select({
      id: revisions.id,
      manualId: revisions.manualId,
      label: revisions.label,
      revisionDate: revisions.revisionDate,
      createdAt: revisions.createdAt,
      status: revisions.status,
    })
    .from(revisions)
    .where(eq(revisions.id, revisionId));
  if (!revision || revision.status !== "ready") return { previousRevisionId: null, summary: null, flagged: 0, mailed: 0 };
  const previous = await previousRevision(revision);
  if (!previous) {
    await db
      .insert(revisionComparisons)
      .values({ revisionId, previousRevisionId: null, pages: [], summary: { unchanged: 0, changed: 0, moved: 0, added: 0, removed: 0 } })
      .onConflictDoNothing();
    return { previousRevisionId: null, summary: null, flagged: 0, mailed: 0 };
  }

  const [oldTexts, newTexts] = await Promise.all([pageTexts(previous.id), pageTexts(revisionId)]);
  const labels = [previous.label, revision.label];
  const started = Date.now();
  const comparison = comparePages(oldTexts, newTexts, { labels });
  await db
    .insert(revisionComparisons)
    .values({ revisionId, previousRevisionId: previous.id, pages: comparison.pages, summary: comparison.summary })
    .onConflictDoUpdate({
      target: revisionComparisons.revisionId,
      set: { previousRevisionId: previous.id, pages: comparison.pages, summary: comparison.summary, updatedAt: new Date() },
    });
  log(`${revision.label} against ${previous.label}: ${JSON.stringify(comparison.summary)} in ${Date.now() - started} ms`);

  // Only the current revision sends anyone back to their cards.
  const [manual] = await db
    .select({ currentRevisionId: manuals.currentRevisionId, title: manuals.title })
    .from(manuals)
    .where(eq(manuals.id, revision.manualId));
  if (manual?.currentRevisionId !== revisionId)
    return { previousRevisionId: previous.id, summary: comparison.summary, flagged: 0, mailed: 0 };

  const flagged = await flagCitations({ revisionId, previousRevisionId: previous.id, comparison, oldTexts, newTexts, labels });
  const mailed = await mailOwners({
    revisionId,
    manualId: revision.manualId,
    manualTitle: manual.title,
    revisionLabel: revision.label,
    previousLabel: previous.label,
    rechecks: flagged,
  });
  return { previousRevisionId: previous.id, summary: comparison.summary, flagged: flagged.length, mailed };
}

/** Citations in the newest published version of each card still in use. */
async function citationsOf(previousRevisionId: string) {
  return getDb()
    .select({
      cardId: taskCardVersions.cardId,
      versionId: cardCitations.versionId,
      stepId: cardCitations.stepId,
      stepNumber: cardCitations.stepNumber,
      page: cardCitations.pageNumber,
    })
    .from(cardCitations)
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, cardCitations.versionId))
    .innerJoin(taskCards, eq(taskCards.id, taskCardVersions.cardId))
    .where(
      and(
        eq(cardCitations.revisionId, previousRevisionId),
        eq(taskCardVersions.status, "published"),
        isNull(taskCards.archivedAt),
        sql`${taskCardVersions.number} = (select max(v.number) from task_card_versions v where v.card_id = ${taskCardVersions.cardId} and v.status = 'published')`,
      ),
    );
}

async function flagCitations({
  revisionId,
  previousRevisionId,
  comparison,
  oldTexts,
  newTexts,
  labels,
}: {
  revisionId: string;
  previousRevisionId: string;
  comparison: Comparison;
  oldTexts: string[];
  newTexts: string[];
  labels: string[];
}) {
  const byOld = new Map<number, PageChange>();
  for (const p of comparison.pages) if (p.oldPage) byOld.set(p.oldPage, p);
  const rows: (typeof citationRechecks.$inferInsert)[] = [];
  for (const c of await citationsOf(previousRevisionId)) {
    const change = byOld.get(c.page);
    if (!change || change.status === "unchanged" || change.status === "added") continue;
    const suggestion = suggestPage(comparison, c.page, { oldTexts, newTexts, labels });
    rows.push({
      revisionId,
      previousRevisionId,
      cardId: c.cardId,
      versionId: c.versionId,
      stepId: c.stepId,
      stepNumber: c.stepNumber,
      oldPage: c.page,
      status: change.status,
      suggestedPage: suggestion.page,
      similarity: suggestion.similarity,
    });
  }
  if (!rows.length) return [];
  // Once per citation: a job run again inserts nothing new and so mails nobody again.
  return getDb().insert(citationRechecks).values(rows).onConflictDoNothing().returning();
}

async function mailOwners({
  revisionId,
  manualId,
  manualTitle,
  revisionLabel,
  previousLabel,
  rechecks,
}: {
  revisionId: string;
  manualId: string;
  manualTitle: string;
  revisionLabel: string;
  previousLabel: string;
  rechecks: (typeof citationRechecks.$inferSelect)[];
}) {
  if (!rechecks.length) return 0;
  const db = getDb();
  const cards = await db
    .select({
      id: taskCards.id,
      ownerEmail: users.email,
      ownerName: users.name,
      title: taskCardVersions.title,
      versionId: taskCardVersions.id,
    })
    .from(taskCards)
    .innerJoin(users, eq(users.id, taskCards.ownerId))
    .innerJoin(taskCardVersions, eq(taskCardVersions.cardId, taskCards.id))
    .where(inArray(taskCardVersions.id, [...new Set(rechecks.map((r) => r.versionId))]));
  const byOwner = new Map<
    string,
    {
      name: string;
      cards: { title: string; link: string; steps: { number: number; page: number; status: string; suggested: number | null }[] }[];
    }
  >();
  const base = getEnv().APP_URL.replace(/\/$/, "");
  for (const card of cards) {
    const owner = byOwner.get(card.ownerEmail) ?? { name: card.ownerName, cards: [] };
    owner.cards.push({
      title: card.title,
      link: `${base}/cards/${card.id}/recheck`,
      steps: rechecks
        .filter((r) => r.versionId === card.versionId)
        .sort((a, b) => a.stepNumber - b.stepNumber || a.oldPage - b.oldPage)
        .map((r) => ({ number: r.stepNumber, page: r.oldPage, status: r.status, suggested: r.suggestedPage })),
    });
    byOwner.set(card.ownerEmail, owner);
  }
  for (const [to, owner] of byOwner) {
    await queueMail(
      revisionImpactMail({
        to,
        name: owner.name,
        manualTitle,
        revisionLabel,
        previousLabel,
        cards: owner.cards,
        changesLink: `${base}/library/${manualId}/${revisionId}/changes`,
      }),
    );
  }
  return byOwner.size;
}

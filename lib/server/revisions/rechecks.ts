import "server-only";
// Reading a revision's comparison, and the author's side of a recheck: see each flagged citation
// with its old page and the suggested new one, decide, and get a new draft version of the card.
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { citationRechecks, manuals, pages, revisionComparisons, revisions, taskCards, taskCardVersions, users } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import type { Actor } from "@/lib/domain/access/permissions";
import { applyToDraft } from "@/lib/server/cards/draft";
import { AppError } from "@/lib/domain/errors";
import type { PageChange, PageStatus } from "@/lib/domain/revisions/compare";
import type { ComparisonDto } from "@/lib/contracts/library";
import type { RecheckDto } from "@/lib/contracts/cards";

export type { ComparisonDto, RecheckDto };

export async function getComparison({ revisionId }: { revisionId: string }): Promise<ComparisonDto> {
  const [row] = await getDb().select().from(revisionComparisons).where(eq(revisionComparisons.revisionId, revisionId));
  if (!row)
    throw new AppError(
      "not_found",
      "That revision has not been compared yet. The comparison is made a moment after the revision is ready.",
    );
  return {
    revisionId,
    previousRevisionId: row.previousRevisionId,
    pages: row.pages as PageChange[],
    summary: row.summary as Record<PageStatus, number>,
  };
}

/** The cards a revision sent back to their authors, with how many citations are still open. */
export async function listRechecksOfRevision({ revisionId }: { revisionId: string }) {
  return getDb()
    .select({
      cardId: citationRechecks.cardId,
      title: taskCardVersions.title,
      ownerName: users.name,
      total: sql<number>`count(*)`.mapWith(Number),
      open: sql<number>`count(*) filter (where ${citationRechecks.outcome} = 'open')`.mapWith(Number),
    })
    .from(citationRechecks)
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, citationRechecks.versionId))
    .innerJoin(taskCards, eq(taskCards.id, citationRechecks.cardId))
    .leftJoin(users, eq(users.id, taskCards.ownerId))
    .where(eq(citationRechecks.revisionId, revisionId))
    .groupBy(citationRechecks.cardId, taskCardVersions.title, users.name)
    .orderBy(asc(taskCardVersions.title));
}

async function pageText(revisionId: string, page: number | null) {
  if (!page) return null;
  const [row] = await getDb()
    .select({ text: pages.text })
    .from(pages)
    .where(and(eq(pages.revisionId, revisionId), eq(pages.pageNumber, page)));
  return row?.text ?? null;
}

export async function listOpenRechecks({ cardId }: { cardId: string }): Promise<RecheckDto[]> {
  const db = getDb();
  const [card] = await db.select({ id: taskCards.id }).from(taskCards).where(eq(taskCards.id, cardId));
  if (!card) throw new AppError("not_found", "That task card was not found.");
  const rows = await db
    .select({ recheck: citationRechecks, steps: taskCardVersions.steps })
    .from(citationRechecks)
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, citationRechecks.versionId))
    .where(and(eq(citationRechecks.cardId, cardId), eq(citationRechecks.outcome, "open")))
    .orderBy(asc(citationRechecks.stepNumber), asc(citationRechecks.oldPage));
  if (!rows.length) return [];
  const revisionIds = [...new Set(rows.flatMap((r) => [r.recheck.revisionId, r.recheck.previousRevisionId]))];
  const info = new Map(
    (
      await db
        .select({
          id: revisions.id,
          label: revisions.label,
          pageCount: revisions.pageCount,
          manualId: revisions.manualId,
          manualTitle: manuals.title,
        })
        .from(revisions)
        .innerJoin(manuals, eq(manuals.id, revisions.manualId))
        .where(inArray(revisions.id, revisionIds))
    ).map((r) => [r.id, r]),
  );
  return Promise.all(
    rows.map(async ({ recheck: r, steps }) => {
      const step = (steps as { id: string; text: string }[]).find((s) => s.id === r.stepId);
      const oldInfo = info.get(r.previousRevisionId)!;
      const newInfo = info.get(r.revisionId)!;
      return {
        id: r.id,
        stepId: r.stepId,
        stepNumber: r.stepNumber,
        stepText: step?.text ?? "",
        status: r.status,
        manualId: oldInfo.manualId,
        manualTitle: oldInfo.manualTitle,
        old: {
          revisionId: r.previousRevisionId,
          label: oldInfo.label,
          page: r.oldPage,
          text: (await pageText(r.previousRevisionId, r.oldPage)) ?? "",
        },
        suggested: {
          revisionId: r.revisionId,
          label: newInfo.label,
          page: r.suggestedPage,
          similarity: r.similarity,
          text: await pageText(r.revisionId, r.suggestedPage),
          pageCount: newInfo.pageCount,
        },
      };
    }),
  );
}

export type RecheckDecision = { id: string; action: "accept" | "relink" | "drop"; page?: number };

/**
 * Applies the author's decisions to the card's draft (opened from the published version when there
 * is none): the flagged citations move to the new revision or go, and the card's other citations of
 * the old revision whose pages did not change follow to the same content in the new revision.
 */
export async function applyRechecks({ actor, cardId, decisions }: { actor: Actor; cardId: string; decisions: RecheckDecision[] }) {
  return applyToDraft({
    actor,
    cardId,
    change: async (tx, content, draftId) => {
      const ids = decisions.map((d) => d.id);
      const rows = await tx
        .select()
        .from(citationRechecks)
        .where(and(eq(citationRechecks.cardId, cardId), inArray(citationRechecks.id, ids)))
        .for("update");
      if (rows.length !== new Set(ids).size)
        throw new AppError("invalid", "Some of those rechecks are not on this card.", { fields: { decisions: "Unknown recheck." } });
      if (rows.some((r) => r.outcome !== "open"))
        throw new AppError("conflict", "Some of those citations were rechecked already. Reload the page.");
      const pageCounts = new Map(
        (
          await tx
            .select({ id: revisions.id, pageCount: revisions.pageCount })
            .from(revisions)
            .where(inArray(revisions.id, [...new Set(rows.map((r) => r.revisionId))]))
        ).map((r) => [r.id, r.pageCount]),
      );
      const outcomes: { id: string; outcome: "accepted" | "relinked" | "dropped"; page: number | null }[] = [];
      for (const decision of decisions) {
        const r = rows.find((x) => x.id === decision.id)!;
        const step = content.steps.find((s) => s.id === r.stepId);
        const index = step?.references.findIndex((ref) => ref.revisionId === r.previousRevisionId && ref.page === r.oldPage) ?? -1;
        let page: number | null = null;
        if (decision.action === "accept") {
          if (!r.suggestedPage)
            throw new AppError(
              "invalid",
              `Step ${r.stepNumber}: there is no suggested page to accept. Choose a page or drop the citation.`,
              { fields: { decisions: "No suggestion." } },
            );
          page = r.suggestedPage;
        } else if (decision.action === "relink") {
          const count = pageCounts.get(r.revisionId) ?? null;
          if (!decision.page || (count !== null && decision.page > count)) {
            throw new AppError("invalid", `Step ${r.stepNumber}: choose a page from 1 to ${count ?? "the last page"}.`, {
              fields: { decisions: "No such page." },
            });
          }
          page = decision.page;
        }
        if (step && index >= 0) {
          const old = step.references[index]!;
          if (page === null) step.references.splice(index, 1);
          else step.references[index] = { revisionId: r.revisionId, page, quote: old.quote };
          // The same page cited twice on a step after relinking is cited once.
          step.references = step.references.filter(
            (ref, k, all) => all.findIndex((o) => o.revisionId === ref.revisionId && o.page === ref.page) === k,
          );
        }
        outcomes.push({
          id: r.id,
          outcome: decision.action === "accept" ? "accepted" : decision.action === "relink" ? "relinked" : "dropped",
          page,
        });
      }

      // Unchanged pages of the old revision follow the card to the new revision. (No recheck is
      // ever about an unchanged page, so these never collide with an open one.)
      for (const revisionId of new Set(rows.map((r) => r.revisionId))) {
        const previousRevisionId = rows.find((r) => r.revisionId === revisionId)!.previousRevisionId;
        const [comparison] = await tx
          .select({ pages: revisionComparisons.pages })
          .from(revisionComparisons)
          .where(eq(revisionComparisons.revisionId, revisionId));
        const unchanged = new Map(
          ((comparison?.pages ?? []) as PageChange[])
            .filter((p) => p.status === "unchanged" && p.oldPage)
            .map((p) => [p.oldPage!, p.newPage!]),
        );
        for (const step of content.steps) {
          step.references = step.references.map((ref) =>
            ref.revisionId === previousRevisionId && unchanged.has(ref.page) ? { ...ref, revisionId, page: unchanged.get(ref.page)! } : ref,
          );
        }
      }

      return async () => {
        for (const o of outcomes) {
          await tx
            .update(citationRechecks)
            .set({ outcome: o.outcome, chosenPage: o.page, resolvedBy: actor.id, resolvedAt: new Date(), resultVersionId: draftId })
            .where(eq(citationRechecks.id, o.id));
        }
        await recordAudit(tx, {
          actorId: actor.id,
          action: "card.rechecked",
          subjectType: "task_card",
          subjectId: cardId,
          details: { decisions: outcomes.length },
        });
      };
    },
  });
}

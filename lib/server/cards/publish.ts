// Publishing a draft: completeness and every citation are checked again, then the version freezes.
import "server-only";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db";
import { taskCards, taskCardVersions } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import { type Actor } from "@/lib/domain/access/permissions";
import type { CardVersionDto } from "@/lib/contracts/cards";
import { AppError } from "@/lib/domain/errors";
import { cardProblems } from "@/lib/domain/validation/cards";
import { unknownElementCodes } from "@/lib/server/standard";
import { asConflict, lockCard } from "@/lib/server/cards/access";
import { getVersionById } from "@/lib/server/cards/read";
import { citationsFor, versionToContent } from "@/lib/server/cards/draft";

export async function publishDraft({ actor, cardId }: { actor: Actor; cardId: string }): Promise<CardVersionDto> {
  try {
    const versionId = await getDb().transaction(async (tx) => {
      const card = await lockCard(tx, cardId, actor);
      if (card.archivedAt) throw new AppError("conflict", "That card is archived. Bring it back from the archive to publish it.");
      const [draft] = await tx
        .select()
        .from(taskCardVersions)
        .where(and(eq(taskCardVersions.cardId, cardId), eq(taskCardVersions.status, "draft")));
      if (!draft) throw new AppError("conflict", "There is no draft to publish: the newest version is already published.");
      const content = versionToContent(draft);
      // Every problem at once, each under its own field, so the author fixes them in one pass.
      const problems = cardProblems(content);
      if (problems.length) {
        const fields: Record<string, string> = {};
        for (const p of problems) fields[p.field] ??= p.message;
        const more = problems.length > 1 ? ` (and ${problems.length - 1} more)` : "";
        throw new AppError("invalid", `Not ready to publish: ${problems[0]!.message}${more}`, { fields });
      }
      // A step mapped to an element the school's standard does not have would count for nothing.
      const unknown = await unknownElementCodes(content.steps.flatMap((s) => s.elements));
      if (unknown.length) {
        const message = `Not ready to publish: the standard has no element ${unknown.join(", ")}. Check the code, or import the standard first.`;
        const fields: Record<string, string> = {};
        content.steps.forEach((s, i) => {
          if (s.elements.some((c) => unknown.includes(c))) fields[`steps.${i + 1}.elements`] ??= message;
        });
        throw new AppError("invalid", message, { fields });
      }
      // Citations are checked again: a page cited last week must still exist in a ready revision.
      await citationsFor(tx, draft.id, content.steps);
      await tx
        .update(taskCardVersions)
        .set({ status: "published", publishedAt: new Date(), publishedBy: actor.id })
        .where(eq(taskCardVersions.id, draft.id));
      await tx.update(taskCards).set({ updatedAt: new Date() }).where(eq(taskCards.id, cardId));
      await recordAudit(tx, {
        actorId: actor.id,
        action: "card.published",
        subjectType: "task_card",
        subjectId: cardId,
        details: { title: draft.title, version: draft.number },
      });
      return draft.id;
    });
    return getVersionById(versionId);
  } catch (error) {
    asConflict(error);
  }
}

// Who may change a card: its owner, the co-authors the owner named, or an admin. Every write
// locks the card through lockCard, so the check and the change are one transaction.
import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db";
import { cardCoauthors, taskCards, users } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import { can, type Actor } from "@/lib/domain/access/permissions";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";

export const notFound = () => new AppError("not_found", "That task card was not found.");

export const frozen = () =>
  new AppError("conflict", "That version is published and cannot change. Edit the card to make a new draft version.");

/** The database refuses changes to a published version (SQLSTATE HLF01); say so as a 409. */
export function asConflict(error: unknown): never {
  if (databaseErrorCode(error) === "HLF01") throw frozen();
  if (databaseErrorCode(error) === "23505") {
    throw new AppError("conflict", "Someone else opened a draft of this card at the same moment. Reload the card.");
  }
  throw error;
}

export const isAuthor = (actor: Actor) => can(actor, "cards:author");

/**
 * Locks the card for a change by the actor: its owner, a co-author the owner named, or an admin.
 * Other authors may read and duplicate it (403 here, since they can see the card).
 */
export async function lockCard(tx: Tx, cardId: string, actor: Actor) {
  const [card] = await tx
    .select({ id: taskCards.id, ownerId: taskCards.ownerId, archivedAt: taskCards.archivedAt })
    .from(taskCards)
    .where(eq(taskCards.id, cardId))
    .for("update");
  if (!card) throw notFound();
  if (!(await editsCard(tx, actor, card))) {
    throw new AppError(
      "forbidden",
      "Only the card's owner, its co-authors or an admin can change this card. Duplicate it to make your own.",
    );
  }
  return card;
}

export async function editsCard(db: Db | Tx, actor: Actor, card: { id: string; ownerId: string | null }): Promise<boolean> {
  if (!isAuthor(actor)) return false;
  if (can(actor, "cards:edit-any") || card.ownerId === actor.id) return true;
  const [row] = await db
    .select({ userId: cardCoauthors.userId })
    .from(cardCoauthors)
    .where(and(eq(cardCoauthors.cardId, card.id), eq(cardCoauthors.userId, actor.id)));
  return !!row;
}

export async function coauthorsOf(db: Db | Tx, cardId: string): Promise<{ id: string; name: string }[]> {
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
    const [card] = await tx
      .select({ id: taskCards.id, ownerId: taskCards.ownerId })
      .from(taskCards)
      .where(eq(taskCards.id, cardId))
      .for("update");
    if (!card) throw notFound();
    if (card.ownerId !== actor.id && !can(actor, "cards:edit-any"))
      throw new AppError("forbidden", "Only the card's owner or an admin names its co-authors.");
    const people = wanted.length
      ? await tx.select({ id: users.id, role: users.role, status: users.status }).from(users).where(inArray(users.id, wanted))
      : [];
    const fit = people.filter((p) => p.status === "active" && (p.role === "instructor" || p.role === "admin") && p.id !== card.ownerId);
    if (fit.length !== wanted.filter((id) => id !== card.ownerId).length) {
      throw new AppError("invalid", "Co-authors are active instructors or admins.", { fields: { userIds: "Choose active instructors." } });
    }
    await tx.delete(cardCoauthors).where(eq(cardCoauthors.cardId, cardId));
    if (fit.length) await tx.insert(cardCoauthors).values(fit.map((p) => ({ cardId, userId: p.id })));
    await recordAudit(tx, {
      actorId: actor.id,
      action: "card.coauthors_set",
      subjectType: "task_card",
      subjectId: cardId,
      details: { coauthors: fit.map((p) => p.id) },
    });
  });
  return coauthorsOf(getDb(), cardId);
}

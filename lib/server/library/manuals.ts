import "server-only";
import { and, asc, desc, eq, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { cardCitations, manuals, pages, revisions, runs, taskCards, taskCardVersions, users } from "@/db/schema";
import type { DocumentType, RevisionStatus } from "@/lib/domain/vocabulary";
import { recordAudit } from "@/lib/server/audit";
import { can, type Actor } from "@/lib/domain/access/permissions";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";
import { queueIngest } from "@/lib/server/ingest/queue";

export interface ManualFields {
  title: string;
  documentType: DocumentType;
  applicability: string[];
  ataChapters: string[];
}
export interface RevisionFields {
  revisionLabel: string;
  revisionDate: string;
}
export interface StoredFile {
  key: string;
  size: number;
  sha256: string;
}

/** The upload is stored either way; when the queue is out of reach the librarian can try again. */
async function queueOrFail(revisionId: string) {
  try {
    await queueIngest({ revisionId });
  } catch (error) {
    console.error("could not queue ingest", error);
    await getDb()
      .update(revisions)
      .set({ status: "failed", error: "The file is stored, but reading it could not be started. Press Try again." })
      .where(eq(revisions.id, revisionId));
  }
}

function newRevision(input: { revisionId: string; manualId: string; revision: RevisionFields; file: StoredFile; actor: Actor }) {
  return {
    id: input.revisionId,
    manualId: input.manualId,
    label: input.revision.revisionLabel,
    revisionDate: input.revision.revisionDate,
    fileKey: input.file.key,
    sizeBytes: input.file.size,
    sha256: input.file.sha256,
    uploadedBy: input.actor.id,
  };
}

const labelTaken = (label: string) =>
  new AppError("conflict", `This manual already has a revision labelled "${label}".`, {
    fields: { revisionLabel: "Already used on this manual." },
  });

export async function createManualWithRevision({
  actor,
  revisionId,
  manual,
  revision,
  file,
}: {
  actor: Actor;
  revisionId: string;
  manual: ManualFields;
  revision: RevisionFields;
  file: StoredFile;
}) {
  const created = await getDb().transaction(async (tx) => {
    const [existing] = await tx.select({ id: manuals.id }).from(manuals).where(eq(manuals.title, manual.title)).limit(1);
    if (existing) {
      throw new AppError("conflict", `A manual titled "${manual.title}" exists. Upload a new revision to it instead.`, {
        fields: { title: "Already in the library." },
      });
    }
    const [row] = await tx
      .insert(manuals)
      .values({ ...manual, createdBy: actor.id })
      .returning({ id: manuals.id });
    if (!row) throw new AppError("internal");
    await tx.insert(revisions).values(newRevision({ revisionId, manualId: row.id, revision, file, actor }));
    await recordAudit(tx, {
      actorId: actor.id,
      action: "manual.uploaded",
      subjectType: "manual",
      subjectId: row.id,
      details: { title: manual.title, revision: revision.revisionLabel, revisionId, bytes: file.size },
    });
    return { manualId: row.id, revisionId };
  });
  await queueOrFail(revisionId);
  return created;
}

export async function assertManualExists({ id }: { id: string }) {
  const [row] = await getDb().select({ id: manuals.id }).from(manuals).where(eq(manuals.id, id)).limit(1);
  if (!row) throw new AppError("not_found", "That manual was not found.");
}

export async function addRevision({
  actor,
  manualId,
  revisionId,
  revision,
  file,
}: {
  actor: Actor;
  manualId: string;
  revisionId: string;
  revision: RevisionFields;
  file: StoredFile;
}) {
  await getDb().transaction(async (tx) => {
    const [manual] = await tx.select({ id: manuals.id }).from(manuals).where(eq(manuals.id, manualId)).for("update");
    if (!manual) throw new AppError("not_found", "That manual was not found.");
    const [same] = await tx
      .select({ id: revisions.id })
      .from(revisions)
      .where(and(eq(revisions.manualId, manualId), eq(revisions.label, revision.revisionLabel)))
      .limit(1);
    if (same) throw labelTaken(revision.revisionLabel);
    await tx.insert(revisions).values(newRevision({ revisionId, manualId, revision, file, actor }));
    await recordAudit(tx, {
      actorId: actor.id,
      action: "revision.uploaded",
      subjectType: "manual",
      subjectId: manualId,
      details: { revision: revision.revisionLabel, revisionId, bytes: file.size },
    });
  });
  await queueOrFail(revisionId);
  return { revisionId };
}

const revisionColumns = {
  id: revisions.id,
  manualId: revisions.manualId,
  label: revisions.label,
  revisionDate: revisions.revisionDate,
  status: revisions.status,
  pageCount: revisions.pageCount,
  pagesDone: revisions.pagesDone,
  error: revisions.error,
  sizeBytes: revisions.sizeBytes,
  readyAt: revisions.readyAt,
  supersededAt: revisions.supersededAt,
  createdAt: revisions.createdAt,
};

const manualColumns = {
  id: manuals.id,
  title: manuals.title,
  documentType: manuals.documentType,
  applicability: manuals.applicability,
  ataChapters: manuals.ataChapters,
  currentRevisionId: manuals.currentRevisionId,
  keepOnCarts: manuals.keepOnCarts,
  withdrawnAt: manuals.withdrawnAt,
  withdrawReason: manuals.withdrawReason,
};

export async function listManuals() {
  const db = getDb();
  const current = db
    .select({ id: revisions.id, label: revisions.label, revisionDate: revisions.revisionDate, pageCount: revisions.pageCount })
    .from(revisions)
    .as("current");
  const rows = await db
    .select({
      ...manualColumns,
      currentLabel: current.label,
      currentDate: current.revisionDate,
      pageCount: current.pageCount,
      // The newest upload's state, so a librarian sees work in progress and failures at a glance.
      latestStatus: sql<RevisionStatus | null>`(select r.status from ${revisions} r where r.manual_id = ${manuals.id} order by r.created_at desc limit 1)`,
    })
    .from(manuals)
    .leftJoin(current, eq(current.id, manuals.currentRevisionId))
    .orderBy(asc(manuals.title));
  return rows;
}

export async function getManual({ id }: { id: string }) {
  const db = getDb();
  const [manual] = await db
    .select({
      ...manualColumns,
      createdAt: manuals.createdAt,
    })
    .from(manuals)
    .where(eq(manuals.id, id))
    .limit(1);
  if (!manual) throw new AppError("not_found", "That manual was not found.");
  const history = await db
    .select({ ...revisionColumns, uploadedBy: users.name })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.uploadedBy))
    .where(eq(revisions.manualId, id))
    .orderBy(desc(revisions.revisionDate), desc(revisions.createdAt));
  return { ...manual, revisions: history };
}

export async function getRevision({ id }: { id: string }) {
  const [row] = await getDb()
    .select({
      ...revisionColumns,
      fileKey: revisions.fileKey,
      readerFileKey: revisions.readerFileKey,
      readerSizeBytes: revisions.readerSizeBytes,
      manualTitle: manuals.title,
      currentRevisionId: manuals.currentRevisionId,
    })
    .from(revisions)
    .innerJoin(manuals, eq(manuals.id, revisions.manualId))
    .where(eq(revisions.id, id))
    .limit(1);
  if (!row) throw new AppError("not_found", "That revision was not found.");
  return row;
}

/**
 * A revision's file and pages are for everyone once it is ready; before that (or after a failure)
 * only the library staff see them, so no half revision reaches a student.
 */
export async function getReadableRevision({ actor, id }: { actor: Actor; id: string }) {
  const revision = await getRevision({ id });
  if (revision.status !== "ready" && !can(actor, "library:manage")) {
    throw new AppError("not_found", "That revision was not found.");
  }
  return revision;
}

export async function getPage({ revisionId, pageNumber }: { revisionId: string; pageNumber: number }) {
  const revision = await getRevision({ id: revisionId });
  // Pages of an unfinished revision do not exist for anyone: they may be half written.
  if (revision.status !== "ready") throw new AppError("not_found", "That page was not found.");
  const [page] = await getDb()
    .select({ page: pages.pageNumber, text: pages.text, heading: pages.heading, ocr: pages.ocr, thumbnailKey: pages.thumbnailKey })
    .from(pages)
    .where(and(eq(pages.revisionId, revisionId), eq(pages.pageNumber, pageNumber)))
    .limit(1);
  if (!page) throw new AppError("not_found", `This revision has no page ${pageNumber}.`);
  return { ...page, revision };
}

export async function retryRevision({ actor, id }: { actor: Actor; id: string }) {
  const updated = await getDb().transaction(async (tx) => {
    const [row] = await tx
      .update(revisions)
      .set({ status: "queued", error: null, pagesDone: 0, attempts: 0, heartbeatAt: null })
      .where(and(eq(revisions.id, id), eq(revisions.status, "failed")))
      .returning({ id: revisions.id, manualId: revisions.manualId });
    if (!row) {
      const [exists] = await tx.select({ status: revisions.status }).from(revisions).where(eq(revisions.id, id));
      if (!exists) throw new AppError("not_found", "That revision was not found.");
      throw new AppError("conflict", `Only a failed revision can be tried again; this one is ${exists.status}.`);
    }
    await recordAudit(tx, {
      actorId: actor.id,
      action: "revision.retried",
      subjectType: "manual",
      subjectId: row.manualId,
      details: { revisionId: id },
    });
    return row;
  });
  await queueOrFail(updated.id);
  return updated;
}

/** A librarian's "keep on carts": carts store the whole current PDF of the manual. */
export async function setKeepOnCarts({ actor, id, keepOnCarts }: { actor: Actor; id: string; keepOnCarts: boolean }) {
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .update(manuals)
      .set({ keepOnCarts })
      .where(eq(manuals.id, id))
      .returning({ id: manuals.id, title: manuals.title, keepOnCarts: manuals.keepOnCarts });
    if (!row) throw new AppError("not_found", "That manual was not found.");
    await recordAudit(tx, {
      actorId: actor.id,
      action: keepOnCarts ? "manual.kept_on_carts" : "manual.not_kept_on_carts",
      subjectType: "manual",
      subjectId: id,
      details: { title: row.title },
    });
    return row;
  });
}

const manualNotFound = () => new AppError("not_found", "That manual was not found.");

/** A librarian's correction of a manual's details; the title stays one of a kind in the library. */
export async function updateManualDetails({ actor, id, fields }: { actor: Actor; id: string; fields: ManualFields }) {
  try {
    return await getDb().transaction(async (tx) => {
      const [before] = await tx.select().from(manuals).where(eq(manuals.id, id)).for("update");
      if (!before) throw manualNotFound();
      await tx
        .update(manuals)
        .set({ ...fields, updatedAt: new Date() })
        .where(eq(manuals.id, id));
      const changed = Object.fromEntries(
        (Object.keys(fields) as (keyof ManualFields)[])
          .filter((k) => JSON.stringify(before[k]) !== JSON.stringify(fields[k]))
          .map((k) => [k, { from: before[k], to: fields[k] }]),
      );
      if (Object.keys(changed).length)
        await recordAudit(tx, {
          actorId: actor.id,
          action: "manual.changed",
          subjectType: "manual",
          subjectId: id,
          details: { title: fields.title, ...changed },
        });
      return { id, ...fields };
    });
  } catch (error) {
    if (databaseErrorCode(error) === "23505")
      throw new AppError("conflict", `The library already has a manual titled "${fields.title}".`, {
        fields: { title: "Already in the library." },
      });
    throw error;
  }
}

/** What cites a manual: the card versions in use (drafts and published, not archived) and the open runs on them. */
export async function manualCitations({ id }: { id: string }) {
  await assertManualExists({ id });
  const cards = await getDb()
    .selectDistinct({
      cardId: taskCardVersions.cardId,
      title: taskCardVersions.title,
      versionNumber: taskCardVersions.number,
      status: taskCardVersions.status,
      openRuns: sql<number>`(select count(*)::int from ${runs} r where r.version_id = ${taskCardVersions.id} and r.status <> 'signed_off')`,
    })
    .from(cardCitations)
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, cardCitations.versionId))
    .innerJoin(taskCards, eq(taskCards.id, taskCardVersions.cardId))
    .where(and(eq(cardCitations.manualId, id), sql`${taskCards.archivedAt} is null`))
    .orderBy(asc(taskCardVersions.title), asc(taskCardVersions.number));
  return { cards };
}

/**
 * Withdraws a manual from the library: it leaves the list and search, its pages stay readable
 * for the cards that cite them (each reader page says it is withdrawn), nothing is deleted, and a
 * librarian can restore it.
 */
export async function setManualWithdrawn({ actor, id, reason }: { actor: Actor; id: string; reason: string | null }) {
  return getDb().transaction(async (tx) => {
    const [before] = await tx.select().from(manuals).where(eq(manuals.id, id)).for("update");
    if (!before) throw manualNotFound();
    const withdraw = reason !== null;
    if (withdraw && before.withdrawnAt) throw new AppError("conflict", "That manual is already withdrawn.");
    if (!withdraw && !before.withdrawnAt) throw new AppError("conflict", "That manual is in the library; there is nothing to restore.");
    await tx
      .update(manuals)
      .set(
        withdraw
          ? { withdrawnAt: new Date(), withdrawnBy: actor.id, withdrawReason: reason }
          : { withdrawnAt: null, withdrawnBy: null, withdrawReason: "" },
      )
      .where(eq(manuals.id, id));
    await recordAudit(tx, {
      actorId: actor.id,
      action: withdraw ? "manual.withdrawn" : "manual.restored",
      subjectType: "manual",
      subjectId: id,
      details: withdraw ? { title: before.title, reason } : { title: before.title },
    });
    return { id, withdrawn: withdraw };
  });
}

// Ingest of one revision, run by the worker: pages out of the PDF (text layer, OCR where there is
// none), stored in batches, then in one transaction the revision becomes ready and current.
// Until that transaction, the revision's pages are visible to nobody (lib/server/library/manuals.ts).
import { and, eq, sql } from "drizzle-orm";
import { getDb, getPool } from "@/db";
import { manuals, pages, revisions } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import { extractPageTexts, ocrImage, PdfProblem, readPdfInfo, renderPage } from "@/lib/server/pdf/tools";
import { headingOf, needsOcr, normalisePageText } from "@/lib/domain/library/page-text";
import { getSearchEngine } from "@/search";
import { getStore } from "@/lib/server/storage";
import { queueComparisonsAfterReady } from "@/lib/server/revisions/impact";
import { queueThumbnails } from "@/lib/server/ingest/queue";

const batchSize = 200;
export const heartbeatSeconds = 15;
export const maxAttempts = 3;

type Outcome = "ready" | "failed" | "skipped";

/** This attempt's claim was taken over (the sweeper queued the revision again meanwhile). */
class GivenUp extends Error {}

/**
 * While a worker reads a revision it holds a PostgreSQL advisory lock on it, on a connection of its
 * own. A worker that dies loses its connection and so the lock at once: a "processing" revision
 * whose lock is free has lost its worker, and a restarted worker takes it up again within seconds
 * rather than after the heartbeat goes stale.
 */
const lockKey = (revisionId: string) => `ingest:${revisionId}`;

export async function ingestRevision({
  revisionId,
  log = console.log,
}: {
  revisionId: string;
  log?: (m: string) => void;
}): Promise<Outcome> {
  const holder = await getPool().connect();
  try {
    const { rows } = await holder.query<{ ok: boolean }>("select pg_try_advisory_lock(hashtextextended($1, 0)) as ok", [
      lockKey(revisionId),
    ]);
    if (!rows[0]?.ok) return "skipped"; // a live worker has it
    return await ingestLocked({ revisionId, log });
  } finally {
    await holder.query("select pg_advisory_unlock_all()").catch(() => undefined);
    holder.release();
  }
}

async function ingestLocked({ revisionId, log }: { revisionId: string; log: (m: string) => void }): Promise<Outcome> {
  const db = getDb();
  // Claim it: a queued revision, or a processing one whose worker died (we hold its lock now).
  const [claimed] = await db
    .update(revisions)
    .set({ status: "processing", attempts: sql`${revisions.attempts} + 1`, heartbeatAt: sql`now()`, error: null, pagesDone: 0 })
    .where(and(eq(revisions.id, revisionId), sql`${revisions.status} in ('queued', 'processing')`))
    .returning({
      id: revisions.id,
      manualId: revisions.manualId,
      fileKey: revisions.fileKey,
      attempts: revisions.attempts,
      label: revisions.label,
    });
  if (!claimed) return "skipped";

  const started = Date.now();
  const beat = setInterval(() => {
    void db
      .update(revisions)
      .set({ heartbeatAt: sql`now()` })
      .where(eq(revisions.id, revisionId))
      .catch(() => undefined);
  }, heartbeatSeconds * 1000);

  // The page batch being written, if any (see flush below); awaited before a failure cleans up.
  let writing: Promise<void> = Promise.resolve();
  try {
    // A retry starts clean: whatever a dead attempt wrote goes.
    await db.delete(pages).where(eq(pages.revisionId, revisionId));
    const pageCount = await getStore().withLocalFile(claimed.fileKey, async (file) => {
      const { pages: expected } = await readPdfInfo(file);
      await db.update(revisions).set({ pageCount: expected }).where(eq(revisions.id, revisionId));

      let batch: (typeof pages.$inferInsert)[] = [];
      // One batch is written while the next is read: pdftotext and PostgreSQL (which also builds
      // each page's search vector) work on the two cores at once. Never more than one in flight,
      // so memory stays at two batches.
      const write = async (rows: (typeof pages.$inferInsert)[]) => {
        await db.insert(pages).values(rows);
        await db
          .update(revisions)
          .set({ pagesDone: sql`${revisions.pagesDone} + ${rows.length}`, heartbeatAt: sql`now()` })
          .where(eq(revisions.id, revisionId));
      };
      const flush = async () => {
        await writing;
        if (!batch.length) return;
        const rows = batch;
        batch = [];
        writing = write(rows);
        writing.catch(() => undefined); // awaited by the next flush or the last one
      };
      const found = await extractPageTexts(file, async (pageNumber, raw) => {
        let text = normalisePageText(raw);
        let ocr = false;
        if (needsOcr(text)) {
          text = normalisePageText(await ocrImage(await renderPage(file, pageNumber)));
          ocr = true;
        }
        batch.push({ revisionId, pageNumber, text, heading: headingOf(text), ocr });
        if (batch.length >= batchSize) await flush();
      });
      await flush();
      await writing;
      if (found !== expected) {
        throw new PdfProblem(`The PDF says it has ${expected} pages but only ${found} could be read. The file may be damaged.`);
      }
      return found;
    });

    // Findable before it is visible: the search index is complete when the revision turns ready.
    await getSearchEngine().indexRevision(revisionId);

    const becameCurrent = await db.transaction(async (tx) => {
      const [manual] = await tx
        .select({ currentRevisionId: manuals.currentRevisionId, currentDate: revisions.revisionDate })
        .from(manuals)
        .leftJoin(revisions, eq(revisions.id, manuals.currentRevisionId))
        .where(eq(manuals.id, claimed.manualId))
        .for("update", { of: manuals });
      const [me] = await tx.select({ revisionDate: revisions.revisionDate }).from(revisions).where(eq(revisions.id, revisionId));
      // A revision that finishes after a newer one stays readable but does not take over.
      const becomesCurrent = !manual?.currentRevisionId || !manual.currentDate || (me && me.revisionDate >= manual.currentDate);
      const [turned] = await tx
        .update(revisions)
        .set({
          status: "ready",
          pageCount,
          pagesDone: pageCount,
          readyAt: sql`now()`,
          heartbeatAt: null,
          supersededAt: becomesCurrent ? null : sql`now()`,
        })
        // Only the attempt this worker claimed turns it ready: a sweeper that gave it up meanwhile wins.
        .where(and(eq(revisions.id, revisionId), eq(revisions.status, "processing"), eq(revisions.attempts, claimed.attempts)))
        .returning({ id: revisions.id });
      if (!turned) throw new GivenUp();
      if (becomesCurrent) {
        if (manual?.currentRevisionId) {
          await tx
            .update(revisions)
            .set({ supersededAt: sql`now()` })
            .where(eq(revisions.id, manual.currentRevisionId));
        }
        await tx.update(manuals).set({ currentRevisionId: revisionId }).where(eq(manuals.id, claimed.manualId));
      }
      await recordAudit(tx, {
        actorId: null,
        action: "revision.ready",
        subjectType: "manual",
        subjectId: claimed.manualId,
        details: { revisionId, label: claimed.label, pages: pageCount, current: becomesCurrent },
      });
      return becomesCurrent;
    });
    if (becameCurrent) {
      await getSearchEngine()
        .setCurrentRevision(claimed.manualId, revisionId)
        .catch((error: unknown) => log(`search engine not told of the current revision: ${String(error)}`));
    }
    log(`revision ${revisionId}: ${pageCount} pages ready in ${((Date.now() - started) / 1000).toFixed(1)} s`);
    await queueThumbnails({ revisionId }).catch((error: unknown) => log(`thumbnails not queued: ${String(error)}`));
    await queueComparisonsAfterReady({ revisionId }).catch((error: unknown) => log(`comparison not queued: ${String(error)}`));
    return "ready";
  } catch (error) {
    // Another attempt owns the revision now: leave it and its pages alone.
    if (error instanceof GivenUp) {
      log(`revision ${revisionId}: this attempt was given up while it ran; leaving it to the newer one`);
      return "skipped";
    }
    const known = error instanceof PdfProblem;
    const lastTry = known || claimed.attempts >= maxAttempts;
    if (!lastTry) {
      // Put it back for the job's retry; the error may be passing (database restart, full disk).
      await db
        .update(revisions)
        .set({ status: "queued", heartbeatAt: null })
        .where(eq(revisions.id, revisionId))
        .catch(() => undefined);
      throw error;
    }
    await writing.catch(() => undefined);
    const reason = known
      ? error.message
      : `Ingest failed ${claimed.attempts} times; the last error was: ${String(error instanceof Error ? error.message : error).slice(0, 300)}`;
    await db.delete(pages).where(eq(pages.revisionId, revisionId));
    await db.update(revisions).set({ status: "failed", error: reason, heartbeatAt: null }).where(eq(revisions.id, revisionId));
    log(`revision ${revisionId} failed: ${reason}`);
    return "failed";
  } finally {
    clearInterval(beat);
  }
}

/**
 * Revisions whose worker died: "processing" with nobody holding their lock (it went with the dead
 * worker's connection). The sweeper puts them back in the queue, or fails them once they used their
 * attempts.
 */
export async function findStaleRevisions(): Promise<{ id: string; attempts: number }[]> {
  const processing = await getDb()
    .select({ id: revisions.id, attempts: revisions.attempts })
    .from(revisions)
    .where(eq(revisions.status, "processing"));
  if (!processing.length) return [];
  const probe = await getPool().connect();
  try {
    const orphaned: { id: string; attempts: number }[] = [];
    for (const r of processing) {
      const { rows } = await probe.query<{ ok: boolean }>("select pg_try_advisory_lock(hashtextextended($1, 0)) as ok", [lockKey(r.id)]);
      if (rows[0]?.ok) await probe.query("select pg_advisory_unlock(hashtextextended($1, 0))", [lockKey(r.id)]);
      // Only a revision nobody holds: a live worker whose heartbeat went quiet keeps its work.
      if (rows[0]?.ok) orphaned.push({ id: r.id, attempts: r.attempts });
    }
    return orphaned;
  } finally {
    probe.release();
  }
}

export async function failRevision({ id, reason }: { id: string; reason: string }) {
  await getDb().delete(pages).where(eq(pages.revisionId, id));
  await getDb().update(revisions).set({ status: "failed", error: reason, heartbeatAt: null }).where(eq(revisions.id, id));
}

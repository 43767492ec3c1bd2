import { createReadStream } from "node:fs";
import { mkdtemp, readdir, rm, stat } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db";
import { pages, revisions } from "@/db/schema";
import { packForReading, renderThumbnails } from "@/lib/server/pdf/tools";
import { getStore, storageKeys } from "@/lib/server/storage";

const chunk = 50;

/** The reader's copy of a ready revision (see packForReading); the upload itself stays as it was. */
export async function makeReaderCopy({ revisionId }: { revisionId: string }): Promise<boolean> {
  const db = getDb();
  const [revision] = await db
    .select({ fileKey: revisions.fileKey, status: revisions.status, readerFileKey: revisions.readerFileKey })
    .from(revisions)
    .where(eq(revisions.id, revisionId));
  if (!revision || revision.status !== "ready" || revision.readerFileKey) return false;
  const store = getStore();
  const dir = await mkdtemp(path.join(tmpdir(), "hangarleaf-reader-"));
  try {
    const out = path.join(dir, "reader.pdf");
    const packed = await store.withLocalFile(revision.fileKey, (file) => packForReading(file, out));
    if (!packed) return false;
    const key = storageKeys.readerCopy(revisionId);
    await store.put(key, createReadStream(out), "application/pdf");
    const { size } = await stat(out);
    await db.update(revisions).set({ readerFileKey: key, readerSizeBytes: size }).where(eq(revisions.id, revisionId));
    return true;
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** Small page images, made after the revision is ready: the reader shows them when they exist. */
export async function makeThumbnails({ revisionId }: { revisionId: string }): Promise<number> {
  const db = getDb();
  const [revision] = await db
    .select({ fileKey: revisions.fileKey, pageCount: revisions.pageCount, status: revisions.status })
    .from(revisions)
    .where(eq(revisions.id, revisionId));
  if (!revision || revision.status !== "ready" || !revision.pageCount) return 0;
  const store = getStore();
  let made = 0;
  await store.withLocalFile(revision.fileKey, async (file) => {
    for (let first = 1; first <= revision.pageCount!; first += chunk) {
      const last = Math.min(first + chunk - 1, revision.pageCount!);
      const dir = await mkdtemp(path.join(tmpdir(), "hangarleaf-thumbs-"));
      try {
        await renderThumbnails(file, first, last, path.join(dir, "t"));
        for (const name of await readdir(dir)) {
          const page = Number(/-(\d+)\.png$/.exec(name)?.[1]);
          if (!page) continue;
          const key = storageKeys.thumbnail(revisionId, page);
          await store.put(key, createReadStream(path.join(dir, name)), "image/png");
          await db
            .update(pages)
            .set({ thumbnailKey: key })
            .where(and(eq(pages.revisionId, revisionId), eq(pages.pageNumber, page)));
          made++;
        }
      } finally {
        await rm(dir, { recursive: true, force: true });
      }
    }
  });
  return made;
}

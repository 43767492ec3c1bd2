// Puts the invented manuals into the library: each PDF is rendered, stored and queued for ingest
// like an upload. Skips what exists, so a second seed adds nothing.
import { createHash, randomUUID } from "node:crypto";
import { Readable } from "node:stream";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { manuals, revisions, users } from "@/db/schema";
import { queueIngest } from "@/lib/server/ingest/queue";
import { getStore, storageKeys } from "@/lib/server/storage";
import { demoManuals, demoRevisions, secondRevisionOfTrainer, type DemoManual } from "./manual-content";
import { renderManualPdf } from "./manual-pdf";

async function storeRevision(
  db: Db,
  manualId: string,
  manual: DemoManual,
  revision: { label: string; date: string },
  uploadedBy: string | null,
) {
  const bytes = await renderManualPdf(manual, revision);
  const revisionId = randomUUID();
  const key = storageKeys.revisionFile(revisionId);
  await getStore().put(key, Readable.from(Buffer.from(bytes)), "application/pdf");
  await db.insert(revisions).values({
    id: revisionId,
    manualId,
    label: revision.label,
    revisionDate: revision.date,
    fileKey: key,
    sizeBytes: bytes.length,
    sha256: createHash("sha256").update(bytes).digest("hex"),
    uploadedBy,
  });
  await queueIngest({ revisionId });
  return bytes.length;
}

export async function seedLibrary(db: Db): Promise<number> {
  const [librarian] = await db.select({ id: users.id }).from(users).where(eq(users.email, "librarian@hangarleaf.test"));
  const by = librarian?.id ?? null;
  let added = 0;
  for (const manual of demoManuals) {
    const [existing] = await db.select({ id: manuals.id }).from(manuals).where(eq(manuals.title, manual.title));
    let manualId = existing?.id;
    if (!manualId) {
      const ata = [...new Set(manual.chapters.map((c) => c.ata))].sort();
      const [row] = await db
        .insert(manuals)
        .values({
          title: manual.title,
          documentType: manual.documentType,
          applicability: manual.applicability,
          ataChapters: ata,
          createdBy: by,
        })
        .returning({ id: manuals.id });
      manualId = row!.id;
      const isTrainer = manual.title.startsWith("HT-20");
      await storeRevision(db, manualId, manual, isTrainer ? demoRevisions.trainerFirst : demoRevisions.others, by);
      added++;
    }
    if (manual.title.startsWith("HT-20")) {
      const second = demoRevisions.trainerSecond;
      const [has] = await db
        .select({ id: revisions.id })
        .from(revisions)
        .where(and(eq(revisions.manualId, manualId), eq(revisions.label, second.label)));
      if (!has) {
        await storeRevision(db, manualId, secondRevisionOfTrainer(manual), second, by);
        added++;
      }
    }
  }
  return added;
}

import "server-only";
import { createHash } from "node:crypto";
import { Readable } from "node:stream";
import { and, eq, inArray, sql } from "drizzle-orm";
import { PDFDocument, type PDFPage } from "pdf-lib";
import type { Db } from "@/db";
import { manuals, pages, revisions } from "@/db/schema";
import type { Tx } from "@/db";
import type { CardVersionDto } from "@/lib/contracts/cards";
import type { PacketPageDto } from "@/lib/contracts/runs";
import { getStore, storageKeys } from "@/lib/server/storage";

// The offline packet of a card version: one small PDF holding only the pages its steps cite, in the
// order the steps cite them, so a cart stores a few pages instead of whole manuals. Made with
// pdf-lib on first request and kept in the object store under the hash of the page set, so every
// card citing the same pages shares one file.

export interface PacketPlan {
  pages: PacketPageDto[];
  keepOnCarts: { revisionId: string; manualTitle: string; url: string }[];
  hash: string;
}

export async function packetFor(db: Db | Tx, version: CardVersionDto): Promise<PacketPlan> {
  const seen = new Set<string>();
  const cited: { revisionId: string; page: number }[] = [];
  for (const ref of version.steps.flatMap((s) => s.references)) {
    const key = `${ref.revisionId}:${ref.page}`;
    if (!seen.has(key)) {
      seen.add(key);
      cited.push({ revisionId: ref.revisionId, page: ref.page });
    }
  }
  if (!cited.length) return { pages: [], keepOnCarts: [], hash: "" };
  const revisionIds = [...new Set(cited.map((c) => c.revisionId))];
  const described = await db
    .select({
      id: revisions.id,
      label: revisions.label,
      manualId: manuals.id,
      manualTitle: manuals.title,
      keepOnCarts: manuals.keepOnCarts,
    })
    .from(revisions)
    .innerJoin(manuals, eq(manuals.id, revisions.manualId))
    .where(inArray(revisions.id, revisionIds));
  const texts = await db
    .select({ revisionId: pages.revisionId, page: pages.pageNumber, text: pages.text })
    .from(pages)
    .where(
      and(
        inArray(pages.revisionId, revisionIds),
        sql`(${pages.revisionId}::text || ':' || ${pages.pageNumber}) = any(${`{${[...seen].join(",")}}`}::text[])`,
      ),
    );
  const textOf = new Map(texts.map((t) => [`${t.revisionId}:${t.page}`, t.text]));
  const byId = new Map(described.map((d) => [d.id, d]));
  const planned = cited
    .filter((c) => byId.has(c.revisionId))
    .map((c, i): PacketPageDto => {
      const d = byId.get(c.revisionId)!;
      return {
        manualId: d.manualId,
        manualTitle: d.manualTitle,
        revisionId: c.revisionId,
        revisionLabel: d.label,
        page: c.page,
        packetPage: i + 1,
        text: textOf.get(`${c.revisionId}:${c.page}`) ?? "",
      };
    });
  const hash = createHash("sha256")
    .update(planned.map((p) => `${p.revisionId}:${p.page}`).join(","))
    .digest("hex")
    .slice(0, 40);
  return {
    pages: planned,
    hash,
    keepOnCarts: described
      .filter((d) => d.keepOnCarts)
      .map((d) => ({ revisionId: d.id, manualTitle: d.manualTitle, url: `/api/revisions/${d.id}/file` })),
  };
}

async function readAll(body: Readable): Promise<Uint8Array> {
  const chunks: Buffer[] = [];
  for await (const chunk of body) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

/** The packet's bytes: from the store when made before, otherwise made now and stored. */
export async function packetBytes(db: Db | Tx, plan: PacketPlan): Promise<Uint8Array> {
  const store = getStore();
  const key = storageKeys.packet(plan.hash);
  if ((await store.size(key)) != null) return readAll((await store.get(key)).body);
  const files = await db
    .select({ id: revisions.id, fileKey: revisions.fileKey })
    .from(revisions)
    .where(inArray(revisions.id, [...new Set(plan.pages.map((p) => p.revisionId))]));
  const out = await PDFDocument.create();
  out.setTitle("Hangarleaf offline packet");
  const copied = new Map<string, PDFPage>();
  for (const file of files) {
    const source = await PDFDocument.load(await readAll((await store.get(file.fileKey)).body), { updateMetadata: false });
    const wanted = plan.pages.filter((p) => p.revisionId === file.id);
    const pagesCopied = await out.copyPages(
      source,
      wanted.map((p) => p.page - 1),
    );
    wanted.forEach((p, i) => copied.set(`${p.revisionId}:${p.page}`, pagesCopied[i]!));
  }
  // Pages go in packet order, whatever revision they came from.
  for (const p of plan.pages) out.addPage(copied.get(`${p.revisionId}:${p.page}`)!);
  const bytes = await out.save();
  await store.put(key, Readable.from(Buffer.from(bytes)), "application/pdf");
  return bytes;
}

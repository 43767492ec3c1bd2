// Search in Meilisearch, for a school network that outgrows one database: one document per page,
// through the official client. Typos, prefixes, phrases and exclusion are Meilisearch's own; the
// abbreviations go in as synonyms. Selected by MEILI_URL (search/index.ts).
import { asc, eq } from "drizzle-orm";
import { Meilisearch } from "meilisearch";
import { getDb } from "@/db";
import { manuals, pages, revisions } from "@/db/schema";
import type { SearchEngine, SearchHit } from "./engine";
import { totalLimit } from "./engine";
import abbreviations from "./abbreviations.json";
import { markEnd, markStart, snippetToHtml, type ParsedQuery } from "./query";

interface PageDocument {
  id: string;
  revisionId: string;
  manualId: string;
  manualTitle: string;
  revisionLabel: string;
  documentType: string;
  applicability: string[];
  ataChapters: string[];
  current: boolean;
  page: number;
  heading: string;
  text: string;
}

/** Meilisearch ids allow letters, digits, - and _ only. */
const documentId = (revisionId: string, page: number) => `${revisionId}_${page}`;
const quote = (v: string) => `"${v.replaceAll("\\", "\\\\").replaceAll('"', '\\"')}"`;

function synonyms(): Record<string, string[]> {
  const table: Record<string, string[]> = {};
  for (const [word, expansions] of Object.entries(abbreviations as Record<string, unknown>)) {
    if (!word.startsWith("_") && Array.isArray(expansions)) table[word] = expansions as string[];
  }
  return table;
}

export function meilisearchEngine(options: { url: string; key?: string; index: string }): SearchEngine {
  const client = new Meilisearch({ host: options.url, apiKey: options.key });
  const index = client.index<PageDocument>(options.index);
  let configured: Promise<unknown> | null = null;
  const configure = () =>
    (configured ??= index
      .updateSettings({
        searchableAttributes: ["heading", "text", "manualTitle"], // in order of weight
        filterableAttributes: ["revisionId", "manualId", "documentType", "applicability", "ataChapters", "current"],
        synonyms: synonyms(),
      })
      .waitTask()
      .catch((error: unknown) => {
        configured = null;
        throw error;
      }));

  return {
    name: "meilisearch",

    async indexRevision(revisionId) {
      await configure();
      const db = getDb();
      const [meta] = await db
        .select({
          manualId: manuals.id,
          manualTitle: manuals.title,
          documentType: manuals.documentType,
          applicability: manuals.applicability,
          ataChapters: manuals.ataChapters,
          label: revisions.label,
          currentRevisionId: manuals.currentRevisionId,
        })
        .from(revisions)
        .innerJoin(manuals, eq(manuals.id, revisions.manualId))
        .where(eq(revisions.id, revisionId));
      if (!meta) return;
      const rows = await db
        .select({ page: pages.pageNumber, heading: pages.heading, text: pages.text })
        .from(pages)
        .where(eq(pages.revisionId, revisionId))
        .orderBy(asc(pages.pageNumber));
      const documents: PageDocument[] = rows.map((row) => ({
        id: documentId(revisionId, row.page),
        revisionId,
        manualId: meta.manualId,
        manualTitle: meta.manualTitle,
        revisionLabel: meta.label,
        documentType: meta.documentType,
        applicability: meta.applicability,
        ataChapters: meta.ataChapters,
        current: meta.currentRevisionId === revisionId,
        page: row.page,
        heading: row.heading,
        text: row.text,
      }));
      for (let i = 0; i < documents.length; i += 1000) {
        await index.addDocuments(documents.slice(i, i + 1000), { primaryKey: "id" }).waitTask();
      }
    },

    async removeRevision(revisionId) {
      await index.deleteDocuments({ filter: `revisionId = ${quote(revisionId)}` }).waitTask();
    },

    async setCurrentRevision(manualId, revisionId) {
      await configure();
      for (;;) {
        const stale = await index.getDocuments({
          filter: `manualId = ${quote(manualId)} AND current = true AND revisionId != ${quote(revisionId)}`,
          fields: ["id"],
          limit: 1000,
        });
        if (!stale.results.length) break;
        await index.updateDocuments(stale.results.map((d) => ({ id: d.id, current: false }))).waitTask();
      }
      const count = await getDb().select({ n: revisions.pageCount }).from(revisions).where(eq(revisions.id, revisionId));
      const n = count[0]?.n ?? 0;
      for (let first = 1; first <= n; first += 1000) {
        const ids = Array.from({ length: Math.min(1000, n - first + 1) }, (_, i) => documentId(revisionId, first + i));
        await index.updateDocuments(ids.map((id) => ({ id, current: true }))).waitTask();
      }
    },

    async search(query: ParsedQuery, filters, { limit, offset }) {
      await configure();
      const q = [
        ...query.words.map((w) => w.text),
        ...query.phrases.map((p) => quote(p)),
        ...query.excluded.map((e) => (e.includes(" ") ? `-${quote(e)}` : `-${e}`)),
      ].join(" ");
      const filter: string[] = [];
      if (filters.revisionId) filter.push(`revisionId = ${quote(filters.revisionId)}`);
      else if (!filters.includeSuperseded) filter.push("current = true");
      if (filters.manualId) filter.push(`manualId = ${quote(filters.manualId)}`);
      if (filters.documentType) filter.push(`documentType = ${quote(filters.documentType)}`);
      if (filters.model) filter.push(`applicability = ${quote(filters.model)}`);
      if (filters.ata) filter.push(`ataChapters = ${quote(filters.ata)}`);
      const result = await index.search(q, {
        filter: filter.join(" AND ") || undefined,
        limit,
        offset,
        attributesToCrop: ["text"],
        cropLength: 30,
        attributesToHighlight: ["text"],
        highlightPreTag: markStart,
        highlightPostTag: markEnd,
        showRankingScore: true,
      });
      const hits: SearchHit[] = result.hits.map((hit) => ({
        manualId: hit.manualId,
        revisionId: hit.revisionId,
        manualTitle: hit.manualTitle,
        revisionLabel: hit.revisionLabel,
        current: hit.current,
        page: hit.page,
        snippet: snippetToHtml(String((hit._formatted as Partial<PageDocument> | undefined)?.text ?? hit.text.slice(0, 200))),
        score: Number((hit._rankingScore ?? 0).toFixed(4)),
      }));
      const total = result.estimatedTotalHits ?? hits.length;
      return { hits, total: Math.min(total, totalLimit), totalCapped: total > totalLimit };
    },
  };
}

// Search in Meilisearch, for a school network that outgrows one database: one document per page,
// through the official client. Typos, prefixes, phrases and exclusion are Meilisearch's own; the
// abbreviations and the concept families go in as synonyms (one way: a family finds its members,
// not the other way round). Selected by MEILI_URL (search/index.ts). Ranking is Meilisearch's own
// rules (words, typo, proximity, attribute, exactness), which already put the words side by side
// and the exact words first. Pages with most of the words come from its "last" matching strategy,
// after asking which words no page has; which words a hit lacks is read from the matched positions,
// so it is an approximation (a matched word counts when it starts like the searched one).
import { asc, eq, isNotNull } from "drizzle-orm";
import { Meilisearch } from "meilisearch";
import { getDb } from "@/db";
import { manuals, pages, revisions } from "@/db/schema";
import type { SearchEngine, SearchFilters, SearchHit } from "./engine";
import { totalLimit } from "./engine";
import abbreviations from "./abbreviations.json";
import { revisionsInScope } from "./postgres";
import { expansionTableOf, markEnd, markStart, snippetToHtml, type ParsedQuery } from "./query";
import { findSections } from "./sections";

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
  return Object.fromEntries(expansionTableOf(abbreviations as Record<string, unknown>));
}

/** A term of the query as Meilisearch reads it, with the words that count as finding it. */
interface Term {
  label: string;
  q: string;
  words: string[];
}

function termsOf(query: ParsedQuery): Term[] {
  return [
    ...query.words.map((w) => ({ label: w.text, q: w.text, words: [w.text, ...w.expansions].flatMap((x) => x.split(/[\s-]+/)) })),
    ...query.phrases.map((p) => ({ label: p, q: quote(p), words: p.split(/\s+/) })),
  ];
}

/** Whether a matched piece of text stands for a term: it starts like one of the term's words (endings and small typos aside). */
function matches(term: Term, matched: string[]): boolean {
  const starts = term.words.filter(Boolean).map((w) => w.toLowerCase().slice(0, Math.min(4, w.length)));
  return matched.some((m) => starts.some((s) => m.startsWith(s)));
}

function filterOf(filters: SearchFilters, withdrawn: string[] = []): string | undefined {
  const filter: string[] = [];
  // Withdrawn manuals leave search, except inside one revision (the reader's own search).
  if (withdrawn.length && !filters.revisionId) filter.push(`NOT manualId IN [${withdrawn.map(quote).join(", ")}]`);
  if (filters.revisionId) filter.push(`revisionId = ${quote(filters.revisionId)}`);
  else if (!filters.includeSuperseded) filter.push("current = true");
  if (filters.manualId) filter.push(`manualId = ${quote(filters.manualId)}`);
  if (filters.documentType) filter.push(`documentType = ${quote(filters.documentType)}`);
  if (filters.model) filter.push(`applicability = ${quote(filters.model)}`);
  if (filters.ata) filter.push(`ataChapters = ${quote(filters.ata)}`);
  return filter.join(" AND ") || undefined;
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
      const terms = termsOf(query);
      const excluded = query.excluded.map((e) => (e.includes(" ") ? `-${quote(e)}` : `-${e}`));
      // The few withdrawn manuals are read from PostgreSQL each time: the page documents carry no flag to keep in step.
      const withdrawn = (await getDb().select({ id: manuals.id }).from(manuals).where(isNotNull(manuals.withdrawnAt))).map((m) => m.id);
      const filter = filterOf(filters, withdrawn);
      const goesTo = query.section ? await findSections(query.section, await revisionsInScope(filters)) : [];
      const ask = (present: Term[], strategy: "all" | "last") =>
        index.search([...present.map((t) => t.q), ...excluded].join(" "), {
          filter,
          limit,
          offset,
          matchingStrategy: strategy,
          attributesToCrop: ["text"],
          cropLength: 30,
          attributesToHighlight: ["text"],
          highlightPreTag: markStart,
          highlightPostTag: markEnd,
          showRankingScore: true,
          showMatchesPosition: strategy === "last",
        });
      const answer = (result: Awaited<ReturnType<typeof ask>>, present: Term[] | null, missing: string[]) => {
        const hits: SearchHit[] = result.hits.map((hit) => {
          const matched = Object.entries(hit._matchesPosition ?? {}).flatMap(([field, positions]) =>
            (positions ?? []).map((p) =>
              String(hit[field as keyof PageDocument] ?? "")
                .substr(p.start, p.length)
                .toLowerCase(),
            ),
          );
          return {
            manualId: hit.manualId,
            revisionId: hit.revisionId,
            manualTitle: hit.manualTitle,
            revisionLabel: hit.revisionLabel,
            current: hit.current,
            page: hit.page,
            snippet: snippetToHtml(String((hit._formatted as Partial<PageDocument> | undefined)?.text ?? hit.text.slice(0, 200))),
            score: Number((hit._rankingScore ?? 0).toFixed(4)),
            missing: [...missing, ...(present ?? []).filter((t) => !matches(t, matched)).map((t) => t.label)],
          };
        });
        const total = result.estimatedTotalHits ?? hits.length;
        return { hits, total: Math.min(total, totalLimit), totalCapped: total > totalLimit };
      };

      const all = await ask(terms, "all");
      const total = all.estimatedTotalHits ?? all.hits.length;
      // As in PostgreSQL: the pages with most of the words only when those with all of them do not fill a page.
      if (total >= limit || (terms.length < 2 && total > 0)) return { ...answer(all, null, []), partial: false, missing: [], goesTo };
      const found = await Promise.all(
        terms.map(async (t) => ((await index.search(t.q, { filter, limit: 0 })).estimatedTotalHits ?? 0) > 0),
      );
      const missing = terms.filter((_, i) => !found[i]).map((t) => t.label);
      const present = terms.filter((_, i) => found[i]);
      if (!missing.length && present.length < 2) return { ...answer(all, null, []), partial: false, missing, goesTo };
      if (!present.length) return { hits: [], total: 0, totalCapped: false, partial: false, missing, goesTo };
      return { ...answer(await ask(present, "last"), present, missing), partial: true, missing, goesTo };
    },
  };
}

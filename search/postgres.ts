// Search in PostgreSQL: pages.search_vector (heading weight A, body B) behind a GIN index. Only a
// bounded set of candidates is ranked (every heading match, and the first body matches), so a word
// found on every page costs a few thousand rank computations, not fifty thousand. Typos are
// corrected against search_words with trigrams and edit distance.
import { sql, type SQL } from "drizzle-orm";
import { getDb } from "@/db";
import { getEnv } from "@/lib/server/env";
import { LRUCache } from "lru-cache";
import type { SearchEngine, SearchFilters, SearchHit, SearchResult } from "./engine";
import { totalLimit } from "./engine";
import { markEnd, markStart, snippetToHtml, type ParsedQuery, type QueryWord } from "./query";
import { findSections } from "./sections";

/** A lexeme as a to_tsquery operand: quoted, so no character in it is read as an operator. */
function quoted(lexeme: string): string {
  return `'${lexeme.replaceAll("'", "''")}'`;
}

const plainWord = /^[\p{L}\p{N}]+$/u;

/** The word as typed (stemmed, as the page vectors are), without expansions or corrections. */
function typedQuery(word: QueryWord, config: "english" | "simple" = "english"): SQL {
  const cfg = sql.raw(`'${config}'`);
  if (plainWord.test(word.text)) return sql`to_tsquery(${cfg}, ${quoted(word.text) + (word.prefix ? ":*" : "")})`;
  // Codes such as 32-10-00 or 0.032, and words typed together ("mag particle"): the parser splits them the same way on both sides.
  return sql`phraseto_tsquery(${cfg}, ${word.text})`;
}

function wordQuery(word: QueryWord, corrections: string[]): SQL {
  const alternatives: SQL[] = [typedQuery(word)];
  for (const expansion of word.expansions) alternatives.push(sql`phraseto_tsquery('english', ${expansion})`);
  for (const correction of corrections) alternatives.push(sql`to_tsquery('simple', ${quoted(correction) + (word.prefix ? ":*" : "")})`);
  return sql`(${sql.join(alternatives, sql` || `)})`;
}

/** Words that appear nowhere in the library, each with up to three near spellings that do. */
export async function findCorrections(words: QueryWord[]): Promise<Map<string, string[]>> {
  const candidates = words.filter((w) => plainWord.test(w.text) && w.text.length >= 4).map((w) => w.text);
  const found = new Map<string, string[]>();
  if (!candidates.length) return found;
  const result = await getDb().execute<{ word: string; corrections: string[] | null }>(sql`
    select q.word,
      (select array_agg(c.word order by levenshtein(c.word, q.stem), similarity(c.word, q.stem) desc)
         from (select sw.word from search_words sw
                where sw.word % q.stem and levenshtein(sw.word, q.stem) <= 2
                order by levenshtein(sw.word, q.stem), similarity(sw.word, q.stem) desc
                limit 3) c) as corrections
    from (select w as word, coalesce((ts_lexize('english_stem', w))[1], w) as stem
            from unnest(${sql.raw(`ARRAY[${candidates.map((c) => `'${c.replaceAll("'", "''")}'`).join(",")}]::text[]`)}) as w) q
    where not exists (select 1 from search_words sw where sw.word = q.stem)
  `);
  for (const row of result.rows) if (row.corrections?.length) found.set(row.word, row.corrections);
  return found;
}

/** One thing the user asked for: a word with its alternatives, or a quoted phrase. */
export interface SearchTerm {
  /** As typed, for "no page has …". */
  label: string;
  query: SQL;
  /** A word (with its alternatives) rather than a quoted phrase: the words make the ranking phrase. */
  word: boolean;
}

/** The words side by side in typed order, each with its alternatives ("mag timing" also stands for "magneto timing"). */
function phraseOf(terms: SearchTerm[]): SQL | null {
  const words = terms.filter((t) => t.word);
  if (words.length < 2) return null;
  return words.slice(1).reduce<SQL>((left, right) => sql`tsquery_phrase(${left}, ${right.query})`, words[0]!.query);
}

/**
 * What a search asks of the pages. `match` finds them (every term, none of the excluded); the
 * rest only ranks them: `phrase` (the words side by side, each with its alternatives, so "mag
 * timing" also stands for "magneto timing"), `typed` (the words as typed, so a page that has them
 * ranks above one found only through an expansion, a family or a typo correction) and `headingWords`
 * (the words as typed, looked for in the heading's letters, so "timing" ranks above "time").
 */
export interface SearchPlan {
  match: SQL;
  terms: SearchTerm[];
  excluded: SQL | null;
  typed: SQL | null;
  phrase: SQL | null;
  headingWords: string[];
}

export async function buildTsQuery(query: ParsedQuery): Promise<SearchPlan | null> {
  const corrections = await findCorrections(query.words.filter((w) => !w.prefix || w.text.length >= 5));
  const terms: SearchTerm[] = [
    ...query.words.map((w) => ({ label: w.text, query: wordQuery(w, corrections.get(w.text) ?? []), word: true })),
    ...query.phrases.map((p) => ({ label: p, query: sql`phraseto_tsquery('english', ${p})`, word: false })),
  ];
  if (!terms.length) return null;
  const excluded = query.excluded.length
    ? sql.join(
        query.excluded.map((e) => sql`!! phraseto_tsquery('english', ${e})`),
        sql` && `,
      )
    : null;
  const match = sql`(${sql.join([...terms.map((t) => t.query), ...(excluded ? [excluded] : [])], sql` && `)})`;
  // Only worth ranking apart when something besides the typed words can match.
  const widened = query.words.some((w) => w.expansions.length > 0 || corrections.has(w.text));
  const typed =
    widened && query.words.length
      ? sql`(${sql.join(
          query.words.map((w) => typedQuery(w)),
          sql` || `,
        )})`
      : null;
  return { match, terms, excluded, typed, phrase: phraseOf(terms), headingWords: query.words.map((w) => w.text) };
}

/** Matches in scope, counted up to one past `totalLimit` (reading every page of a common word is not worth it). */
async function countMatches(tsquery: SQL, revisionIds: string[]): Promise<number> {
  const rows = await getDb().execute<{ n: number }>(sql`
    select count(*)::int as n from (
      select 1 from pages p
      where p.search_vector @@ ${tsquery} and p.revision_id::text = any(${uuidTextList(revisionIds)})
      limit ${totalLimit + 1}) t`);
  return rows.rows[0]?.n ?? 0;
}

/** The revisions a search may look in: ready, current unless asked otherwise, and the filters. */
async function revisionsInScope(filters: SearchFilters): Promise<string[]> {
  const where: SQL[] = [sql`r.status = 'ready'`];
  if (filters.revisionId) where.push(sql`r.id = ${filters.revisionId}`);
  else if (!filters.includeSuperseded) where.push(sql`r.id = m.current_revision_id`);
  // Withdrawn manuals leave search, except inside one revision (the reader's own search).
  if (!filters.revisionId) where.push(sql`m.withdrawn_at is null`);
  if (filters.manualId) where.push(sql`m.id = ${filters.manualId}`);
  if (filters.documentType) where.push(sql`m.document_type = ${filters.documentType}`);
  if (filters.model) where.push(sql`${filters.model} = any(m.applicability)`);
  if (filters.ata) where.push(sql`${filters.ata} = any(m.ata_chapters)`);
  const rows = await getDb().execute<{ id: string }>(
    sql`select r.id from revisions r join manuals m on m.id = r.manual_id where ${sql.join(where, sql` and `)}`,
  );
  return rows.rows.map((r) => r.id);
}

const uuidTextList = (ids: string[]) =>
  sql.raw(`array[${ids.map((id) => `'${id.replace(/[^0-9a-f-]/gi, "").toLowerCase()}'`).join(",")}]::text[]`);

/**
 * How many body matches are ranked at most. A word on more pages than this is ranked among the
 * pages whose heading has it (all of them) and the first this many that mention it: past a few
 * thousand pages, "mentions the word" tells a reader nothing more, and ranking every one would cost
 * half a second on 50,000 pages. It is above `totalLimit`, so the candidates also give the count.
 */
export const rankedCandidates = 400;
if (rankedCandidates <= totalLimit) throw new Error("rankedCandidates must exceed totalLimit: the count is taken from the candidates");

/**
 * Cover density with the heading (A) weighing most, damped by page length (normalisation 1) and
 * kept below 1 (32: rank / (rank + 1), the same order), so the steps of `score` stay apart.
 */
const rank = (tsquery: SQL) => sql`ts_rank_cd('{0.1, 0.2, 0.4, 1.0}', p.search_vector, ${tsquery}, 1 | 32)`;

/**
 * A candidate's score, in steps: 4 when the words stand together (the phrase, or an expansion's
 * phrase), up to 2 for the share of the words the heading has as typed (not a stem of them), then
 * below 1 each the rank of the typed words (not their expansions, families or corrections) and the
 * rank of everything that matched.
 */
function score(plan: SearchPlan, ranked: SQL, phrase: SQL | null): SQL {
  const parts: SQL[] = [rank(ranked)];
  if (phrase) parts.push(sql`(case when p.search_vector @@ ${phrase} then 4 else 0 end)`);
  if (plan.headingWords.length) {
    // A plain ILIKE on the short heading: parsing it into an unstemmed vector for each candidate
    // cost more than all the other ranking parts together. Query words hold no % or _ (see clean()
    // in search/query.ts), and "timing" inside "timings" still counts as the word typed.
    const found = sql.join(
      plan.headingWords.map((w) => sql`(p.heading ilike ${`%${w}%`})::int`),
      sql` + `,
    );
    parts.push(sql`(2.0 * (${found}) / ${plan.headingWords.length})`);
  }
  if (plan.typed) parts.push(rank(plan.typed));
  return sql`(${sql.join(parts, sql` + `)})`;
}

/** How many of the terms a page has (the partial answer orders by it first). */
const termsMatched = (terms: SearchTerm[]) =>
  sql`(${sql.join(
    terms.map((t) => sql`(p.search_vector @@ ${t.query})::int`),
    sql` + `,
  )})`;

/** Ranks a partial answer: pages with any of `present` (the terms some page in scope has), those with all of them first. */
export interface PartialRanking {
  present: SearchTerm[];
}

/**
 * The ranked statement: the page of hits, each row also carrying `matches`, the number of distinct
 * candidates. The body branch reads every match in scope up to `rankedCandidates`, so below that
 * `matches` is the exact count, and at it there are more than `totalLimit`: no second pass over the
 * index is needed to count. The revisions in scope come in as a list (a join to manuals here made
 * the planner scan each revision's pages instead).
 *
 * With `partial`, the candidates are the pages with any of the present terms: those whose heading
 * has one, the first pages with all of them (the other words of a query with one unknown word),
 * and the first with any; ordered by how many terms they have, then by score.
 */
export function rankedSql(
  plan: SearchPlan,
  revisionIds: string[],
  // Required, not defaulted: a caller that forgot it would time a different statement (bench:search did).
  { limit, offset, hasExclusions, partial }: { limit: number; offset: number; hasExclusions: boolean; partial?: PartialRanking },
): SQL {
  // Compared as text so the planner filters the few matches by revision rather than reading the
  // primary key for every page of every revision in scope.
  const scope = sql`p.revision_id::text = any(${uuidTextList(revisionIds)})`;
  const not = plan.excluded ? sql` && ${plan.excluded}` : sql``;
  const all = partial
    ? sql`(${sql.join(
        partial.present.map((t) => t.query),
        sql` && `,
      )}${not})`
    : plan.match;
  const any = partial
    ? sql`((${sql.join(
        partial.present.map((t) => t.query),
        sql` || `,
      )})${not})`
    : plan.match;
  // A heading match is a match of the whole page (the heading is part of search_vector), unless a
  // word is excluded: then the body must be checked too. Skipping the check saves reading the
  // page's vector twice.
  const headingMatch = hasExclusions ? sql`p.heading_vector @@ ${any} and p.search_vector @@ ${any}` : sql`p.heading_vector @@ ${any}`;
  const matched = partial ? termsMatched(partial.present) : sql`0`;
  // Ranked inside each branch, on the row already read: joining back to pages for the vector made
  // the planner scan the whole table.
  const branch = (where: SQL) => sql`
      (select p.revision_id, p.page_number, ${score(plan, any, partial ? phraseOf(partial.present) : plan.phrase)} as score, ${matched} as matched from pages p
        where ${where} and ${scope}
        limit ${rankedCandidates})`;
  const branches = [branch(headingMatch), branch(sql`p.search_vector @@ ${all}`)];
  if (partial && partial.present.length > 1) branches.push(branch(sql`p.search_vector @@ ${any}`));
  return sql`
    select revision_id, page_number, max(score) as score, max(matched) as matched, count(*) over () as matches from (
      ${sql.join(branches, sql` union all `)}
    ) candidates
    group by revision_id, page_number
    order by matched desc, score desc, revision_id, page_number
    limit ${limit} offset ${offset}`;
}

export { revisionsInScope };

/**
 * Answers kept by query, filters and page under the library's search generation (migration 0008),
 * which every change a search could find or show raises: a kept answer is never older than the
 * data it was read from. A class working the same task card searches the same words; a kept
 * answer costs one small read instead of the ranked query. The answer is the same for everyone
 * who may search (the library has no per-user visibility; if it gets some, the key must hold it).
 * HL_SEARCH_CACHE=off turns it off (bench:search measures both).
 */
/** The lifetime is not needed for freshness (the generation is): it only lets old generations' answers go. */
const answers = new LRUCache<string, SearchResult>({ max: 500, ttl: 10 * 60_000 });

export async function searchGeneration(): Promise<number> {
  const rows = await getDb().execute<{ n: string }>(sql`select n from search_generation`);
  // Without its row nothing would ever raise the number: better no search than stale answers.
  if (!rows.rows[0]) throw new Error("search_generation has no row (migration 0008)");
  return Number(rows.rows[0].n);
}

/**
 * Which terms some page in scope has (an unknown word has none), and which are empty: a stop
 * word ("the") makes an empty query, which PostgreSQL leaves out of a match; it is left out here too.
 */
async function termsFound(terms: SearchTerm[], revisionIds: string[]): Promise<{ found: boolean[]; empty: boolean[] }> {
  const scope = sql`p.revision_id::text = any(${uuidTextList(revisionIds)})`;
  const rows = await getDb().execute<{ found: boolean[]; empty: boolean[] }>(sql`
    select array[${sql.join(
      terms.map((t) => sql`exists (select 1 from pages p where p.search_vector @@ ${t.query} and ${scope})`),
      sql`, `,
    )}] as found,
    array[${sql.join(
      terms.map((t) => sql`numnode(${t.query}) = 0`),
      sql`, `,
    )}] as empty`);
  return rows.rows[0]!;
}

type HitRow = {
  manual_id: string;
  revision_id: string;
  manual_title: string;
  revision_label: string;
  current: boolean;
  page: number;
  score: number;
  matches: string;
  snippet: string;
  has: boolean[] | null;
};

/** The ranked page of hits with their snippets; `partial` also says which terms each page has. */
async function rankedHits(
  plan: SearchPlan,
  revisionIds: string[],
  options: { limit: number; offset: number; hasExclusions: boolean; partial?: PartialRanking },
): Promise<HitRow[]> {
  const present = options.partial?.present;
  const marked = present
    ? sql`(${sql.join(
        present.map((t) => t.query),
        sql` || `,
      )})`
    : plan.match;
  const has = present
    ? sql`array[${sql.join(
        present.map((t) => sql`p.search_vector @@ ${t.query}`),
        sql`, `,
      )}]`
    : sql`null::boolean[]`;
  const rows = await getDb().execute<HitRow>(sql`
      with best as (${rankedSql(plan, revisionIds, options)})
      select b.revision_id, b.page_number as page, b.score, b.matches, m.id as manual_id, m.title as manual_title,
             r.label as revision_label, (m.current_revision_id = b.revision_id) as current, ${has} as has,
             ts_headline('english', p.text, ${marked},
               ${`StartSel=${markStart}, StopSel=${markEnd}, MaxWords=30, MinWords=12, MaxFragments=2, FragmentDelimiter=" … "`}) as snippet
      from best b
      join pages p on p.revision_id = b.revision_id and p.page_number = b.page_number
      join revisions r on r.id = b.revision_id
      join manuals m on m.id = r.manual_id
      order by b.matched desc, b.score desc, b.revision_id, b.page_number`);
  return rows.rows;
}

/** The uncached search: typo corrections and scope, then the ranked page of hits with snippets. */
async function searchNow(
  query: ParsedQuery,
  filters: SearchFilters,
  { limit, offset }: { limit: number; offset: number },
): Promise<SearchResult> {
  const [plan, revisionIds] = await Promise.all([buildTsQuery(query), revisionsInScope(filters)]);
  const empty: SearchResult = { hits: [], total: 0, totalCapped: false, partial: false, missing: [], goesTo: [] };
  if (!plan || !revisionIds.length) return empty;
  const hasExclusions = query.excluded.length > 0;
  const [rows, goesTo] = await Promise.all([
    rankedHits(plan, revisionIds, { limit, offset, hasExclusions }),
    query.section ? findSections(query.section, revisionIds) : Promise.resolve([]),
  ]);
  // Every row carries the number of candidates, which is the count (see rankedSql). Only a page
  // past the last hit has no row to carry it, and says nothing about the total: that one is counted.
  const total = rows.length ? Number(rows[0]!.matches) : offset === 0 ? 0 : await countMatches(plan.match, revisionIds);

  // Pages with most of the words, only when the pages with all of them do not fill a page of hits:
  // that costs a check of each word and a second ranked statement, and the common question (its
  // words found together on many pages) is answered by the one statement above as before. A lone
  // word needs the check only when nothing has it, to say so.
  const fallback = total < limit && (plan.terms.length > 1 || total === 0);
  if (!fallback) return { ...empty, ...answerOf(rows, total, []), goesTo };
  const { found, empty: stopWords } = await termsFound(plan.terms, revisionIds);
  const missing = plan.terms.filter((_, i) => !found[i] && !stopWords[i]).map((t) => t.label);
  const present = plan.terms.filter((_, i) => found[i] && !stopWords[i]);
  // Nothing to widen: the one word searched is on some page.
  if (!missing.length && present.length < 2) return { ...empty, ...answerOf(rows, total, []), goesTo };
  if (!present.length) return { ...empty, missing, goesTo };
  const partialRows = await rankedHits(plan, revisionIds, { limit, offset, hasExclusions, partial: { present } });
  const partialTotal = partialRows.length
    ? Number(partialRows[0]!.matches)
    : offset === 0
      ? 0
      : await countMatches(
          sql`((${sql.join(
            present.map((t) => t.query),
            sql` || `,
          )})${plan.excluded ? sql` && ${plan.excluded}` : sql``})`,
          revisionIds,
        );
  return {
    ...answerOf(
      partialRows,
      partialTotal,
      present.map((t) => t.label),
      missing,
    ),
    partial: true,
    missing,
    goesTo,
  };
}

/** Hits from rows; `labels` name the terms of a partial answer's `has`, `alsoMissing` the ones no page has. */
function answerOf(rows: HitRow[], total: number, labels: string[], alsoMissing: string[] = []) {
  const hits: SearchHit[] = rows.map((row) => ({
    manualId: row.manual_id,
    revisionId: row.revision_id,
    manualTitle: row.manual_title,
    revisionLabel: row.revision_label,
    current: row.current,
    page: row.page,
    snippet: snippetToHtml(row.snippet),
    score: Number(Number(row.score).toFixed(4)),
    missing: [...alsoMissing, ...labels.filter((_, i) => row.has && !row.has[i])],
  }));
  return { hits, total: Math.min(total, totalLimit), totalCapped: total > totalLimit };
}

export const postgresEngine: SearchEngine = {
  name: "postgres",

  async indexRevision(revisionId) {
    // The page vectors are generated columns; what is left is the word list for typo correction.
    const inner = `select search_vector from pages where revision_id = '${revisionId.replace(/[^0-9a-f-]/gi, "")}'`;
    await getDb().execute(sql`
      insert into search_words (word)
      select word from ts_stat(${inner}) where length(word) between 3 and 40
      on conflict do nothing`);
    // GIN keeps fresh rows in a pending list that every search scans until it is merged (by
    // autovacuum, some time later). A revision's thousands of new pages would slow every search
    // in the meantime (bench:search p95 2.6 s against 0.3 s merged), so they are merged now,
    // before the revision turns ready.
    await getDb().execute(
      sql`select gin_clean_pending_list('pages_search_gin'::regclass), gin_clean_pending_list('pages_heading_gin'::regclass)`,
    );
  },

  async removeRevision(revisionId) {
    await getDb().execute(sql`delete from pages where revision_id = ${revisionId}`);
  },

  async setCurrentRevision() {
    // manuals.current_revision_id is read at query time: nothing to do.
  },

  async search(query, filters, page) {
    if (getEnv().HL_SEARCH_CACHE === "off") return searchNow(query, filters, page);
    // Read before the search: a change committed meanwhile raises the number, and this answer is
    // kept under the old one, which nobody asks for any more.
    const key = JSON.stringify([await searchGeneration(), query, filters, page.limit, page.offset]);
    const kept = answers.get(key);
    if (kept) return kept;
    const answer = await searchNow(query, filters, page);
    answers.set(key, Object.freeze(answer));
    return answer;
  },
};

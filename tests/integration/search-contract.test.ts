// One contract for every configured search engine: PostgreSQL always, Meilisearch when MEILI_URL
// names a server. The pages use made-up words so the demo library cannot interfere.
import { beforeAll, describe, expect, it } from "vitest";
import type { SearchEngine, SearchFilters } from "@/search/engine";
import { meilisearchEngine } from "@/search/meilisearch";
import { postgresEngine } from "@/search/postgres";
import { parseQuery } from "@/search/query";
import { call, demo, signIn } from "../support/http";
import { makePdf, uniqueTitle, upload, waitForRevision } from "../support/library";

const engines: [string, SearchEngine | null][] = [
  ["postgres", postgresEngine],
  [
    "meilisearch",
    process.env.MEILI_URL
      ? meilisearchEngine({ url: process.env.MEILI_URL, key: process.env.MEILI_KEY, index: "hangarleaf-contract" })
      : null,
  ],
];
if (!process.env.MEILI_URL) console.log("search contract: Meilisearch run skipped (no MEILI_URL set; no Meilisearch server here)");

const firstRevision = [
  "ZORVEX BEARING INSPECTION\nCheck the race for pitting.", // 1: the word in the heading
  "GENERAL\nA long page about many things. Somewhere it says zorvex once, in the body.", // 2: in the body only
  "CALIBRATION\nSet the quillometer to zero before each use.", // 3: for typos
  "VALVES\nRemove the frobnicator valve and clean it.", // 4: the phrase
  "ASSEMBLY\nThe valve sits beside the frobnicator housing.", // 5: both words, not as a phrase
  "SEALS\nReplace the wumbat gasket with a silicone one.", // 6: for exclusion
  "SEALS AGAIN\nReplace the wumbat gasket.", // 7: for exclusion
  "IGNITION\nCheck the magneto drop on the xelquin engine.", // 8: for the abbreviation
  "OLD ONLY\nThe plonkerite bracket is withdrawn in the next revision.", // 9: gone in revision 2
];

let manualId = "";
let firstId = "";
let secondId = "";

beforeAll(async () => {
  const librarian = await signIn(demo.librarian);
  const first = await upload(
    "/api/manuals",
    librarian,
    {
      title: uniqueTitle("Search contract"),
      documentType: "school_procedure",
      applicability: "ZX-1",
      ataChapters: "29",
      revisionLabel: "Rev 1",
      revisionDate: "2026-01-01",
    },
    { bytes: await makePdf(firstRevision) },
  );
  ({ manualId, revisionId: firstId } = (await first.json()) as { manualId: string; revisionId: string });
  expect((await waitForRevision(librarian, firstId)).status).toBe("ready");
  const second = await upload(
    `/api/manuals/${manualId}/revisions`,
    librarian,
    { revisionLabel: "Rev 2", revisionDate: "2026-06-01" },
    { bytes: await makePdf(firstRevision.slice(0, 8)) },
  );
  ({ revisionId: secondId } = (await second.json()) as { revisionId: string });
  expect((await waitForRevision(librarian, secondId)).status).toBe("ready");
}, 120_000);

describe.each(engines)("search engine: %s", (name, engine) => {
  const run = async (q: string, filters: SearchFilters = {}) => {
    return engine!.search(parseQuery(q), { manualId, ...filters }, { limit: 20, offset: 0 });
  };
  const pagesOf = async (q: string, filters: SearchFilters = {}) => (await run(q, filters)).hits.map((h) => h.page);

  beforeAll(async () => {
    if (!engine) return;
    if (name !== "postgres") {
      await engine.indexRevision(firstId);
      await engine.indexRevision(secondId);
      await engine.setCurrentRevision(manualId, secondId);
    }
  });

  it.skipIf(!engine)("ranks a heading hit above a body hit", async () => {
    expect((await pagesOf("zorvex")).slice(0, 2)).toEqual([1, 2]);
  });

  it.skipIf(!engine)("forgives a typo in a longer word", async () => {
    expect(await pagesOf("quillomter")).toEqual([3]);
    expect(await pagesOf("quilometer")).toEqual([3]);
  });

  it.skipIf(!engine)("finds by prefix while typing", async () => {
    expect(await pagesOf("quillom")).toEqual([3]);
  });

  it.skipIf(!engine)("keeps a quoted phrase together", async () => {
    expect(await pagesOf('"frobnicator valve"')).toEqual([4]);
    expect((await pagesOf("frobnicator valve ")).sort()).toEqual([4, 5]);
  });

  it.skipIf(!engine)("leaves out excluded words", async () => {
    expect((await pagesOf("wumbat gasket ")).sort()).toEqual([6, 7]);
    expect(await pagesOf("wumbat -silicone")).toEqual([7]);
  });

  it.skipIf(!engine)("expands trade abbreviations", async () => {
    expect(await pagesOf("mag xelquin")).toEqual([8]);
  });

  it.skipIf(!engine)("filters by type, model and ATA chapter", async () => {
    expect(await pagesOf("zorvex", { documentType: "school_procedure", model: "ZX-1", ata: "29" })).not.toEqual([]);
    expect(await pagesOf("zorvex", { documentType: "parts_catalog" })).toEqual([]);
    expect(await pagesOf("zorvex", { model: "HT-20" })).toEqual([]);
    expect(await pagesOf("zorvex", { ata: "32" })).toEqual([]);
  });

  it.skipIf(!engine)("hides superseded revisions unless asked", async () => {
    expect(await pagesOf("plonkerite")).toEqual([]);
    const older = await run("plonkerite", { includeSuperseded: true });
    expect(older.hits.map((h) => [h.revisionId, h.page, h.current])).toEqual([[firstId, 9, false]]);
    expect(await pagesOf("plonkerite", { revisionId: firstId })).toEqual([9]);
    expect((await run("zorvex")).hits.every((h) => h.revisionId === secondId)).toBe(true);
  });

  it.skipIf(!engine)("shows the pages with the other words when one is on no page, and names it", async () => {
    const answer = await run("quillometer xqjvzzw");
    expect(answer.missing).toEqual(["xqjvzzw"]);
    expect(answer.hits.map((h) => [h.page, h.missing])).toEqual([[3, ["xqjvzzw"]]]);
  });

  it.skipIf(!engine)("marks the matched words in the snippet", async () => {
    const [hit] = (await run("quillometer")).hits;
    expect(hit?.snippet).toContain("<mark>quillometer</mark>");
  });
});

describe("GET /api/search", () => {
  let student: string;
  beforeAll(async () => {
    student = await signIn(demo.student);
  });

  it("answers hits with manual, revision, page, snippet and score, and the time taken", async () => {
    const response = await call("GET", `/api/search?q=quillometer&manual=${manualId}`, { cookie: student });
    expect(response.status).toBe(200);
    const body = (await response.json()) as { hits: Record<string, unknown>[]; total: number; tookMs: number };
    expect(body.total).toBe(1);
    expect(body.hits[0]).toMatchObject({ manualId, revisionId: secondId, page: 3 });
    expect(body.hits[0]).toHaveProperty("snippet");
    expect(body.hits[0]).toHaveProperty("score");
    expect(body.tookMs).toBeGreaterThanOrEqual(0);
    expect(body).toMatchObject({ partial: false, missing: [], goesTo: [] });
    expect(body.hits[0]).toHaveProperty("missing", []);
  });

  it.each([
    ["", "q"],
    ["q=", "q"],
    ["q=-only", "q"],
    ["q=x&limit=0", "limit"],
    ["q=x&limit=51", "limit"],
    ["q=x&offset=-1", "offset"],
    ["q=x&type=novel", "type"],
    ["q=x&ata=123", "ata"],
    ["q=x&ata=3a", "ata"],
    ["q=x&manual=nope", "manual"],
  ])("refuses ?%s with 422 naming %s", async (query, field) => {
    const response = await call("GET", `/api/search?${query}`, { cookie: student });
    expect(response.status).toBe(422);
    expect(((await response.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty(field);
  });
});

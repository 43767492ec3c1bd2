// Search past the every-word match, against the real database: pages with most of the words when
// few have all of them (the words no page has named), concept families, the phrase ranked above
// its stems and expansions, and ATA codes that go to their section. The own pages use made-up
// words so the rest of the library cannot interfere; the ranking and the sections are also checked
// on the demo trainer manual (db/demo/manual-content.ts), as the seed reads it.
import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { demoManuals, demoRevisions, secondRevisionOfTrainer } from "@/db/demo/manual-content";
import { sectionPage } from "@/db/demo/manual-pdf";
import { manuals, revisions } from "@/db/schema";
import type { SearchFilters, SearchResult } from "@/lib/contracts/search";
import { postgresEngine } from "@/search/postgres";
import { parseQuery } from "@/search/query";
import { call, demo, signIn } from "../support/http";

const manualId = randomUUID();
const revisionId = randomUUID();
const ownPages = [
  "ZELKOR VALVE INSPECTION\nCheck the zelkor valve seat for wear.", // 1: zelkor and valve
  "GENERAL\nThe zelkor housing holds the stem of the valve.", // 2: zelkor and valve, not side by side
  "ULTRASONIC CHECK\nScan the brimwex fitting with the ultrasonic probe.", // 3: an NDT method
  "EDDY CURRENT CHECK\nTest the brimwex bore with an eddy current probe.", // 4: another
  "BRIMWEX CLEANING\nClean the brimwex fitting with solvent.", // 5: no NDT method
  "97-31-00 QUORBLE SYSTEM - DESCRIPTION\nThe quorble system feeds the pump.", // 6: section 97-31 starts
  "97-31-00 QUORBLE SYSTEM - PROCEDURE\nDrain the quorble system.", // 7
  "97-32-00 QUORBLE PUMP - DESCRIPTION\nThe quorble pump.", // 8: section 97-32 starts
  // 9 and 10: cover density alone ranked 9 first for "mag timing" (the heading's "time" and two magnetos).
  "TIME LIMITS\nMagneto inspection time: every 500 hours. Magneto overhaul time: 2000 hours.",
  "IGNITION\nSet the magneto timing with the timing light, then check the breaker points.",
];
// A word no page anywhere has, far from every real word so no typo correction reaches it.
const unknown = "xqjvzzw";

const search = (q: string, filters: SearchFilters = { manualId }, limit = 10) =>
  postgresEngine.search(parseQuery(q), filters, { limit, offset: 0 });
const pagesOf = (answer: SearchResult) => answer.hits.map((h) => h.page);

const trainer = demoManuals.find((m) => m.title.startsWith("HT-20"))!;
const trainerRev4 = secondRevisionOfTrainer(trainer);
const sectionOf = (code: string) => [0, 1, 2, 3, 4].map((k) => sectionPage(trainerRev4, code, "description") + k);
let trainerId = "";
let trainerRev4Id = "";

beforeAll(async () => {
  const db = getDb();
  await db.execute(sql`insert into manuals (id, title, document_type, ata_chapters)
    values (${manualId}, ${`Partial search ${revisionId.slice(0, 8)}`}, 'handbook', ${sql.raw(`ARRAY['97']`)})`);
  await db.execute(sql`insert into revisions (id, manual_id, label, revision_date, status, page_count, pages_done, file_key, size_bytes, sha256, ready_at)
    values (${revisionId}, ${manualId}, 'Rev 1', '2026-01-01', 'ready', ${ownPages.length}, ${ownPages.length}, ${`revisions/${revisionId}/document.pdf`}, 0, '', now())`);
  await db.execute(sql`update manuals set current_revision_id = ${revisionId} where id = ${manualId}`);
  for (const [i, text] of ownPages.entries()) {
    await db.execute(
      sql`insert into pages (revision_id, page_number, heading, text) values (${revisionId}, ${i + 1}, ${text.split("\n")[0]!}, ${text})`,
    );
  }
  await postgresEngine.indexRevision(revisionId);

  // The seed's worker reads the demo manuals; Rev 4 of the trainer must be read and current.
  for (let i = 0; i < 360 && !trainerRev4Id; i++) {
    const [row] = await db
      .select({ manualId: manuals.id, revisionId: revisions.id })
      .from(revisions)
      .innerJoin(manuals, eq(manuals.id, revisions.manualId))
      .where(
        and(
          eq(manuals.title, trainer.title),
          eq(revisions.label, demoRevisions.trainerSecond.label),
          eq(revisions.status, "ready"),
          eq(manuals.currentRevisionId, revisions.id),
        ),
      );
    if (row) [trainerId, trainerRev4Id] = [row.manualId, row.revisionId];
    else await new Promise((r) => setTimeout(r, 500));
  }
  expect(trainerRev4Id).not.toBe("");
}, 200_000);

// The revision has no file: other tests that take "a manual with a current revision" must not find it.
afterAll(async () => {
  await getDb().execute(sql`delete from manuals where id = ${manualId}`);
});

describe("pages with most of the words", () => {
  it("names the word no page has and shows the pages with the others", async () => {
    const answer = await search(`zelkor valve ${unknown}`);
    expect(answer.partial).toBe(true);
    expect(answer.missing).toEqual([unknown]);
    expect(pagesOf(answer).slice(0, 2).sort()).toEqual([1, 2]);
    for (const hit of answer.hits.slice(0, 2)) expect(hit.missing).toEqual([unknown]);
  });

  it("ranks the pages with more of the words first, and says what each lacks", async () => {
    const answer = await search("zelkor valve brimwex");
    expect(answer.partial).toBe(true);
    expect(answer.missing).toEqual([]);
    expect(pagesOf(answer).slice(0, 2).sort()).toEqual([1, 2]);
    expect(pagesOf(answer).slice(2).sort()).toEqual([3, 4, 5]);
    expect(answer.hits[0]?.missing).toEqual(["brimwex"]);
    expect(answer.hits.at(-1)?.missing).toEqual(["zelkor", "valve"]);
  });

  it("keeps the every-word answer as it was when it fills a page", async () => {
    const answer = await search("zelkor valve", { manualId }, 2);
    expect(answer.partial).toBe(false);
    expect(answer.hits.map((h) => h.missing)).toEqual([[], []]);
    // The phrase first: page 1 has "zelkor valve" side by side.
    expect(pagesOf(answer)).toEqual([1, 2]);
  });

  it("says so when the only word is on no page", async () => {
    const answer = await search(unknown);
    expect([answer.hits, answer.total, answer.missing]).toEqual([[], 0, [unknown]]);
  });
});

describe("concept families", () => {
  it("finds the pages that name a method of the family", async () => {
    for (const q of ["ndt brimwex", "nondestructive testing brimwex"]) {
      const answer = await search(q);
      expect(pagesOf(answer).slice(0, 2).sort()).toEqual([3, 4]);
      // The cleaning page has the other word only, so it comes after them, lacking the family.
      expect(answer.hits.slice(2).map((h) => [h.page, h.missing])).toEqual([[5, [q.replace(" brimwex", "")]]]);
    }
  });
});

describe("the phrase above its stems and expansions", () => {
  it("ranks the words side by side, or the expansion's phrase, above a page with the stem and the expansion apart", async () => {
    for (const q of ["mag timing", "magneto timing"]) expect(pagesOf(await search(q))).toEqual([10, 9]);
  });
});

describe("the phrase above its stems and expansions (demo trainer manual)", () => {
  it("puts magneto timing pages above time limits pages for 'mag timing'", async () => {
    const answer = await search("mag timing", { manualId: trainerId }, 30);
    const pages = pagesOf(answer);
    expect(pages.slice(0, 5).sort((a, b) => a - b)).toEqual(sectionOf("74-10-00"));
    const timeLimits = sectionOf("05-10-00").filter((p) => pages.includes(p));
    expect(timeLimits.length).toBeGreaterThan(0);
    for (const p of timeLimits) expect(pages.indexOf(p)).toBeGreaterThanOrEqual(5);
  });

  it("puts the exact word above its stem for 'timing'", async () => {
    const pages = pagesOf(await search("timing", { manualId: trainerId }, 30));
    const timing = sectionOf("74-10-00").map((p) => pages.indexOf(p));
    const time = sectionOf("05-10-00")
      .map((p) => pages.indexOf(p))
      .filter((i) => i >= 0);
    expect(timing.every((i) => i >= 0)).toBe(true);
    expect(Math.max(...timing)).toBeLessThan(Math.min(...time));
  });
});

describe("ATA codes", () => {
  it("go to the first page of the section in the manual that has it", async () => {
    expect((await search("97-31")).goesTo.map((j) => [j.code, j.manualId, j.revisionId, j.page])).toEqual([
      ["97-31", manualId, revisionId, 6],
    ]);
    expect((await search("97-32-00")).goesTo.map((j) => j.page)).toEqual([8]);
    expect((await search("97-33-00")).goesTo).toEqual([]);
    expect((await search("quorble")).goesTo).toEqual([]);
  });

  it("go to the demo trainer's sections, a one-digit chapter too", async () => {
    const jump = (await search("32-10-00", { manualId: trainerId })).goesTo;
    expect(jump).toEqual([
      expect.objectContaining({
        code: "32-10-00",
        manualId: trainerId,
        revisionId: trainerRev4Id,
        current: true,
        page: sectionOf("32-10-00")[0],
      }),
    ]);
    expect(jump[0]?.heading).toMatch(/^32-10-00 MAIN LANDING GEAR/);
    expect((await search("32-10", { manualId: trainerId })).goesTo.map((j) => j.page)).toEqual([sectionOf("32-10-00")[0]]);
    expect((await search("5-10", { manualId: trainerId })).goesTo.map((j) => [j.code, j.page])).toEqual([["05-10", 1]]);
  });
});

describe("GET /api/search", () => {
  let student: string;
  beforeAll(async () => {
    student = await signIn(demo.student);
  });

  it("answers the missing words, the partial flag and what each hit lacks", async () => {
    const response = await call("GET", `/api/search?q=${encodeURIComponent(`zelkor ${unknown}`)}&manual=${manualId}`, { cookie: student });
    expect(response.status).toBe(200);
    const body = (await response.json()) as SearchResult;
    expect(body).toMatchObject({ partial: true, missing: [unknown], goesTo: [] });
    expect(body.hits.map((h) => [h.page, h.missing]).sort()).toEqual([
      [1, [unknown]],
      [2, [unknown]],
    ]);
  });

  it("answers where an ATA code goes", async () => {
    const response = await call("GET", `/api/search?q=32-10-00&manual=${trainerId}`, { cookie: student });
    const body = (await response.json()) as SearchResult;
    expect(body.goesTo.map((j) => [j.revisionId, j.page])).toEqual([[trainerRev4Id, sectionOf("32-10-00")[0]]]);
  });

  it("takes a one-digit ATA chapter as the chapter with a leading zero", async () => {
    const response = await call("GET", `/api/search?q=quorble&ata=5`, { cookie: student });
    expect(response.status).toBe(200);
    const own = await call("GET", `/api/search?q=quorble&ata=97&manual=${manualId}`, { cookie: student });
    expect(((await own.json()) as SearchResult).total).toBe(3);
  });
});

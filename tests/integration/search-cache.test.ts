// The kept search answers (search/postgres.ts) against the real database: a kept answer is used
// while nothing a search shows has changed, and never once something has, in this process and in
// the web server's. The generation's triggers (migration 0008) must not deadlock writers either.
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { postgresEngine, searchGeneration } from "@/search/postgres";
import { parseQuery } from "@/search/query";
import { call, demo, signIn } from "../support/http";

const word = `glimbrax${randomUUID().slice(0, 6).replace(/\d/g, "q")}`;
const manualId = randomUUID();
// Manual titles are unique: each run's own.
const title = (letter: string) => `Cache manual ${letter} ${word}`;
const revisionId = randomUUID();
const search = () => postgresEngine.search(parseQuery(`${word} `), { manualId }, { limit: 10, offset: 0 });
// Words for the count: one on 450 pages (past the 200 counted), one on 3, one in a heading only.
const many = `${word}many`;
const few = `${word}few`;
const head = `${word}head`;

beforeAll(async () => {
  const db = getDb();
  await db.execute(sql`insert into manuals (id, title, document_type) values (${manualId}, ${title("A")}, 'handbook')`);
  await db.execute(sql`insert into revisions (id, manual_id, label, revision_date, status, page_count, pages_done, file_key, size_bytes, sha256, ready_at)
    values (${revisionId}, ${manualId}, 'Rev 1', '2026-01-01', 'ready', 2, 2, ${`revisions/${revisionId}/document.pdf`}, 0, '', now())`);
  await db.execute(sql`update manuals set current_revision_id = ${revisionId} where id = ${manualId}`);
  await db.execute(sql`insert into pages (revision_id, page_number, heading, text) values
    (${revisionId}, 1, ${`${word.toUpperCase()} CHECK`}, 'Inspect it.'), (${revisionId}, 2, 'OTHER', ${`The ${word} again.`})`);
  await db.execute(sql`insert into pages (revision_id, page_number, heading, text)
    select ${revisionId}, n, case when n = 10 then ${head.toUpperCase()} else 'PAGE' end,
           ${many} || case when n < 13 then ' ' || ${few} else '' end || case when n = 10 then ' silicone' else '' end
    from generate_series(10, 459) n`);
  await postgresEngine.indexRevision(revisionId);
});

// The revision has no file: other tests that take "a manual with a current revision" must not
// find it (its pages and revision go with the manual).
afterAll(async () => {
  await getDb().execute(sql`delete from manuals where id = ${manualId}`);
});

describe("counting from the ranked candidates", () => {
  const count = async (q: string, offset = 0) => {
    const answer = await postgresEngine.search(parseQuery(q), { manualId }, { limit: 10, offset });
    return [answer.hits.length, answer.total, answer.totalCapped];
  };

  it("says more than 200 for a word on 450 pages, on the first page and past the last hit", async () => {
    expect(await count(many)).toEqual([10, 200, true]);
    expect(await count(many, 390)).toEqual([10, 200, true]);
    expect(await count(many, 500)).toEqual([0, 200, true]);
  });

  it("gives the exact count below it, on any page", async () => {
    expect(await count(few)).toEqual([3, 3, false]);
    expect(await count(few, 2)).toEqual([1, 3, false]);
  });

  it("leaves out a heading match whose body has an excluded word", async () => {
    expect(await count(head)).toEqual([1, 1, false]);
    expect(await count(`${head} -silicone`)).toEqual([0, 0, false]);
  });
});

describe("kept search answers", () => {
  it("answers from memory while nothing changes, progress and heartbeat updates included", async () => {
    const first = await search();
    expect(first.hits.map((h) => h.page)).toEqual([1, 2]);
    const before = await searchGeneration();
    await getDb().execute(sql`update revisions set heartbeat_at = now(), pages_done = pages_done where id = ${revisionId}`);
    await getDb().execute(sql`update pages set thumbnail_key = null where revision_id = ${revisionId}`);
    expect(await searchGeneration()).toBe(before);
    expect(await search()).toBe(first); // the very same answer object: kept, not searched again
  });

  it("sees a changed title, label, page and removal at once", async () => {
    const db = getDb();
    await search();
    await db.execute(sql`update manuals set title = ${title("B")} where id = ${manualId}`);
    expect((await search()).hits[0]?.manualTitle).toBe(title("B"));
    await db.execute(sql`update revisions set label = 'Rev 1A' where id = ${revisionId}`);
    expect((await search()).hits[0]?.revisionLabel).toBe("Rev 1A");
    await db.execute(
      sql`insert into pages (revision_id, page_number, heading, text) values (${revisionId}, 3, 'MORE', ${`A third ${word}.`})`,
    );
    expect((await search()).hits.map((h) => h.page).sort()).toEqual([1, 2, 3]);
    await db.execute(sql`delete from pages where revision_id = ${revisionId} and page_number = 3`);
    expect((await search()).hits.map((h) => h.page).sort()).toEqual([1, 2]);
    // A revision that stops being current, and comes back.
    await db.execute(sql`update manuals set current_revision_id = null where id = ${manualId}`);
    expect((await search()).hits).toEqual([]);
    await db.execute(sql`update manuals set current_revision_id = ${revisionId} where id = ${manualId}`);
    expect((await search()).hits).toHaveLength(2);
    const before = await searchGeneration();
    await db.execute(sql`insert into search_words (word) values (${`${word}x`}) on conflict do nothing`);
    expect(await searchGeneration()).toBe(before + 1);
  });

  it("raises the number once per transaction, however many rows change", async () => {
    const before = await searchGeneration();
    await getDb().transaction(async (tx) => {
      await tx.execute(sql`update manuals set title = ${title("C")} where id = ${manualId}`);
      await tx.execute(sql`update pages set heading = heading where revision_id = ${revisionId}`);
    });
    expect(await searchGeneration()).toBe(before + 1);
  });

  it("the web server's answers follow a change too", async () => {
    const cookie = await signIn(demo.student);
    const ask = async () =>
      ((await (await call("GET", `/api/search?q=${word}&manual=${manualId}`, { cookie })).json()) as { hits: { manualTitle: string }[] })
        .hits[0]?.manualTitle;
    await ask();
    await getDb().execute(sql`update manuals set title = ${title("D")} where id = ${manualId}`);
    expect(await ask()).toBe(title("D"));
  });

  it("two writers crossing on a revision and its manual both commit (the raise waits for the commit)", async () => {
    const one = new pg.Client({ connectionString: process.env.DATABASE_URL });
    const two = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await Promise.all([one.connect(), two.connect()]);
    try {
      await one.query("begin");
      await one.query("update revisions set label = 'Rev 1B' where id = $1", [revisionId]);
      await two.query("begin");
      await two.query("update manuals set title = $2 where id = $1", [manualId, title("E")]);
      // One now waits for two's row; two's commit raises the number, which one's first update has
      // not locked, since its raise is deferred to its own commit.
      const waiting = one.query("update manuals set title = $2 where id = $1", [manualId, title("F")]);
      await new Promise((r) => setTimeout(r, 200));
      await two.query("commit");
      await waiting;
      await one.query("commit");
    } finally {
      await Promise.all([one.end(), two.end()]);
    }
    const hit = (await search()).hits[0];
    expect([hit?.manualTitle, hit?.revisionLabel]).toEqual([title("F"), "Rev 1B"]);
  });
});

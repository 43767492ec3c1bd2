// `npm run bench:search`: 50,000 synthetic pages of 150–450 words in ten current revisions, then a
// realistic query mix from 8 concurrent clients for 30 s against the real API (HTTP, signed in):
// once on the server as it runs (answers kept until the library changes), once on a second server
// that keeps none (HL_SEARCH_CACHE=off), and the bare ranked SQL of the same queries; then each with
// one client, and a word found on every page. Each run prints the CPU a query cost.
// Goals: API p95 ≤ 50 ms, API p95 ≤ 2 × bare SQL p95, every-page query ≤ 150 ms. Prints, asserts nothing.
import { randomUUID } from "node:crypto";
import { availableParallelism } from "node:os";
import { sql } from "drizzle-orm";
import { closeDb, getDb } from "../db";
import { hashPassword } from "@/lib/server/auth/password";
import { buildTsQuery, postgresEngine, rankedSql, revisionsInScope } from "../search/postgres";
import { parseQuery } from "../search/query";
import { cpuSnapshot, cpuSpent } from "./bench-support";

interface Server {
  url: string;
  pid: string | undefined;
}
const kept: Server = { url: process.env.HL_BASE_URL!, pid: process.env.HL_WEB_PID };
const uncached: Server | null = process.env.HL_UNCACHED_URL ? { url: process.env.HL_UNCACHED_URL, pid: process.env.HL_UNCACHED_PID } : null;
const pagesTotal = Number(process.env.BENCH_PAGES ?? 50_000);
const seconds = Number(process.env.BENCH_SECONDS ?? 30);
const clients = 8;

const trade =
  "inspect torque safety wire cotter pin bearing race grease seal gasket cylinder magneto lead harness bracket rivet doubler skin stringer rib spar fitting bushing shim clamp hose fuel oil filter screen valve actuator cable pulley turnbuckle propeller blade spinner governor carburetor mixture throttle landing gear strut axle wheel brake disc caliper tire tube nitrogen pressure tension tensiometer rigging aileron elevator rudder flap trim tab hinge corrosion primer penetrant developer dwell ultraviolet crack indication".split(
    " ",
  );

async function loadPages() {
  const db = getDb();
  const perManual = Math.ceil(pagesTotal / 10);
  // A vocabulary with a long tail: trade words plus made-up ones, picked with a skew so some words
  // are common and most are rare, as in real manuals.
  await db.execute(sql`create temporary table vocab as
    select row_number() over () as i, w from (
      select unnest(${sql.raw(`ARRAY[${trade.map((w) => `'${w}'`).join(",")}]`)}::text[]) as w
      union all
      select 'term' || to_hex(n * 7919) from generate_series(1, 6000) n) v`);
  const [{ n: vocab } = { n: 0 }] = (await db.execute<{ n: number }>(sql`select count(*)::int as n from vocab`)).rows;
  for (let m = 0; m < 10; m++) {
    const manualId = randomUUID();
    const revisionId = randomUUID();
    await db.execute(sql`insert into manuals (id, title, document_type, applicability, ata_chapters)
      values (${manualId}, ${`Bench manual ${m + 1}`}, ${m % 2 ? "maintenance_manual" : "overhaul_manual"},
              ${sql.raw(`ARRAY['BX-${m % 3}']`)}, ${sql.raw(`ARRAY['${String(20 + m).padStart(2, "0")}']`)})`);
    await db.execute(sql`insert into revisions (id, manual_id, label, revision_date, status, page_count, pages_done, file_key, size_bytes, sha256, ready_at)
      values (${revisionId}, ${manualId}, 'Rev 1', '2026-01-01', 'ready', ${perManual}, ${perManual}, ${`revisions/${revisionId}/document.pdf`}, 0, '', now())`);
    await db.execute(sql`update manuals set current_revision_id = ${revisionId} where id = ${manualId}`);
    for (let from = 1; from <= perManual; from += 1000) {
      const to = Math.min(from + 999, perManual);
      await db.execute(sql`
        insert into pages (revision_id, page_number, heading, text)
        select ${revisionId}, n,
               'SECTION ' || n || ' ' || (select w from vocab where i = 1 + (n * 13) % ${vocab}) || ' ' || (select w from vocab where i = 1 + (n * 29) % ${vocab}),
               'hangar ' || (select string_agg(v.w, ' ') from generate_series(1, 150 + (n * 37 + ${m}) % 301) k
                             join vocab v on v.i = 1 + floor(${vocab} * power(((k * 7907 + n * 104729 + ${m} * 31) % 10007) / 10007.0, 2))::int)
        from generate_series(${from}::int, ${to}::int) n`);
      process.stdout.write(`\r  loaded ${m * perManual + to} of ${pagesTotal} pages`);
    }
    await postgresEngine.indexRevision(revisionId);
  }
  process.stdout.write("\n");
  // indexRevision merged the GIN pending list of each manual's pages, as ingest does; only the
  // planner statistics are left (autovacuum would gather them a moment later).
  await db.execute(sql`analyze`);
}

const mix = [
  "magneto",
  "torque wrench",
  "cable tension",
  '"safety wire"',
  "tensiom",
  "carburetr",
  "prop governor",
  "landing gear strut",
  "corrosion -primer",
  "bearing race grease",
  "penetrant dwell",
  "rivet doubler skin",
  "brake disc caliper",
  "aileron rigging",
  "term1f0f",
  "term3ab1 term5d3",
  "fuel filter screen",
  "blade crack",
];

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? 0;
}

async function signIn(): Promise<string> {
  const email = `bench-${randomUUID().slice(0, 8)}@test.hangarleaf.test`;
  const password = "bench-password-long";
  await getDb().execute(
    sql`insert into users (email, name, role, status, password_hash) values (${email}, 'Bench', 'student', 'active', ${await hashPassword(password)})`,
  );
  // Both servers share the database and the session secret: one cookie serves both.
  const response = await fetch(`${kept.url}/api/session`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email, password }),
  });
  return response.headers
    .getSetCookie()
    .find((c) => c.startsWith("hangarleaf_session="))!
    .split(";")[0]!;
}

async function timeApi(server: Server, cookie: string, q: string): Promise<number> {
  const start = performance.now();
  const response = await fetch(`${server.url}/api/search?q=${encodeURIComponent(q)}&limit=10`, { headers: { cookie } });
  await response.arrayBuffer();
  if (!response.ok) throw new Error(`search answered ${response.status}`);
  return performance.now() - start;
}

async function timeSql(q: string): Promise<number> {
  const parsed = parseQuery(q);
  const [tsquery, scope] = await Promise.all([buildTsQuery(parsed), revisionsInScope({})]);
  const start = performance.now();
  await getDb().execute(rankedSql(tsquery!, scope, { limit: 10, offset: 0, hasExclusions: parsed.excluded.length > 0 }));
  return performance.now() - start;
}

interface Run {
  times: number[];
  perSecond: number;
  /** CPU milliseconds a query: web server, database backends, this process (the clients). */
  cpu: { web: number; database: number; clients: number };
}

async function load(fn: (q: string) => Promise<number>, clientCount: number, runSeconds: number, server?: Server): Promise<Run> {
  const database = new URL(process.env.DATABASE_URL!).pathname.slice(1);
  const times: number[] = [];
  const before = cpuSnapshot(database, server?.pid);
  const clientsBefore = process.cpuUsage();
  const started = performance.now();
  const until = Date.now() + runSeconds * 1000;
  await Promise.all(
    Array.from({ length: clientCount }, async (_, c) => {
      for (let i = c; Date.now() < until; i++) times.push(await fn(mix[i % mix.length]!));
    }),
  );
  const spent = cpuSpent(before, cpuSnapshot(database, server?.pid));
  const clients = process.cpuUsage(clientsBefore);
  const per = (seconds: number) => (1000 * seconds) / times.length;
  return {
    times,
    perSecond: times.length / ((performance.now() - started) / 1000),
    cpu: { web: per(spent.web), database: per(spent.database), clients: per((clients.user + clients.system) / 1e6) },
  };
}

async function main() {
  console.log(`loading ${pagesTotal} synthetic pages…`);
  const started = performance.now();
  await loadPages();
  console.log(`  loaded and indexed in ${((performance.now() - started) / 1000).toFixed(0)} s`);
  if (process.env.BENCH_LOAD_ONLY) return closeDb();
  const cookie = await signIn();
  const servers = uncached ? [kept, uncached] : [kept];
  for (const server of servers) for (const q of mix) await timeApi(server, cookie, q); // warm up

  const apiKept = await load((q) => timeApi(kept, cookie, q), clients, seconds, kept);
  const apiUncached = uncached ? await load((q) => timeApi(uncached, cookie, q), clients, seconds, uncached) : null;
  const bare = await load(timeSql, clients, seconds);
  // One client: what a query costs when nobody waits for anyone.
  const aloneKept = await load((q) => timeApi(kept, cookie, q), 1, seconds / 3, kept);
  const aloneUncached = uncached ? await load((q) => timeApi(uncached, cookie, q), 1, seconds / 3, uncached) : null;
  const bareAlone = await load(timeSql, 1, seconds / 3);
  const every = uncached ?? kept;
  const everyApi: number[] = [];
  const everySql: number[] = [];
  for (let i = 0; i < 20; i++) {
    everyApi.push(await timeApi(every, cookie, "hangar"));
    everySql.push(await timeSql("hangar"));
  }
  const p95 = (t: number[]) => percentile(t, 95);
  const line = (label: string, t: number[]) =>
    `  ${label.padEnd(40)} p50 ${percentile(t, 50).toFixed(1).padStart(6)} ms   p95 ${p95(t).toFixed(1).padStart(6)} ms   (${t.length} queries)`;
  const runLine = (label: string, run: Run | null, withWeb: boolean) =>
    run
      ? `${line(label, run.times)}, ${run.perSecond.toFixed(0)}/s\n` +
        `  ${"".padEnd(40)} CPU a query: ${withWeb ? `web server ${run.cpu.web.toFixed(1)} ms, ` : ""}database ${run.cpu.database.toFixed(1)} ms, clients ${run.cpu.clients.toFixed(1)} ms`
      : `  ${label}: not run (no second server)`;
  const searched = apiUncached ?? apiKept;
  console.log(
    [
      "",
      `bench:search, ${pagesTotal} pages, ${clients} clients for ${seconds} s, then 1 client for ${seconds / 3} s, on ${availableParallelism()} cores`,
      runLine(`API, kept (mix repeats), ${clients} clients`, apiKept, true),
      runLine(`API, nothing kept, ${clients} clients`, apiUncached, true),
      runLine(`bare ranked SQL, ${clients} clients`, bare, false),
      `  goal API p95 ≤ 50 ms: repeated questions (kept) ${p95(apiKept.times).toFixed(0)} ms, new questions (nothing kept) ${apiUncached ? p95(apiUncached.times).toFixed(0) : "?"} ms`,
      `  goal API p95 ≤ 2 × SQL p95 (nothing kept, so the same work): ratio ${(p95(searched.times) / p95(bare.times)).toFixed(2)}`,
      runLine("API, answers kept, 1 client", aloneKept, true),
      runLine("API, nothing kept, 1 client", aloneUncached, true),
      runLine("bare ranked SQL, 1 client", bareAlone, false),
      line("every-page word, API, nothing kept", everyApi),
      line("every-page word, bare SQL", everySql),
      "  (goal: every-page query ≤ 150 ms)",
      "",
    ].join("\n"),
  );
  await closeDb();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});

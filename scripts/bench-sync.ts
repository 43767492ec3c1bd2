// `npm run bench:sync`: 1,000 events queued on a "cart" and sent through lib/client/cart/sync.ts over a
// link that drops 30 % of requests: half of the drops lose the request before the server sees it,
// half lose the answer after the server stored the batch (the hard case: the cart must re-send
// what is already stored). Prints the time, the events stored and the duplicates, against the
// same 1,000 events over a clean link in the same run. Goal: all 1,000 stored, 0 duplicates, ≤ 3 s.
import { randomUUID } from "node:crypto";
import http from "node:http";
import type { AddressInfo } from "node:net";
import { sql } from "drizzle-orm";
import { closeDb, getDb } from "../db";
import { assignments, runs, taskCards, taskCardVersions, users } from "../db/schema";
import { hashPassword } from "@/lib/server/auth/password";
import { batchSize, syncUntilDone, type PendingEvent, type SyncPort } from "@/lib/client/cart/sync";

const base = process.env.HL_BASE_URL!;
const eventCount = 1000;
const dropShare = 0.3;

const trials = 5;

async function makeRun() {
  const db = getDb();
  const password = `bench-${randomUUID()}`;
  const [student] = await db
    .insert(users)
    .values({
      email: `bench-${randomUUID().slice(0, 8)}@bench.test`,
      name: "Bench student",
      role: "student",
      status: "active",
      passwordHash: await hashPassword(password),
    })
    .returning();
  const [card] = await db.insert(taskCards).values({}).returning();
  const steps = Array.from({ length: 20 }, (_, i) => ({
    id: randomUUID(),
    text: `Bench step ${i + 1}`,
    notices: [],
    references: [],
    measurement: null,
    calculator: null,
    inspectionPoint: false,
    timerMinutes: null,
  }));
  const [version] = await db.insert(taskCardVersions).values({ cardId: card!.id, number: 1, title: "Bench card", steps }).returning();
  await db
    .update(taskCardVersions)
    .set({ status: "published", publishedAt: new Date() })
    .where(sql`id = ${version!.id}`);
  const [assignment] = await db.insert(assignments).values({ cardId: card!.id, versionId: version!.id }).returning();
  const [run] = await db.insert(runs).values({ assignmentId: assignment!.id, studentId: student!.id, versionId: version!.id }).returning();
  const signIn = await fetch(`${base}/api/session`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email: student!.email, password }),
  });
  const cookie = signIn.headers.getSetCookie()[0]!.split(";")[0]!;
  return { runId: run!.id, cookie, stepIds: steps.map((s) => s.id) };
}

/**
 * A proxy to the web server that loses a share of the requests or of their answers: each request
 * is dropped with that chance (a seeded generator, so every trial is repeatable), alternately
 * before the server sees it and after it answered.
 */
async function flakyLink(target: string, share: number, seed: number) {
  const to = new URL(target);
  let lostRequests = 0;
  let lostAnswers = 0;
  // mulberry32: small, seeded, and evenly spread (a plain LCG's first draws are not).
  let state = seed * 0x9e3779b9;
  const random = () => {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), 1 | state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  let drops = 0;
  let seen = 0;
  const server = http.createServer((req, res) => {
    seen++;
    const dropped = random() < share;
    const beforeServer = dropped && drops++ % 2 === 0;
    if (beforeServer) {
      lostRequests++;
      req.resume();
      req.socket.destroy();
      return;
    }
    const upstream = http.request(
      { host: to.hostname, port: to.port, path: req.url, method: req.method, headers: req.headers },
      (answer) => {
        if (dropped) {
          lostAnswers++;
          answer.resume();
          answer.on("end", () => res.socket?.destroy());
          return;
        }
        res.writeHead(answer.statusCode ?? 502, answer.headers);
        answer.pipe(res);
      },
    );
    upstream.on("error", () => res.socket?.destroy());
    req.pipe(upstream);
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  return {
    url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    stats: () => ({ lostRequests, lostAnswers, seen }),
    close: () => new Promise<void>((r) => server.close(() => r())),
  };
}

function memoryCart(runId: string, stepIds: string[], linkUrl: string, cookie: string) {
  const start = Date.now() - 3_600_000;
  let queue: PendingEvent[] = Array.from({ length: eventCount }, (_, i) => ({
    runId,
    event: {
      id: randomUUID(),
      type: i % 2 ? "step.checked" : "note.added",
      stepId: stepIds[i % stepIds.length]!,
      payload: i % 2 ? {} : { text: `note ${i}` },
      clientTime: new Date(start + i * 1000).toISOString(),
    },
  }));
  const ids = queue.map((p) => p.event.id);
  const port: SyncPort = {
    events: async () => queue,
    photos: async () => [],
    removeEvents: async (gone) => {
      const set = new Set(gone);
      queue = queue.filter((p) => !set.has(p.event.id));
    },
    removePhoto: async () => undefined,
    refused: async (items) => {
      throw new Error(`the server refused ${items.length} events: ${items[0]?.reason}`);
    },
    postEvents: async (id, events) => {
      const response = await fetch(`${linkUrl}/api/runs/${id}/events`, {
        method: "POST",
        headers: { "content-type": "application/json", cookie },
        body: JSON.stringify({ events }),
      });
      await response.arrayBuffer();
      return { status: response.status };
    },
    putPhoto: async () => ({ status: 201 }),
  };
  return { port, ids, left: () => queue.length };
}

async function stored(runId: string, ids: string[]) {
  const rows = (
    await getDb().execute(
      sql`select count(*)::int as n, count(distinct id)::int as d, count(*) filter (where id::text = any(${`{${ids.join(",")}}`}::text[]))::int as ours from run_events where run_id = ${runId}`,
    )
  ).rows as [{ n: number; d: number; ours: number }];
  return rows[0];
}

async function trial(label: string, share: number, seed = 1) {
  const { runId, cookie, stepIds } = await makeRun();
  const link = await flakyLink(base, share, seed);
  const cart = memoryCart(runId, stepIds, link.url, cookie);
  const started = performance.now();
  const result = await syncUntilDone(cart.port, { maxPasses: 200 });
  const seconds = (performance.now() - started) / 1000;
  await link.close();
  const counts = await stored(runId, cart.ids);
  const duplicates = counts.n - counts.d;
  console.log(
    `${label.padEnd(28)} ${seconds.toFixed(2).padStart(6)} s  stored ${counts.ours}/${eventCount}  duplicates ${duplicates}  passes ${result.passes}  left on the cart ${cart.left()}  requests ${link.stats().seen}: lost before the server ${link.stats().lostRequests}, answers lost ${link.stats().lostAnswers}`,
  );
  return {
    seconds,
    lost: link.stats().lostRequests + link.stats().lostAnswers,
    ok: counts.ours === eventCount && duplicates === 0 && cart.left() === 0,
  };
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;

console.log(`bench:sync — ${eventCount} events in batches of ${batchSize} (lib/client/cart/sync.ts, the cart's own code and backoff)`);
await trial("warm-up (not counted)", 0);
const clean: Awaited<ReturnType<typeof trial>>[] = [];
const flaky: Awaited<ReturnType<typeof trial>>[] = [];
for (let t = 1; t <= trials; t++) {
  clean.push(await trial(`clean link, trial ${t}`, 0, t));
  flaky.push(await trial(`${dropShare * 100} % dropped, trial ${t}`, dropShare, t));
}
const cleanMedian = median(clean.map((c) => c.seconds));
const flakyMedian = median(flaky.map((c) => c.seconds));
const worst = Math.max(...flaky.map((c) => c.seconds));
console.log(
  `clean link median ${cleanMedian.toFixed(2)} s (baseline); 30 % dropped median ${flakyMedian.toFixed(2)} s, worst ${worst.toFixed(2)} s, ratio ${(flakyMedian / cleanMedian).toFixed(2)}`,
);
console.log(`requests lost in the dropped trials: ${flaky.map((f) => f.lost).join(", ")}`);
const ok = [...clean, ...flaky].every((r) => r.ok);
console.log(`goal: all 1,000 stored, 0 duplicates, ≤ 3 s — ${ok && worst <= 3 ? "met in every trial" : "NOT met"}`);
await closeDb();
if (!ok) process.exit(1);

// `npm run bench:load`: a class of 50 signed-in students for 60 s on the real web server, each
// looping through what a class does at once: search (new and repeated questions), page text,
// ranges of the reader's file, a task card, a batch of run events, and My work. /api/health is
// asked in the same loop, under the same load, as the floor: what the server costs with no work.
// Prints p50/p95 per kind, errors, and each kind's p95 against the floor's (goal: 0 errors, every
// kind ≤ 3 × the floor). The load generator runs on the same 2 cores as the server, as on a cart.
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { closeDb, getDb } from "../db";
import { assignments, classMembers, classes, curriculumSubjects, runs, taskCards, taskCardVersions, users } from "../db/schema";
import { demoManuals } from "../db/demo/manual-content";
import { renderManualPdf } from "../db/demo/manual-pdf";
import { hashPassword } from "@/lib/server/auth/password";
import { cpuSnapshot, cpuSpent, ingestAndWait, storeManual } from "./bench-support";

const base = process.env.HL_BASE_URL!;
const clients = Number(process.env.HL_LOAD_CLIENTS ?? 50);
const seconds = Number(process.env.HL_LOAD_SECONDS ?? 60);
const goalRatio = 3;

type Kind = "health" | "search-new" | "search-repeated" | "page-text" | "reader-range" | "card" | "events" | "my-work";
// A class's mix, by weight: most requests read pages; a few write.
const mix: [Kind, number][] = [
  ["health", 8],
  ["search-new", 10],
  ["search-repeated", 10],
  ["page-text", 24],
  ["reader-range", 16],
  ["card", 10],
  ["events", 10],
  ["my-work", 12],
];
const totalWeight = mix.reduce((n, [, w]) => n + w, 0);
const pick = (): Kind => {
  let r = Math.random() * totalWeight;
  for (const [kind, w] of mix) if ((r -= w) < 0) return kind;
  return "health";
};

const percentile = (sorted: number[], p: number) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]! : NaN;

async function setUp() {
  const db = getDb();
  const manual = demoManuals.find((m) => m.title === "HT-20 Trainer Maintenance Manual") ?? demoManuals[0]!;
  const pdf = await renderManualPdf(manual, { label: "Rev 1", date: "2026-01-01" });
  const { revisionId } = await storeManual("Load manual", pdf);
  const ingest = await ingestAndWait(revisionId);
  const [{ pages }] = (await db.execute<{ pages: number }>(sql`select page_count as pages from revisions where id = ${revisionId}`))
    .rows as [{ pages: number }];
  // The reader copy is made just after the revision is ready; wait for it briefly, else read the original.
  let copy = "";
  for (let i = 0; i < 120 && !copy; i++) {
    const rows = (await db.execute<{ key: string | null }>(sql`select reader_file_key as key from revisions where id = ${revisionId}`))
      .rows;
    if (rows[0]?.key) copy = "?copy=reader";
    else await new Promise((r) => setTimeout(r, 250));
  }
  const words = [
    ...new Set(
      manual.chapters
        .flatMap((c) => c.sections.flatMap((s) => [s.title, ...s.steps]))
        .join(" ")
        .toLowerCase()
        .split(/[^a-z]+/)
        .filter((w) => w.length >= 5),
    ),
  ];

  const [klass] = await db
    .insert(classes)
    .values({ name: `Load class ${randomUUID().slice(0, 6)}` })
    .returning();
  const [subject] = await db
    .insert(curriculumSubjects)
    .values({ name: `Load subject ${randomUUID().slice(0, 6)}` })
    .returning();
  const stepIds = Array.from({ length: 12 }, () => randomUUID());
  const [card] = await db.insert(taskCards).values({}).returning();
  const [version] = await db
    .insert(taskCardVersions)
    .values({
      cardId: card!.id,
      number: 1,
      title: "Load card",
      subjectId: subject!.id,
      ataChapter: "32",
      steps: stepIds.map((id, i) => ({
        id,
        text: `Step ${i + 1}: inspect and record.`,
        notices: [],
        references: [{ revisionId, page: (i % pages) + 1, quote: "" }],
        measurement: i % 3 === 0 ? { label: "Gap", unit: "in", min: 0.01, max: 0.03, nominal: null, tolerance: null } : null,
        calculator: null,
        inspectionPoint: false,
        timerMinutes: null,
      })),
    })
    .returning();
  await db.update(taskCardVersions).set({ status: "published", publishedAt: new Date() }).where(eq(taskCardVersions.id, version!.id));
  const [assignment] = await db.insert(assignments).values({ cardId: card!.id, versionId: version!.id, classId: klass!.id }).returning();

  const password = `load-${randomUUID()}`;
  const hash = await hashPassword(password);
  const students = [];
  for (let i = 0; i < clients; i++) {
    const [student] = await db
      .insert(users)
      .values({
        email: `load-${i}-${randomUUID().slice(0, 6)}@bench.test`,
        name: `Load student ${i + 1}`,
        role: "student",
        status: "active",
        passwordHash: hash,
      })
      .returning();
    await db.insert(classMembers).values({ classId: klass!.id, userId: student!.id });
    const [run] = await db
      .insert(runs)
      .values({ assignmentId: assignment!.id, studentId: student!.id, versionId: version!.id })
      .returning();
    // Each student signs in from an address of their own, as a class's laptops do (the server
    // believes the loopback proxy here; one address for 50 sign-ins would be throttled).
    const forwarded = `198.51.100.${(i % 250) + 1}`;
    const answer = await fetch(`${base}/api/session`, {
      method: "POST",
      headers: { "content-type": "application/json", "x-forwarded-for": forwarded, origin: base },
      body: JSON.stringify({ email: student!.email, password }),
    });
    if (answer.status !== 200) throw new Error(`sign-in ${i} answered ${answer.status}`);
    const cookie = answer.headers.getSetCookie()[0]!.split(";")[0]!;
    students.push({ cookie, forwarded, runId: run!.id });
  }
  return { revisionId, pages, copy, words, cardId: card!.id, stepIds, students, ingest };
}

async function main() {
  const setup = await setUp();
  console.log(
    `set up: ${setup.pages}-page manual read in ${setup.ingest.toFixed(1)} s${setup.copy ? " (reader copy ready)" : ""}, ${clients} students signed in`,
  );
  const repeated = ["brake lining", "axle nut torque", "cable tension", "magneto timing", "tire pressure"];
  const samples = new Map<Kind, number[]>(mix.map(([k]) => [k, []]));
  const errors = new Map<Kind, number>();
  const firstErrors: string[] = [];
  const bytes = new Map<Kind, number>();
  const [{ size }] = (
    await getDb().execute<{ size: number }>(
      sql`select (case when ${setup.copy !== ""} then coalesce(reader_size_bytes, size_bytes) else size_bytes end)::int as size from revisions where id = ${setup.revisionId}`,
    )
  ).rows as [{ size: number }];
  const fileSize = size;

  const request = (s: (typeof setup.students)[number], kind: Kind): [string, RequestInit] => {
    const headers: Record<string, string> = { cookie: s.cookie, "x-forwarded-for": s.forwarded };
    const word = () => setup.words[Math.floor(Math.random() * setup.words.length)]!;
    switch (kind) {
      case "health":
        return [`${base}/api/health`, { headers }];
      case "search-new":
        // Two words at random, a third often: nearly every question is one no one asked before.
        return [`${base}/api/search?q=${encodeURIComponent(`${word()} ${word()}${Math.random() < 0.5 ? ` ${word()}` : ""}`)}`, { headers }];
      case "search-repeated":
        return [`${base}/api/search?q=${encodeURIComponent(repeated[Math.floor(Math.random() * repeated.length)]!)}`, { headers }];
      case "page-text":
        return [`${base}/api/revisions/${setup.revisionId}/pages/${1 + Math.floor(Math.random() * setup.pages)}`, { headers }];
      case "reader-range": {
        const start = Math.floor(Math.random() * Math.max(1, fileSize - 65_536));
        return [
          `${base}/api/revisions/${setup.revisionId}/file${setup.copy}`,
          { headers: { ...headers, range: `bytes=${start}-${start + 65_535}` } },
        ];
      }
      case "card":
        return [`${base}/api/cards/${setup.cardId}`, { headers }];
      case "events": {
        const stepId = setup.stepIds[Math.floor(Math.random() * setup.stepIds.length)]!;
        const events = [
          { id: randomUUID(), type: "note.added", stepId, clientTime: new Date().toISOString(), payload: { text: "Checked, as found." } },
          { id: randomUUID(), type: "step.checked", stepId, clientTime: new Date().toISOString(), payload: {} },
        ];
        return [
          `${base}/api/runs/${s.runId}/events`,
          { method: "POST", headers: { ...headers, "content-type": "application/json", origin: base }, body: JSON.stringify({ events }) },
        ];
      }
      case "my-work":
        return [`${base}/api/my-work`, { headers }];
    }
  };

  const before = cpuSnapshot(new URL(process.env.DATABASE_URL!).pathname.slice(1), process.env.HL_WEB_PID);
  const started = Date.now();
  const until = started + seconds * 1000;
  await Promise.all(
    setup.students.map(async (s) => {
      while (Date.now() < until) {
        const kind = pick();
        const [url, init] = request(s, kind);
        const t0 = performance.now();
        try {
          const answer = await fetch(url, init);
          const body = await answer.arrayBuffer();
          const ms = performance.now() - t0;
          if (answer.status >= 400) {
            errors.set(kind, (errors.get(kind) ?? 0) + 1);
            if (firstErrors.length < 5) firstErrors.push(`${kind} ${answer.status}: ${Buffer.from(body).toString("utf8").slice(0, 160)}`);
          } else {
            samples.get(kind)!.push(ms);
            bytes.set(kind, (bytes.get(kind) ?? 0) + body.byteLength);
          }
        } catch (error) {
          errors.set(kind, (errors.get(kind) ?? 0) + 1);
          if (firstErrors.length < 5) firstErrors.push(`${kind}: ${error instanceof Error ? error.message : error}`);
        }
      }
    }),
  );
  const elapsed = (Date.now() - started) / 1000;
  const cpu = cpuSpent(before, cpuSnapshot(new URL(process.env.DATABASE_URL!).pathname.slice(1), process.env.HL_WEB_PID));

  const floor = percentile(
    [...samples.get("health")!].sort((a, b) => a - b),
    95,
  );
  const rows: string[] = [];
  let all = 0;
  let failed = 0;
  let worst = 0;
  for (const [kind] of mix) {
    const sorted = [...samples.get(kind)!].sort((a, b) => a - b);
    const p95 = percentile(sorted, 95);
    const ratio = p95 / floor;
    if (kind !== "health") worst = Math.max(worst, ratio);
    all += sorted.length;
    failed += errors.get(kind) ?? 0;
    const avgKb = sorted.length ? (bytes.get(kind) ?? 0) / sorted.length / 1024 : 0;
    rows.push(
      `${kind.padEnd(16)} ${String(sorted.length).padStart(6)}  p50 ${percentile(sorted, 50).toFixed(0).padStart(5)} ms  p95 ${p95.toFixed(0).padStart(5)} ms  ${
        kind === "health" ? "(the floor)" : `× floor ${ratio.toFixed(2)}`
      }  ${avgKb.toFixed(1)} KiB  errors ${errors.get(kind) ?? 0}`,
    );
  }
  console.log(`\n${clients} clients for ${elapsed.toFixed(0)} s: ${all} answers (${(all / elapsed).toFixed(0)}/s), ${failed} errors`);
  for (const row of rows) console.log(row);
  console.log(`CPU: web server ${cpu.web.toFixed(1)} s, database ${cpu.database.toFixed(1)} s over ${elapsed.toFixed(0)} s on 2 cores`);
  if (firstErrors.length) console.log(`first errors:\n  ${firstErrors.join("\n  ")}`);
  console.log(
    `goal: 0 errors and every kind's p95 ≤ ${goalRatio} × the floor's p95 (${floor.toFixed(0)} ms): ${
      failed === 0 && worst <= goalRatio ? "met" : `not met (worst ${worst.toFixed(2)} ×, ${failed} errors)`
    }`,
  );
  await closeDb();
}

await main();

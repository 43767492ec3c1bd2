// A stack that stays up: the job worker killed in the middle of reading a revision is started
// again by the supervisor (scripts/lib.mjs supervise), which finds the revision without its worker
// (its advisory lock is gone with the dead connection) and reads it again from the start. The web
// app answers throughout, and the revision is never half visible.
import { readFileSync } from "node:fs";
import path from "node:path";
import { eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { pages, revisions } from "@/db/schema";
import { deadLetterQueue, getQueue, jobs } from "@/lib/server/jobs";
import { call, demo, signIn } from "../support/http";
import { makePdf, uniqueTitle, upload, waitForRevision } from "../support/library";

const pidFile = path.join(process.env.HL_PIDS_DIR ?? "", "worker.pid");
const workerPid = () => Number(readFileSync(pidFile, "utf8"));

describe.skipIf(!process.env.HL_PIDS_DIR)("the job worker killed during an ingest", () => {
  it("comes back, and the revision ends ready with every page, never half visible", async () => {
    const librarian = await signIn(demo.librarian);
    // Pages without a text layer go through OCR one by one: slow enough to be caught half way.
    const texts = Array.from({ length: 14 }, () => "");
    const response = await upload(
      "/api/manuals",
      librarian,
      { title: uniqueTitle("Killed worker"), documentType: "handbook", revisionLabel: "Rev 1", revisionDate: "2026-10-01" },
      { bytes: await makePdf(texts) },
    );
    expect(response.status).toBe(202);
    const { revisionId } = (await response.json()) as { revisionId: string };

    const deadline = Date.now() + 30_000;
    let status = "queued";
    while (status !== "processing" && Date.now() < deadline) {
      [{ status } = { status }] = await getDb().select({ status: revisions.status }).from(revisions).where(eq(revisions.id, revisionId));
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(status).toBe("processing");
    await new Promise((r) => setTimeout(r, 1500));
    const before = workerPid();
    process.kill(-before, "SIGKILL"); // the worker and its children: tsx runs it in a child node

    // Meanwhile: the web app serves, and none of the half-read revision shows.
    expect((await call("GET", "/api/health")).status).toBe(200);
    expect((await call("GET", `/api/revisions/${revisionId}/pages/1`, { cookie: librarian })).status).toBe(404);

    const done = await waitForRevision(librarian, revisionId, 120);
    expect(done.status).toBe("ready");
    expect(done.pageCount).toBe(14);
    expect(workerPid()).not.toBe(before);
    const [{ n }] = (await getDb()
      .select({ n: sql<number>`count(*)`.mapWith(Number) })
      .from(pages)
      .where(eq(pages.revisionId, revisionId))) as [{ n: number }];
    expect(n).toBe(14);
    const [row] = await getDb().select({ attempts: revisions.attempts }).from(revisions).where(eq(revisions.id, revisionId));
    expect(row!.attempts).toBeGreaterThanOrEqual(2);
  }, 180_000);
});

describe("a job whose payload cannot be read", () => {
  it("is moved to the dead-letter queue, not retried or dropped silently", async () => {
    const boss = await getQueue();
    const id = await boss.send(jobs.ingestRevision.name, { revisionId: "not-a-uuid" });
    expect(id).toBeTruthy();
    const deadline = Date.now() + 30_000;
    let found = 0;
    while (!found && Date.now() < deadline) {
      const rows = await getDb().execute<{ n: number }>(
        sql`select count(*)::int as n from pgboss.job where name = ${deadLetterQueue} and data->>'jobId' = ${id}`,
      );
      found = rows.rows[0]?.n ?? 0;
      if (!found) await new Promise((r) => setTimeout(r, 300));
    }
    expect(found).toBe(1);
  });
});

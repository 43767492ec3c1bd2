// Shared by the benchmarks: a manual with one revision, stored and queued as an upload would be,
// and waiting until the worker has read it.
import { createHash, randomUUID } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import { Readable } from "node:stream";
import { eq } from "drizzle-orm";
import { getDb } from "../db";
import { manuals, revisions } from "../db/schema";
import { queueIngest } from "@/lib/server/ingest/queue";
import { getStore, storageKeys } from "@/lib/server/storage";

export async function storeManual(title: string, bytes: Uint8Array): Promise<{ manualId: string; revisionId: string }> {
  const db = getDb();
  const revisionId = randomUUID();
  const key = storageKeys.revisionFile(revisionId);
  await getStore().put(key, Readable.from(Buffer.from(bytes)));
  const [manual] = await db
    .insert(manuals)
    .values({ title: `${title} ${revisionId.slice(0, 8)}`, documentType: "handbook" })
    .returning({ id: manuals.id });
  await db.insert(revisions).values({
    id: revisionId,
    manualId: manual!.id,
    label: "Bench",
    revisionDate: "2026-01-01",
    fileKey: key,
    sizeBytes: bytes.length,
    sha256: createHash("sha256").update(bytes).digest("hex"),
  });
  return { manualId: manual!.id, revisionId };
}

/** Queues the ingest and resolves once the revision is ready; seconds taken, queue to ready. */
export async function ingestAndWait(revisionId: string): Promise<number> {
  const start = process.hrtime.bigint();
  await queueIngest({ revisionId });
  for (;;) {
    const [row] = await getDb()
      .select({ status: revisions.status, error: revisions.error })
      .from(revisions)
      .where(eq(revisions.id, revisionId));
    if (row?.status === "ready") return Number(process.hrtime.bigint() - start) / 1e9;
    if (row?.status === "failed") throw new Error(`bench ingest failed: ${row.error}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** User + system CPU seconds of one process, from /proc (Linux); 0 when it cannot be read. */
function processCpu(pid: string): number {
  try {
    // The command name may hold spaces and parentheses: the fields start after the last ")".
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    return (Number(fields[11]) + Number(fields[12])) / 100; // utime, stime in clock ticks (USER_HZ = 100)
  } catch {
    return 0;
  }
}

export interface CpuSnapshot {
  web: number;
  /** By process id: a backend that starts during a load counts from zero. */
  database: Map<string, number>;
}

/**
 * CPU seconds used so far by a web server and by the database backends serving `database` (their
 * command line names it). Two snapshots around a load give its CPU per query (cpuSpent), which
 * tells a slow query from a queue: on two cores, eight clients wait on each other.
 */
export function cpuSnapshot(database: string, webPid: string | undefined): CpuSnapshot {
  const db = new Map<string, number>();
  for (const pid of readdirSync("/proc").filter((name) => /^\d+$/.test(name))) {
    let command = "";
    try {
      command = readFileSync(`/proc/${pid}/cmdline`, "utf8");
    } catch {
      continue;
    }
    if (command.startsWith("postgres: ") && command.split(" ").includes(database)) db.set(pid, processCpu(pid));
  }
  return { web: webPid ? processCpu(webPid) : 0, database: db };
}

/** CPU seconds between two snapshots (a backend that ended in between is not counted). */
export function cpuSpent(before: CpuSnapshot, after: CpuSnapshot): { web: number; database: number } {
  let database = 0;
  for (const [pid, seconds] of after.database) database += seconds - (before.database.get(pid) ?? 0);
  return { web: after.web - before.web, database };
}

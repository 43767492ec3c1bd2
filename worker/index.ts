// The job worker: a separate process started by `npm start`, running the durable jobs queued in
// PostgreSQL (declared in lib/server/jobs.ts, handled in ./handlers.ts). More of these can run side by
// side; pg-boss hands each job to one of them.
import PgBoss from "pg-boss";
import { closeDb } from "../db";
import { getEnv } from "@/lib/server/env";
import { failRevision, findStaleRevisions, maxAttempts } from "@/lib/server/ingest/ingest-revision";
import { queueIngest } from "@/lib/server/ingest/queue";
import { createQueues, deadLetterQueue, jobs, type JobName } from "@/lib/server/jobs";
import { mailOverdueLoans } from "@/lib/server/tools/lending";
import { handlers } from "./handlers";

async function main() {
  const boss = new PgBoss({ connectionString: getEnv().DATABASE_URL, max: 4 });
  boss.on("error", (error) => console.error("job queue error", error));
  await boss.start();
  await createQueues(boss);

  for (const [key, job] of Object.entries(jobs) as [JobName, (typeof jobs)[JobName]][]) {
    const handle = handlers[key] as (payload: unknown) => Promise<void>;
    await boss.work(job.name, { pollingIntervalSeconds: job.pollingIntervalSeconds }, async (batch) => {
      for (const item of batch) {
        const parsed = job.payload.safeParse(item.data);
        // A payload that does not fit would fail the same way on every retry: to the dead letters.
        if (!parsed.success) {
          console.error(`${job.name} job ${item.id} has a malformed payload; moved to ${deadLetterQueue}`, parsed.error.issues);
          await boss.send(deadLetterQueue, {
            queue: job.name,
            jobId: item.id,
            data: item.data,
            issues: parsed.error.issues.map((i) => i.message),
          });
          continue;
        }
        await handle(parsed.data);
      }
    });
  }

  // A worker killed half way leaves its revision "processing" with nobody holding its lock: queue
  // it again (the next claim starts it clean), or fail it once it has used its attempts.
  const sweep = async () => {
    for (const stale of await findStaleRevisions()) {
      if (stale.attempts >= maxAttempts) {
        await failRevision({
          id: stale.id,
          reason: `Reading this revision stopped ${stale.attempts} times without finishing. Try again, or upload the file again.`,
        });
        console.log(`revision ${stale.id}: failed after ${stale.attempts} interrupted attempts`);
      } else {
        await queueIngest({ revisionId: stale.id });
        console.log(`revision ${stale.id}: its worker went quiet; queued again`);
      }
    }
    // Tool-room loans past their due time: mailed once to the student and their instructors.
    const mailed = await mailOverdueLoans();
    if (mailed) console.log(`tool room: ${mailed} overdue loan${mailed === 1 ? "" : "s"} mailed`);
  };
  const sweeper = setInterval(() => void sweep().catch((error: unknown) => console.error("sweep failed", error)), 30_000);
  void sweep().catch((error: unknown) => console.error("sweep failed", error));
  console.log("worker ready: waiting for jobs");

  const stop = async () => {
    clearInterval(sweeper);
    await boss.stop({ graceful: true, timeout: 10_000, wait: true });
    await closeDb();
    process.exit(0);
  };
  process.on("SIGTERM", () => void stop());
  process.on("SIGINT", () => void stop());
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});

// The job worker: a separate process started by `npm start`, running the durable jobs queued in
// PostgreSQL. More of these can run side by side; pg-boss hands each job to one of them.
import PgBoss from "pg-boss";
import { z } from "zod";
import { closeDb } from "../db";
import { getEnv } from "../lib/env";
import { failRevision, findStaleRevisions, ingestRevision, maxAttempts } from "../lib/ingest/ingest-revision";
import { queueIngest } from "../lib/ingest/queue";
import { makeReaderCopy, makeThumbnails } from "../lib/ingest/thumbnails";
import { createQueues, queues } from "../lib/jobs";
import { deliverMail } from "../lib/mail";
import { mailMessageSchema } from "../lib/mail/messages";
import { compareRevision } from "../lib/revisions/impact";

const revisionJob = z.object({ revisionId: z.uuid() });

async function main() {
  const boss = new PgBoss({ connectionString: getEnv().DATABASE_URL, max: 4 });
  boss.on("error", (error) => console.error("job queue error", error));
  await boss.start();
  await createQueues(boss);

  await boss.work(queues.sendMail.name, { pollingIntervalSeconds: 1 }, async (jobs) => {
    for (const job of jobs) {
      const parsed = mailMessageSchema.safeParse(job.data);
      // A malformed job would fail the same way on every retry: log it and let it go.
      if (!parsed.success) {
        console.error(`mail job ${job.id} is malformed and was dropped`, parsed.error.issues);
        continue;
      }
      await deliverMail(parsed.data);
      console.log(`sent "${parsed.data.subject}" to ${parsed.data.to}`);
    }
  });

  // Polled often: a librarian is watching the progress bar.
  await boss.work(queues.ingestRevision.name, { pollingIntervalSeconds: 0.5 }, async (jobs) => {
    for (const job of jobs) {
      const parsed = revisionJob.safeParse(job.data);
      if (!parsed.success) {
        console.error(`ingest job ${job.id} is malformed and was dropped`);
        continue;
      }
      await ingestRevision({ revisionId: parsed.data.revisionId });
    }
  });

  await boss.work(queues.makeThumbnails.name, { pollingIntervalSeconds: 2 }, async (jobs) => {
    for (const job of jobs) {
      const parsed = revisionJob.safeParse(job.data);
      if (!parsed.success) continue;
      const packed = await makeReaderCopy(parsed.data);
      console.log(`revision ${parsed.data.revisionId}: reader copy ${packed ? "made" : "not made"}, ${await makeThumbnails(parsed.data)} thumbnails`);
    }
  });

  await boss.work(queues.compareRevision.name, { pollingIntervalSeconds: 1 }, async (jobs) => {
    for (const job of jobs) {
      const parsed = revisionJob.safeParse(job.data);
      if (!parsed.success) continue;
      const outcome = await compareRevision(parsed.data);
      if (outcome.flagged) console.log(`revision ${parsed.data.revisionId}: ${outcome.flagged} citations to recheck, ${outcome.mailed} instructors told`);
    }
  });

  // A worker killed half way leaves its revision "processing" with a heartbeat that stops: queue
  // it again (the next claim starts it clean), or fail it once it has used its attempts.
  const sweep = async () => {
    for (const stale of await findStaleRevisions()) {
      if (stale.attempts >= maxAttempts) {
        await failRevision({ id: stale.id, reason: `Reading this revision stopped ${stale.attempts} times without finishing. Try again, or upload the file again.` });
        console.log(`revision ${stale.id}: failed after ${stale.attempts} interrupted attempts`);
      } else {
        await queueIngest({ revisionId: stale.id });
        console.log(`revision ${stale.id}: its worker went quiet; queued again`);
      }
    }
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

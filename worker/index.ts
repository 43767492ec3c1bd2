// The job worker: a separate process started by `npm start`, running the durable jobs queued in
// PostgreSQL. More of these can run side by side; pg-boss hands each job to one of them.
import PgBoss from "pg-boss";
import { closeDb } from "../db";
import { getEnv } from "../lib/env";
import { createQueues, queues } from "../lib/jobs";
import { deliverMail } from "../lib/mail";
import { mailMessageSchema } from "../lib/mail/messages";

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
  console.log("worker ready: waiting for jobs");

  const stop = async () => {
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

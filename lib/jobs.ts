// The durable job queue (pg-boss, inside PostgreSQL). The web app only sends jobs; the worker
// process (worker/index.ts) runs them and does the queue's maintenance.
import PgBoss from "pg-boss";
import { getEnv } from "./env";

export const queues = {
  sendMail: { name: "send-mail", retryLimit: 6, retryDelay: 20, retryBackoff: true, expireInSeconds: 120 },
  // A lost worker is noticed by the heartbeat sweeper (worker/index.ts) long before this expiry.
  ingestRevision: { name: "ingest-revision", retryLimit: 2, retryDelay: 30, retryBackoff: true, expireInSeconds: 6 * 3600 },
  compareRevision: { name: "compare-revision", retryLimit: 3, retryDelay: 30, retryBackoff: true, expireInSeconds: 1800 },
  makeThumbnails: { name: "make-thumbnails", retryLimit: 3, retryDelay: 60, retryBackoff: true, expireInSeconds: 3600 },
} as const satisfies Record<string, PgBoss.Queue>;

export async function createQueues(boss: PgBoss): Promise<void> {
  for (const queue of Object.values(queues)) await boss.createQueue(queue.name, queue);
}

const cache = globalThis as unknown as { hangarleafQueue?: Promise<PgBoss> };

/** A sending-only client, shared by the process. */
export function getQueue(): Promise<PgBoss> {
  cache.hangarleafQueue ??= (async () => {
    const boss = new PgBoss({
      connectionString: getEnv().DATABASE_URL,
      supervise: false,
      schedule: false,
      migrate: false,
      max: 2,
    });
    boss.on("error", (error) => console.error("job queue error", error));
    await boss.start();
    return boss;
  })().catch((error: unknown) => {
    cache.hangarleafQueue = undefined;
    throw error;
  });
  return cache.hangarleafQueue;
}

// The durable job queue (pg-boss, inside PostgreSQL). The web app only sends jobs; the worker
// process (worker/index.ts) runs them and does the queue's maintenance.
import PgBoss from "pg-boss";
import { getEnv } from "./env";

export const queues = {
  sendMail: { name: "send-mail", retryLimit: 6, retryDelay: 20, retryBackoff: true, expireInSeconds: 120 },
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

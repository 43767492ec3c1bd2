// The durable jobs, each declared once: its queue name, the zod schema of its payload, its pg-boss
// options and how often the worker polls for it. The web app and scripts only send them
// (`sendJob`, which checks the payload first); the worker (worker/index.ts) loops over this list
// with a handler per job (worker/handlers.ts).
//
// Retries, one story per kind of failure:
// - A handler that throws is retried by pg-boss (retryLimit, with backoff); a job that used its
//   retries moves to the dead-letter queue, as does a payload that fails its schema (retrying it
//   would fail the same way), so nothing is dropped silently.
// - Ingest keeps its own count on the revision (`attempts`, at most 3), since a revision can be
//   queued again by the sweeper as well as retried: a dead worker's revision is found by its free
//   advisory lock (lib/server/ingest/ingest-revision.ts) and queued again; the job's own expiry is only a
//   last resort for a worker that hangs.
import PgBoss from "pg-boss";
import { z } from "zod";
import { getEnv } from "@/lib/server/env";
import { mailMessageSchema } from "@/lib/server/mail/messages";

const revisionPayload = z.object({ revisionId: z.uuid() });

interface JobDefinition<S extends z.ZodType> {
  name: string;
  payload: S;
  queue: Omit<PgBoss.Queue, "name">;
  pollingIntervalSeconds: number;
  /** At most one waiting job per key (pg-boss singletonKey). */
  singletonKey?: (payload: z.output<S>) => string;
}

const define = <S extends z.ZodType>(job: JobDefinition<S>) => job;

export const jobs = {
  sendMail: define({
    name: "send-mail",
    payload: mailMessageSchema,
    queue: { retryLimit: 6, retryDelay: 20, retryBackoff: true, expireInSeconds: 120 },
    pollingIntervalSeconds: 1,
  }),
  // Polled often: a librarian is watching the progress bar.
  ingestRevision: define({
    name: "ingest-revision",
    payload: revisionPayload,
    queue: { retryLimit: 2, retryDelay: 30, retryBackoff: true, expireInSeconds: 6 * 3600 },
    pollingIntervalSeconds: 0.5,
  }),
  compareRevision: define({
    name: "compare-revision",
    payload: revisionPayload,
    queue: { retryLimit: 3, retryDelay: 30, retryBackoff: true, expireInSeconds: 1800 },
    pollingIntervalSeconds: 1,
    singletonKey: (p) => p.revisionId,
  }),
  makeThumbnails: define({
    name: "make-thumbnails",
    payload: revisionPayload,
    queue: { retryLimit: 3, retryDelay: 60, retryBackoff: true, expireInSeconds: 3600 },
    pollingIntervalSeconds: 2,
  }),
};
export type JobName = keyof typeof jobs;
export type JobPayload<K extends JobName> = z.output<(typeof jobs)[K]["payload"]>;

/** Where jobs go that used their retries or whose payload cannot be read: kept a week, for a look. */
export const deadLetterQueue = "dead-jobs";

export async function createQueues(boss: PgBoss): Promise<void> {
  await boss.createQueue(deadLetterQueue, { name: deadLetterQueue, retentionMinutes: 7 * 24 * 60 });
  for (const job of Object.values(jobs)) {
    const options = { name: job.name, ...job.queue, deadLetter: deadLetterQueue };
    await boss.createQueue(job.name, options);
    await boss.updateQueue(job.name, options); // a queue made by an older version gets today's options
  }
}

/** Sends a job after checking its payload against the job's own schema. */
export async function sendJob<K extends JobName>(name: K, payload: JobPayload<K>): Promise<void> {
  const job = jobs[name] as JobDefinition<z.ZodType>;
  const data = job.payload.parse(payload) as object;
  const boss = await getQueue();
  await boss.send(job.name, data, job.singletonKey ? { singletonKey: job.singletonKey(data) } : {});
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

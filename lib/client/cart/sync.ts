// Sending what the cart recorded while offline (pure: storage and the network are passed in, so the
// same code runs in the page, in the service worker and in `npm run bench:sync`). Photos go first,
// then events in batches per run. The server stores each event once by its id, so a batch whose
// answer was lost is simply sent again.
import type { RunEventInput } from "@/lib/domain/validation/runs";

export interface PendingEvent {
  runId: string;
  event: RunEventInput;
}

export interface PendingPhoto {
  photoId: string;
  runId: string;
  stepId: string | null;
  type: string;
  blob: Blob;
}

export interface Answer {
  status: number;
  message?: string;
}

export interface SyncPort {
  events(): Promise<PendingEvent[]>;
  photos(): Promise<PendingPhoto[]>;
  /** Takes the sent (accepted) or refused events out of the queue. */
  removeEvents(ids: string[], accepted: boolean): Promise<void>;
  removePhoto(photoId: string): Promise<void>;
  /** What the server refused for good (a signed-off run, a bad event): kept to show, never re-sent. */
  refused(items: { id: string; runId: string; reason: string }[]): Promise<void>;
  postEvents(runId: string, events: RunEventInput[]): Promise<Answer>;
  putPhoto(photo: PendingPhoto): Promise<Answer>;
}

export type SyncStop = null | "offline" | "signed_out" | "server";

export interface SyncResult {
  sent: number;
  refused: number;
  stop: SyncStop;
}

/** Events per request: a 30 % loss rate costs one wait per lost request, so fewer, larger batches. */
export const batchSize = 250;

/** One pass over the queue. Stops at the first network failure or 5xx; the caller waits and retries. */
export async function syncOnce(port: SyncPort, { size = batchSize }: { size?: number } = {}): Promise<SyncResult> {
  let sent = 0;
  let refused = 0;
  // A request lost on a flaky link is tried once more at once (the server keeps each event once,
  // so a second copy is harmless); a second loss ends the pass and the caller backs off.
  const attempt = async (fn: () => Promise<Answer>, tries = 2): Promise<Answer | SyncStop> => {
    try {
      const answer = await fn();
      if (answer.status === 401) return "signed_out";
      if (answer.status >= 500 || answer.status === 429 || answer.status === 408) return "server";
      return answer;
    } catch {
      return tries > 1 ? attempt(fn, tries - 1) : "offline";
    }
  };

  for (const photo of await port.photos()) {
    const answer = await attempt(() => port.putPhoto(photo));
    if (typeof answer === "string" || answer === null) return { sent, refused, stop: answer };
    if (answer.status >= 400) {
      refused++;
      await port.refused([{ id: photo.photoId, runId: photo.runId, reason: answer.message ?? `photo refused (${answer.status})` }]);
    }
    await port.removePhoto(photo.photoId);
  }

  /** Sends one batch; a batch refused as invalid is split, so one bad event does not sink the rest. */
  const send = async (runId: string, batch: RunEventInput[]): Promise<SyncStop | "done"> => {
    const answer = await attempt(() => port.postEvents(runId, batch));
    if (typeof answer === "string" || answer === null) return answer;
    if ((answer.status === 422 || answer.status === 413) && batch.length > 1) {
      const half = Math.ceil(batch.length / 2);
      const first = await send(runId, batch.slice(0, half));
      return first === "done" ? send(runId, batch.slice(half)) : first;
    }
    // A hand-in refused (a missing-tool hold, 409) must not take the work sent with it along:
    // the work goes again on its own, the hand-in alone is set aside with the reason.
    if (answer.status === 409 && batch.length > 1 && batch.some((e) => e.type === "run.submitted")) {
      const work = batch.filter((e) => e.type !== "run.submitted");
      const first = work.length ? await send(runId, work) : "done";
      return first === "done"
        ? send(
            runId,
            batch.filter((e) => e.type === "run.submitted"),
          )
        : first;
    }
    if (answer.status >= 400) {
      // 409 after sign-off, 404 for a run this account cannot see, 422 for an event the server
      // will never take: re-sending would block the queue forever, so they are set aside.
      refused += batch.length;
      await port.refused(batch.map((e) => ({ id: e.id, runId, reason: answer.message ?? `refused (${answer.status})` })));
      await port.removeEvents(
        batch.map((e) => e.id),
        false,
      );
    } else {
      sent += batch.length;
      await port.removeEvents(
        batch.map((e) => e.id),
        true,
      );
    }
    return "done";
  };

  const byRun = new Map<string, RunEventInput[]>();
  for (const p of await port.events()) byRun.set(p.runId, [...(byRun.get(p.runId) ?? []), p.event]);
  for (const [runId, events] of byRun) {
    for (let i = 0; i < events.length; i += size) {
      const outcome = await send(runId, events.slice(i, i + size));
      if (outcome !== "done") return { sent, refused, stop: outcome };
    }
  }
  return { sent, refused, stop: null };
}

/**
 * Exponential backoff with jitter: 0.2 s, 0.4 s, 0.8 s … up to 30 s, each between half and all of
 * it. A lost answer on a flaky hangar network is retried almost at once; a server that stays
 * down is asked less and less often.
 */
export function backoffDelay(attempt: number, random = Math.random): number {
  const ceiling = Math.min(30_000, 200 * 2 ** attempt);
  return Math.round(ceiling * (0.5 + random() / 2));
}

/**
 * Passes until the queue is empty, waiting between failed passes; gives up when signed out. The
 * wait grows only while passes get nothing through: a flaky link that lets most requests pass
 * keeps short waits.
 */
export async function syncUntilDone(
  port: SyncPort,
  {
    sleep = (ms: number) => new Promise<void>((r) => setTimeout(r, ms)),
    maxPasses = 50,
    size = batchSize,
    delay = backoffDelay,
  }: { sleep?: (ms: number) => Promise<void>; maxPasses?: number; size?: number; delay?: (attempt: number) => number } = {},
): Promise<SyncResult & { passes: number }> {
  let total: SyncResult = { sent: 0, refused: 0, stop: null };
  let fruitless = 0;
  for (let pass = 0; pass < maxPasses; pass++) {
    const result = await syncOnce(port, { size });
    total = { sent: total.sent + result.sent, refused: total.refused + result.refused, stop: result.stop };
    if (!result.stop || result.stop === "signed_out") return { ...total, passes: pass + 1 };
    fruitless = result.sent + result.refused > 0 ? 0 : fruitless + 1;
    await sleep(delay(fruitless));
  }
  return { ...total, passes: maxPasses };
}

// Storing a cart's event batch: each event once by its id, stamped with one receipt time per
// batch under the run's lock, then folded and written back onto the run row.
import "server-only";
import { eq, inArray, sql } from "drizzle-orm";
import { getDb, type Tx } from "@/db";
import { runEvents, runs } from "@/db/schema";
import type { Actor } from "@/lib/domain/access/permissions";
import type { EventBatchResultDto } from "@/lib/contracts/runs";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";
import type { RunEventInput } from "@/lib/domain/validation/runs";
import { type RunEvent, type RunState } from "@/lib/domain/runs/fold";
import { loadRun, stepsOnly, foldStored } from "@/lib/server/runs/queries";
import { assertNotWithdrawn } from "@/lib/server/runs/assign";
import { noticeBuyOffCall } from "@/lib/server/runs/buy-offs";
import { checkReadingTools, handInHeld, holdsOnRun } from "@/lib/server/tools/lending";
import { applyFleetEvents } from "@/lib/server/fleet/run-events";

export const signedOffConflict = () =>
  new AppError("conflict", "This run is signed off. Its record cannot change; ask your instructor to assign the card again.");

export const reviewEventTypes = new Set(["inspection.bought_off", "run.returned", "run.signed_off", "run.moved"]);

/** Stores what the fold says back onto the run row, for lists and queues. */
export async function writeFold(tx: Tx, runId: string, state: RunState, events: RunEvent[]) {
  const times = events.map((e) => e.clientTime).sort();
  const submitted = events
    .filter((e) => e.type === "run.submitted")
    .map((e) => e.clientTime)
    .sort()
    .at(-1);
  await tx
    .update(runs)
    .set({
      status: state.status,
      startedAt: times[0] ? new Date(times[0]) : null,
      lastEventAt: times.at(-1) ? new Date(times.at(-1)!) : null,
      submittedAt: state.status === "submitted" && submitted ? new Date(submitted) : null,
      waitingStepId: state.waitingAt,
      calledAt: state.calledAt ? new Date(state.calledAt) : null,
    })
    .where(eq(runs.id, runId));
}

export function isSignedOffError(error: unknown) {
  return databaseErrorCode(error) === "HLF03";
}

/**
 * Stores a batch of events from a cart. Idempotent by event id: what is already stored is counted
 * as a duplicate and nothing changes, so a cart may re-send a batch whose answer it never got, even
 * after sign-off. New events on a signed-off run are refused (409), here and by the database.
 */
export async function appendEvents({
  actor,
  runId,
  events,
}: {
  actor: Actor;
  runId: string;
  events: RunEventInput[];
}): Promise<EventBatchResultDto> {
  try {
    const outcome = await getDb().transaction(async (tx) => {
      const run = await loadRun(tx, actor, runId, { lock: true });
      const ids = [...new Set(events.map((e) => e.id))];
      const known = await tx.select({ id: runEvents.id, runId: runEvents.runId }).from(runEvents).where(inArray(runEvents.id, ids));
      if (known.some((k) => k.runId !== runId)) {
        throw new AppError("conflict", "An event id in this batch belongs to another run. Each event needs its own id.");
      }
      const knownIds = new Set(known.map((k) => k.id));
      const fresh = [...new Map(events.filter((e) => !knownIds.has(e.id)).map((e) => [e.id, e])).values()];
      if (fresh.length && run.studentId !== actor.id) throw new AppError("forbidden", "Only the student doing this run records its work.");
      if (fresh.length && run.status === "signed_off") throw signedOffConflict();
      if (fresh.length) await assertNotWithdrawn(tx, run.assignmentId);
      // A tool not counted back in at the tool room holds the hand-in until an instructor clears it.
      if (fresh.some((e) => e.type === "run.submitted")) {
        const holds = await holdsOnRun(tx, { id: runId, studentId: run.studentId });
        if (holds.length) throw handInHeld(holds);
      }
      const steps = fresh.length ? await stepsOnly(tx, run.versionId) : null;
      if (fresh.length) {
        // One receipt time for the batch, read after the run's lock: the fold orders batches by it,
        // and the transaction's start time (the column default) can be earlier than a batch that
        // held the lock first.
        const serverTime = await receiptTime(tx, runId);
        const checked = await checkReadingTools(tx, fresh, steps!.steps, serverTime);
        await tx.insert(runEvents).values(
          checked.map((e) => ({
            id: e.id,
            runId,
            userId: actor.id,
            type: e.type,
            stepId: e.stepId,
            payload: e.payload,
            clientTime: new Date(e.clientTime),
            serverTime,
          })),
        );
        await applyFleetEvents(tx, actor, runId, checked, serverTime);
      }
      if (!fresh.length) return { result: { stored: 0, duplicates: events.length, status: run.status }, called: null };
      const { events: all, state } = await foldStored(tx, runId, steps!);
      await writeFold(tx, runId, state, all);
      // A new call for the instructor: this batch made the run wait at a step the student called for.
      const called = state.calledAt && (!run.calledAt || run.waitingStepId !== state.waitingAt) ? state.waitingAt : null;
      return { result: { stored: fresh.length, duplicates: events.length - fresh.length, status: state.status }, called };
    });
    // After the commit: a mail is never sent for a batch that was rolled back.
    if (outcome.called) await noticeBuyOffCall(runId, outcome.called);
    return outcome.result;
  } catch (error) {
    if (isSignedOffError(error)) throw signedOffConflict();
    // Two runs sent an event with the same new id at the same moment.
    if (databaseErrorCode(error) === "23505")
      throw new AppError("conflict", "An event id in this batch is already used. Each event needs its own id.");
    throw error;
  }
}

/**
 * The receipt time of what is written now on this run, read under the run's lock: later than every
 * receipt before it on the run, even within one millisecond (JavaScript keeps milliseconds) or if
 * the clock steps back, so a batch never ties with the review moment it waited behind.
 */
export async function receiptTime(tx: Tx, runId: string): Promise<Date> {
  const [row] = await tx
    .execute<{ now: Date | string }>(
      sql`select greatest(clock_timestamp(), coalesce(max(server_time) + interval '1 millisecond', clock_timestamp())) as now from run_events where run_id = ${runId}`,
    )
    .then((r) => r.rows);
  return new Date(row!.now);
}

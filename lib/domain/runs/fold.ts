// A run of a task card is the list of what happened on it: events made on the cart, each with an id
// the cart chose. The run's state is never stored; it is folded from the events here. Pure: no
// database, no framework.
//
// Each event has two times: the cart's clock (when the student says it happened) and the server's
// receipt. Between two review moments (a hand-in, a buy-off, a return, a sign-off) the cart's clock
// orders the work, so an offline cart that syncs late, or out of order, folds the same. But a review
// moment is a wall: an event the server received after it is folded after it, whatever its stamp
// says, so a back-dated event cannot slip under a buy-off, a hand-in or a sign-off. Such an event is
// kept and shown as "arrived after …", never folded into what the instructor saw or signed.
import { judgeValue, type Judgement, type Limit } from "@/lib/domain/calc/limits";
import type { RunStatus } from "@/lib/domain/vocabulary";

export const runEventTypes = [
  "step.checked",
  "step.unchecked",
  "value.recorded",
  "note.added",
  "photo.added",
  "timer.started",
  "timer.stopped",
  "inspection.called",
  "inspection.bought_off",
  "run.submitted",
  "run.returned",
  "run.moved",
  "run.signed_off",
  // What the run works on (the aircraft picked at the cart) and what was found on it: kept in their
  // own tables (lib/server/fleet), sent with the run's events so offline carts file them once.
  "asset.named",
  "finding.filed",
] as const;
export type RunEventType = (typeof runEventTypes)[number];

export interface RunEvent {
  id: string;
  type: RunEventType;
  userId: string;
  /** ISO time on the cart's clock when it happened. */
  clientTime: string;
  /** ISO time the server received it; absent (or null) while it waits on the cart. */
  serverTime?: string | null;
  stepId?: string | null;
  payload?: Record<string, unknown>;
}

export interface CardStepForRun {
  id: string;
  inspectionPoint: boolean;
  measurement: Limit | null;
  timerMinutes: number | null;
}

export interface Reading {
  text: string;
  judgement: Judgement;
  at: string;
  /** The tool-room number of the precision tool it was taken with (the server writes it from the tool room). */
  tool: string | null;
}

export interface StepState {
  checked: boolean;
  checkedAt: string | null;
  /** Who marked it done: the paper card's initials box. */
  checkedBy: string | null;
  /** The reading that counts: the last one recorded since the step was last reopened. */
  value: Reading | null;
  /** Every reading recorded on the step, oldest first, kept across rework: the instructor sees them all. */
  readings: Reading[];
  notes: { text: string; at: string; by: string }[];
  photos: { key: string; at: string }[];
  timer: { startedAt: string; minutes: number; stoppedAt: string | null } | null;
  /** The student asked the instructor to come and buy off this inspection point. */
  called: { at: string } | null;
  boughtOff: { by: string; at: string } | null;
  /**
   * The step is to be done again, buy-off included: the instructor sent the run back naming it
   * ("rework"), or the run moved to a card version in which the step changed ("new version").
   */
  reopened: { at: string; by: string; why: "rework" | "new version" } | null;
  /** A note written since the current reading: an out-of-limit reading needs one before the step is done. */
  notedSinceReading: boolean;
}

export type { RunStatus };

export interface RunState {
  status: RunStatus;
  steps: Record<string, StepState>;
  /** The first inspection point checked but not bought off: later steps wait for it. */
  waitingAt: string | null;
  /** When the student called the instructor to the step the run waits at; null when not called. */
  calledAt: string | null;
  returnedComment: string | null;
  signedOff: { by: string; at: string } | null;
  /** Events the fold set aside, with why (after sign-off, for an unknown step, not allowed). */
  ignored: { id: string; reason: string }[];
  /**
   * Events received after a review moment but stamped before it: folded after it (most are set
   * aside then), and listed so the instructor sees "arrived after …".
   */
  late: { id: string; after: ReviewMoment; at: string }[];
  eventCount: number;
}

const emptyStep = (): StepState => ({
  checked: false,
  checkedAt: null,
  checkedBy: null,
  value: null,
  readings: [],
  notes: [],
  photos: [],
  timer: null,
  called: null,
  boughtOff: null,
  reopened: null,
  notedSinceReading: false,
});

/** Why a step cannot be marked done yet, in the student's words; null when it can. The cart asks the same. */
export function cannotMarkDone(step: Pick<CardStepForRun, "measurement">, s: StepState): string | null {
  if (!step.measurement || !s.value || s.value.judgement.status === "in") return null;
  if (s.notedSinceReading) return null;
  return s.value.judgement.status === "out"
    ? "The reading is out of limits: write a note of what you found (and tell your instructor) before marking the step done."
    : "The reading was not understood: record it again, or write a note of why, before marking the step done.";
}

/** A step done again from the start; its readings stay in its history unless they were judged against other limits. */
function restart(s: StepState, reopened: NonNullable<StepState["reopened"]>, keepReadings: boolean) {
  Object.assign(s, {
    checked: false,
    checkedAt: null,
    checkedBy: null,
    value: null,
    readings: keepReadings ? s.readings : [],
    called: null,
    boughtOff: null,
    notedSinceReading: false,
    reopened,
  });
}

/** Text of a run.returned event's list of steps to do again, as ids; anything else is dropped. */
export function reopenedStepIds(payload: Record<string, unknown> | undefined): string[] {
  const ids = payload?.reopenStepIds;
  return Array.isArray(ids) ? ids.filter((id): id is string => typeof id === "string") : [];
}

/** The events that stand between what came before and what comes after. */
const reviewMoments = {
  "run.submitted": "hand-in",
  "inspection.bought_off": "buy-off",
  "run.returned": "return",
  "run.moved": "move to a new card version",
  "run.signed_off": "sign-off",
} as const;
export type ReviewMoment = (typeof reviewMoments)[keyof typeof reviewMoments];
const momentOf = (type: RunEventType): ReviewMoment | null => (reviewMoments as Record<string, ReviewMoment>)[type] ?? null;

export interface OrderedEvent<E extends RunEvent = RunEvent> {
  event: E;
  /** Where the fold places it: its cart stamp, moved up to the last review moment received before it. */
  at: string;
  /** Set when the stamp was moved: the review moment it arrived after, and when that was received. */
  lateAfter: { moment: ReviewMoment; receivedAt: string } | null;
}

const notReceived = "\uffff"; // sorts after every ISO time: waiting on the cart, so after all that was received
const receipt = (e: RunEvent) => e.serverTime ?? notReceived;
const compare = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
const laterOf = (a: string, b: string) => (a < b ? b : a);

/**
 * Same events in, same order out, whatever order they are listed in; an id seen twice counts once.
 * Events are walked in order of receipt (one batch shares its receipt time; inside it, the cart's
 * clock). An event is placed no earlier than the review moments received in earlier batches, and a
 * review moment no earlier than anything received before it. Then all are sorted by that place
 * (ties: earlier receipt first), so a late event lands after the wall it arrived behind.
 */
export function orderEvents<E extends RunEvent>(events: readonly E[]): OrderedEvent<E>[] {
  const unique = new Map<string, E>();
  for (const e of events) if (!unique.has(e.id)) unique.set(e.id, e);
  const byReceipt = [...unique.values()].sort(
    (a, b) => compare(receipt(a), receipt(b)) || compare(a.clientTime, b.clientTime) || compare(a.id, b.id),
  );
  const placed: (OrderedEvent<E> & { batch: number })[] = [];
  type Wall = { moment: ReviewMoment; at: string; receivedAt: string };
  let wall: Wall | null = null; // the latest review moment of earlier batches
  let latest = ""; // the latest place of anything in earlier batches
  for (let i = 0, batch = 0; i < byReceipt.length; batch++) {
    const r = receipt(byReceipt[i]!);
    let nextWall: Wall | null = wall;
    let nextLatest = latest;
    for (; i < byReceipt.length && receipt(byReceipt[i]!) === r; i++) {
      const event = byReceipt[i]!;
      const moment = momentOf(event.type);
      const at = laterOf(event.clientTime, moment ? latest : (wall?.at ?? ""));
      // Late means stamped before the wall was received: a wall placed far ahead by one fast cart
      // stamp does not make honest work after it look back-dated (it is still placed after it).
      const lateAfter =
        wall && at !== event.clientTime && event.clientTime < wall.receivedAt ? { moment: wall.moment, receivedAt: wall.receivedAt } : null;
      placed.push({ event, at, lateAfter, batch });
      nextLatest = laterOf(nextLatest, at);
      if (moment && (!nextWall || at >= nextWall.at)) nextWall = { moment, at, receivedAt: event.serverTime ?? at };
    }
    wall = nextWall;
    latest = nextLatest;
  }
  return placed
    .sort(
      (a, b) =>
        compare(a.at, b.at) || a.batch - b.batch || compare(a.event.clientTime, b.event.clientTime) || compare(a.event.id, b.event.id),
    )
    .map(({ batch: _batch, ...rest }) => rest);
}

const text = (payload: Record<string, unknown> | undefined, key: string) =>
  typeof payload?.[key] === "string" ? (payload[key] as string) : "";

/**
 * Folds a run's events over its card version's steps. `instructors` are the user ids allowed to buy
 * off, return and sign off (the server knows who they are; the fold does not trust the cart).
 */
export function foldRun(events: readonly RunEvent[], steps: readonly CardStepForRun[], instructors: ReadonlySet<string>): RunState {
  const state: RunState = {
    status: "not_started",
    steps: Object.fromEntries(steps.map((s) => [s.id, emptyStep()])),
    waitingAt: null,
    calledAt: null,
    returnedComment: null,
    signedOff: null,
    ignored: [],
    late: [],
    eventCount: 0,
  };
  const byId = new Map(steps.map((s) => [s.id, s]));
  const movedSteps = new Set<string>();
  const ordered = orderEvents(events);
  // Work on a step before a move that restarted it was done on the old version's step: it is
  // history, not judged again against the new version's limits.
  const restartedAt = new Map<string, number>();
  ordered.forEach(({ event: e }, i) => {
    if (e.type === "run.moved" && instructors.has(e.userId)) for (const id of reopenedStepIds(e.payload)) restartedAt.set(id, i);
  });
  for (const [i, { event: e, lateAfter }] of ordered.entries()) {
    state.eventCount++;
    if (lateAfter) state.late.push({ id: e.id, after: lateAfter.moment, at: lateAfter.receivedAt });
    if (e.stepId && (restartedAt.get(e.stepId) ?? -1) > i) continue;
    // A late event that is set aside says so: it was stamped before the review moment it arrived after.
    const setAside = (reason: string) =>
      state.ignored.push({ id: e.id, reason: lateAfter ? `arrived after the ${lateAfter.moment}: ${reason}` : reason });
    if (state.signedOff) {
      setAside("after sign-off");
      continue;
    }
    const isInstructor = instructors.has(e.userId);
    if (e.type === "asset.named" || e.type === "finding.filed") continue; // they change no step
    if (e.type === "run.submitted") {
      // A hand-in made before the instructor's return (an offline cart's, sent late) is not a new one.
      if (lateAfter?.moment === "return") {
        setAside("handed in before the return");
        continue;
      }
      state.status = "submitted";
      continue;
    }
    if (e.type === "run.moved") {
      if (!isInstructor) {
        setAside("only an instructor may do this");
        continue;
      }
      // The run now follows a newer card version: the steps that changed in it are done again (their
      // readings were judged against the old limits), and a handed-in run with such a step is open again.
      const restarted = reopenedStepIds(e.payload);
      for (const id of restarted) {
        const s = state.steps[id];
        if (!s) continue;
        movedSteps.add(id);
        restart(s, { at: e.clientTime, by: e.userId, why: "new version" }, false);
      }
      if (restarted.length && state.status === "submitted") state.status = "in_progress";
      continue;
    }
    if (e.type === "run.returned" || e.type === "run.signed_off") {
      if (!isInstructor) {
        setAside("only an instructor may do this");
        continue;
      }
      if (e.type === "run.returned") {
        state.status = "returned";
        state.returnedComment = text(e.payload, "comment") || null;
        // The steps the instructor names are done again from the start, bought-off ones too; the
        // readings stay in the step's history so the second attempt is seen beside the first.
        for (const id of reopenedStepIds(e.payload)) {
          const s = state.steps[id];
          if (s) restart(s, { at: e.clientTime, by: e.userId, why: "rework" }, true);
        }
      } else {
        state.status = "signed_off";
        state.signedOff = { by: e.userId, at: e.clientTime };
      }
      continue;
    }
    const step = e.stepId ? byId.get(e.stepId) : undefined;
    const s = e.stepId ? state.steps[e.stepId] : undefined;
    if (e.type === "note.added" && !e.stepId) {
      continue; // run-level notes are kept by the caller; the fold only counts them
    }
    if (!step || !s) {
      setAside("no such step on this card version");
      continue;
    }
    // Work done offline on the old version of a step that changed, sent after the move, is not work on the new one.
    if (lateAfter?.moment === "move to a new card version" && movedSteps.has(step.id)) {
      setAside("done on the earlier card version; this step changed in the new one");
      continue;
    }
    if (e.type !== "inspection.bought_off") {
      // What the instructor saw is what stays: a handed-in run waits for the review, and a step
      // bought off no longer changes (a note may still be added).
      if (state.status === "submitted") {
        setAside("handed in: wait for the instructor");
        continue;
      }
      if (s.boughtOff && e.type !== "note.added") {
        setAside("this inspection point is bought off");
        continue;
      }
    }
    if (state.status === "not_started" || state.status === "returned") state.status = "in_progress";
    switch (e.type) {
      case "step.checked": {
        const why = cannotMarkDone(step, s);
        if (why) {
          setAside(why);
          break;
        }
        s.checked = true;
        s.checkedAt = e.clientTime;
        s.checkedBy = e.userId;
        break;
      }
      case "step.unchecked":
        s.checked = false;
        s.checkedAt = null;
        s.checkedBy = null;
        s.called = null;
        break;
      case "value.recorded": {
        const value = text(e.payload, "value");
        if (!step.measurement) {
          setAside("this step records no value");
          break;
        }
        const tool = text(e.payload, "toolNumber") || null;
        s.value = { text: value, judgement: judgeValue(value, step.measurement), at: e.clientTime, tool };
        s.readings.push(s.value);
        s.notedSinceReading = false;
        break;
      }
      case "note.added":
        s.notes.push({ text: text(e.payload, "text"), at: e.clientTime, by: e.userId });
        s.notedSinceReading = true;
        break;
      case "inspection.called":
        if (!step.inspectionPoint) setAside("not an inspection point");
        else if (!s.checked) setAside("call the instructor once the step is done");
        else s.called = { at: e.clientTime };
        break;
      case "photo.added":
        s.photos.push({ key: text(e.payload, "key"), at: e.clientTime });
        break;
      case "timer.started":
        s.timer = { startedAt: e.clientTime, minutes: Number(e.payload?.minutes ?? step.timerMinutes ?? 0), stoppedAt: null };
        break;
      case "timer.stopped":
        if (s.timer) s.timer.stoppedAt = e.clientTime;
        break;
      case "inspection.bought_off":
        if (!isInstructor) setAside("only an instructor may buy off");
        else if (!step.inspectionPoint) setAside("not an inspection point");
        else s.boughtOff = { by: e.userId, at: e.clientTime };
        break;
    }
  }
  state.waitingAt = steps.find((st) => st.inspectionPoint && state.steps[st.id]!.checked && !state.steps[st.id]!.boughtOff)?.id ?? null;
  state.calledAt = state.waitingAt ? (state.steps[state.waitingAt]!.called?.at ?? null) : null;
  return state;
}

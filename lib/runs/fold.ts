// A run of a task card is the list of what happened on it: events made on the cart, each with an id
// the cart chose. The run's state is never stored; it is folded from the events here. Pure: no
// database, no framework. The fold sorts by the cart's clock and the event id first, so the same
// events give the same state whatever order they arrived in, and an event seen twice counts once.
import { judgeValue, type Judgement, type Limit } from "@/lib/calc/limits";

export const runEventTypes = [
  "step.checked",
  "step.unchecked",
  "value.recorded",
  "note.added",
  "photo.added",
  "timer.started",
  "timer.stopped",
  "inspection.bought_off",
  "run.submitted",
  "run.returned",
  "run.signed_off",
] as const;
export type RunEventType = (typeof runEventTypes)[number];

export interface RunEvent {
  id: string;
  type: RunEventType;
  userId: string;
  /** ISO time on the cart's clock when it happened. */
  clientTime: string;
  stepId?: string | null;
  payload?: Record<string, unknown>;
}

export interface CardStepForRun {
  id: string;
  inspectionPoint: boolean;
  measurement: Limit | null;
  timerMinutes: number | null;
}

export interface StepState {
  checked: boolean;
  checkedAt: string | null;
  value: { text: string; judgement: Judgement; at: string } | null;
  notes: { text: string; at: string; by: string }[];
  photos: { key: string; at: string }[];
  timer: { startedAt: string; minutes: number; stoppedAt: string | null } | null;
  boughtOff: { by: string; at: string } | null;
}

export type RunStatus = "not_started" | "in_progress" | "submitted" | "returned" | "signed_off";

export interface RunState {
  status: RunStatus;
  steps: Record<string, StepState>;
  /** The first inspection point checked but not bought off: later steps wait for it. */
  waitingAt: string | null;
  returnedComment: string | null;
  signedOff: { by: string; at: string } | null;
  /** Events the fold set aside, with why (after sign-off, for an unknown step, not allowed). */
  ignored: { id: string; reason: string }[];
  eventCount: number;
}

const emptyStep = (): StepState => ({ checked: false, checkedAt: null, value: null, notes: [], photos: [], timer: null, boughtOff: null });

/** Same events in, same order out: the cart's clock first, the event id breaks ties. */
export function orderEvents(events: readonly RunEvent[]): RunEvent[] {
  const unique = new Map<string, RunEvent>();
  for (const e of events) if (!unique.has(e.id)) unique.set(e.id, e);
  return [...unique.values()].sort((a, b) => (a.clientTime < b.clientTime ? -1 : a.clientTime > b.clientTime ? 1 : a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
}

const text = (payload: Record<string, unknown> | undefined, key: string) => (typeof payload?.[key] === "string" ? (payload[key] as string) : "");

/**
 * Folds a run's events over its card version's steps. `instructors` are the user ids allowed to buy
 * off, return and sign off (the server knows who they are; the fold does not trust the cart).
 */
export function foldRun(events: readonly RunEvent[], steps: readonly CardStepForRun[], instructors: ReadonlySet<string>): RunState {
  const state: RunState = {
    status: "not_started",
    steps: Object.fromEntries(steps.map((s) => [s.id, emptyStep()])),
    waitingAt: null,
    returnedComment: null,
    signedOff: null,
    ignored: [],
    eventCount: 0,
  };
  const byId = new Map(steps.map((s) => [s.id, s]));
  for (const e of orderEvents(events)) {
    state.eventCount++;
    if (state.signedOff) {
      state.ignored.push({ id: e.id, reason: "after sign-off" });
      continue;
    }
    const isInstructor = instructors.has(e.userId);
    if (e.type === "run.submitted") {
      state.status = "submitted";
      continue;
    }
    if (e.type === "run.returned" || e.type === "run.signed_off") {
      if (!isInstructor) {
        state.ignored.push({ id: e.id, reason: "only an instructor may do this" });
        continue;
      }
      if (e.type === "run.returned") {
        state.status = "returned";
        state.returnedComment = text(e.payload, "comment") || null;
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
      state.ignored.push({ id: e.id, reason: "no such step on this card version" });
      continue;
    }
    if (e.type !== "inspection.bought_off") {
      // What the instructor saw is what stays: a handed-in run waits for the review, and a step
      // bought off no longer changes (a note may still be added).
      if (state.status === "submitted") {
        state.ignored.push({ id: e.id, reason: "handed in: wait for the instructor" });
        continue;
      }
      if (s.boughtOff && e.type !== "note.added") {
        state.ignored.push({ id: e.id, reason: "this inspection point is bought off" });
        continue;
      }
    }
    if (state.status === "not_started" || state.status === "returned") state.status = "in_progress";
    switch (e.type) {
      case "step.checked":
        s.checked = true;
        s.checkedAt = e.clientTime;
        break;
      case "step.unchecked":
        s.checked = false;
        s.checkedAt = null;
        break;
      case "value.recorded": {
        const value = text(e.payload, "value");
        if (!step.measurement) {
          state.ignored.push({ id: e.id, reason: "this step records no value" });
          break;
        }
        s.value = { text: value, judgement: judgeValue(value, step.measurement), at: e.clientTime };
        break;
      }
      case "note.added":
        s.notes.push({ text: text(e.payload, "text"), at: e.clientTime, by: e.userId });
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
        if (!isInstructor) state.ignored.push({ id: e.id, reason: "only an instructor may buy off" });
        else if (!step.inspectionPoint) state.ignored.push({ id: e.id, reason: "not an inspection point" });
        else s.boughtOff = { by: e.userId, at: e.clientTime };
        break;
    }
  }
  state.waitingAt = steps.find((st) => st.inspectionPoint && state.steps[st.id]!.checked && !state.steps[st.id]!.boughtOff)?.id ?? null;
  return state;
}

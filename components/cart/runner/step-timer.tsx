"use client";

import type { CartData } from "@/lib/client/cart/store";
import { formatLeft } from "../timer-watch";
import type { Act, StepState } from "./use-run";

/** A step's timer: started and stopped as events, and kept in the cart's timers so it rings on any page. */
export function StepTimer({
  number,
  stepId,
  minutes,
  timer,
  now,
  locked,
  frozen,
  onAct,
  data,
  runId,
}: {
  number: number;
  stepId: string;
  minutes: number;
  timer: StepState["timer"];
  now: number;
  locked: boolean;
  frozen: boolean;
  onAct: Act;
  data: CartData;
  runId: string;
}) {
  const timerLeft = timer && !timer.stoppedAt ? Date.parse(timer.startedAt) + timer.minutes * 60_000 - now : null;
  return (
    <div className="flex flex-wrap items-center gap-3">
      {timerLeft !== null ? (
        <>
          <span role="timer" aria-live="off" className={`text-3xl font-bold tabular-nums ${timerLeft <= 0 ? "text-danger" : ""}`}>
            {timerLeft <= 0 ? "Time is up" : formatLeft(timerLeft)}
          </span>
          <button
            type="button"
            className="btn btn-secondary"
            disabled={locked}
            onClick={() =>
              void onAct("timer.stopped", { stepId }).then(() =>
                data.setTimers((t) => t.filter((x) => !(x.runId === runId && x.stepId === stepId))),
              )
            }
          >
            Stop timer
          </button>
        </>
      ) : (
        <button
          type="button"
          className="btn btn-secondary"
          disabled={frozen}
          onClick={async () => {
            await onAct("timer.started", { stepId, payload: { minutes } });
            await data.setTimers((t) => [
              ...t.filter((x) => !(x.runId === runId && x.stepId === stepId)),
              { runId, stepId, label: `step ${number} (${minutes} min)`, endsAt: Date.now() + minutes * 60_000 },
            ]);
          }}
        >
          Start the {minutes} min timer
        </button>
      )}
      {timer?.stoppedAt ? <span className="hint">Timer stopped.</span> : null}
    </div>
  );
}

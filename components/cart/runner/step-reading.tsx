"use client";

import { LimitCheckField } from "@/components/limit-check-field";
import { describeLimit } from "@/lib/domain/calc/limits";
import type { Act, StepDto, StepState } from "./use-run";

/**
 * The measured value of a step: judged while typed, recorded as an event, the last one shown. The
 * typed value is held by the step, so the step's calculator can put its result in.
 */
export function StepReading({
  number,
  stepId,
  measurement,
  recorded,
  frozen,
  why,
  value,
  setValue,
  onAct,
}: {
  number: number;
  stepId: string;
  measurement: NonNullable<StepDto["measurement"]>;
  recorded: StepState["value"];
  frozen: boolean;
  /** Why the reading cannot be recorded now, said beside the button. */
  why: string | null;
  value: string;
  setValue: (value: string) => void;
  onAct: Act;
}) {
  return (
    <form
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (!value.trim()) return;
        void onAct("value.recorded", { stepId, payload: { value: value.trim() } }).then(() => setValue(""));
      }}
    >
      <LimitCheckField
        id={`value-${stepId}`}
        label={`${measurement.label} (limits ${describeLimit(measurement)})`}
        limit={measurement}
        value={value}
        onChange={setValue}
      />
      <button type="submit" className="btn btn-secondary self-start" disabled={frozen || !value.trim()}>
        Record this reading
      </button>
      {frozen && why ? <p className="hint">{why}</p> : null}
      {recorded ? (
        <p data-testid={`recorded-${number}`} className={recorded.judgement.status === "in" ? "notice-ok" : "notice-error"}>
          Recorded {recorded.text}:{" "}
          {recorded.judgement.status === "in" ? "within limits" : recorded.judgement.status === "out" ? "OUT OF LIMITS" : "not understood"}.{" "}
          {recorded.judgement.message}
        </p>
      ) : null}
    </form>
  );
}

"use client";

import { LimitCheckField } from "@/components/limit-check-field";
import { useState } from "react";
import { describeLimit } from "@/lib/domain/calc/limits";
import type { RunToolsDto } from "@/lib/contracts/tools";
import { toolRefusal } from "@/lib/domain/tools/tool-room";
import type { Act, StepDto, StepState } from "./use-run";

type CheckedOutTool = RunToolsDto["checkedOut"][number];

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
  calibratedTool,
  tools,
  today,
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
  /** The step asks which precision tool the reading was taken with. */
  calibratedTool: boolean;
  /** What the student has checked out at the tool room (from the run's last refresh, offline too). */
  tools: CheckedOutTool[];
  /** Today on the school's clock: a tool past its calibration date cannot be picked. */
  today: string;
}) {
  const precision = tools.filter((t) => t.calibrated);
  const usable = precision.filter((t) => !toolRefusal(t, today));
  const [toolId, setToolId] = useState(() => (usable.length === 1 ? usable[0]!.id : ""));
  const tool = usable.find((t) => t.id === toolId) ?? null;
  const needsTool = calibratedTool && !tool;
  const toolWhy = !calibratedTool
    ? null
    : !usable.length
      ? precision.length
        ? "Every calibrated tool you have out is past its calibration date or out of service: take one within calibration from the tool room."
        : "This reading is taken with a calibrated tool: check one out at the tool room first (the list updates when the cart is online)."
      : needsTool
        ? "Choose the tool the reading was taken with."
        : null;
  return (
    <form
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (!value.trim() || needsTool) return;
        const payload = tool ? { value: value.trim(), toolId: tool.id, toolNumber: tool.number } : { value: value.trim() };
        void onAct("value.recorded", { stepId, payload }).then(() => setValue(""));
      }}
    >
      {calibratedTool ? (
        <label className="field">
          <span className="label">Taken with (calibrated tool)</span>
          <select className="input text-lg" value={toolId} onChange={(e) => setToolId(e.target.value)} disabled={frozen}>
            <option value="">Choose the tool…</option>
            {precision.map((t) => {
              const refused = toolRefusal(t, today);
              return (
                <option key={t.id} value={t.id} disabled={!!refused}>
                  {t.number} {t.description}
                  {refused
                    ? t.status === "out_of_service"
                      ? " — out of service"
                      : " — PAST CALIBRATION, cannot be used"
                    : ` — calibration due ${t.calibrationDueOn}`}
                </option>
              );
            })}
          </select>
        </label>
      ) : null}
      <LimitCheckField
        id={`value-${stepId}`}
        label={`${measurement.label} (limits ${describeLimit(measurement)})`}
        limit={measurement}
        value={value}
        onChange={setValue}
      />
      <button type="submit" className="btn btn-secondary self-start" disabled={frozen || !value.trim() || needsTool}>
        Record this reading
      </button>
      {frozen && why ? <p className="hint">{why}</p> : null}
      {!frozen && toolWhy ? <p className="hint">{toolWhy}</p> : null}
      {recorded ? (
        <p data-testid={`recorded-${number}`} className={recorded.judgement.status === "in" ? "notice-ok" : "notice-error"}>
          Recorded {recorded.text}:{" "}
          {recorded.judgement.status === "in" ? "within limits" : recorded.judgement.status === "out" ? "OUT OF LIMITS" : "not understood"}.{" "}
          {recorded.judgement.message}
          {recorded.tool ? ` Taken with ${recorded.tool}.` : ""}
        </p>
      ) : null}
    </form>
  );
}

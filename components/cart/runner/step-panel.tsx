"use client";

import { CardNotice } from "@/components/card-notice";
import { StepMarkdown } from "@/components/step-markdown";
import type { CartData } from "@/lib/client/cart/store";
import { calculators } from "@/lib/domain/calc";
import { sortNotices } from "@/lib/domain/validation/cards";
import { StepNotes } from "./step-notes";
import { StepPhoto } from "./step-photo";
import { StepReading } from "./step-reading";
import { StepReferences } from "./step-references";
import { StepTimer } from "./step-timer";
import type { Act, PacketPages, StepDto, StepState } from "./use-run";

/** One step of the run: its notices first, the instruction, cited pages, and what the student records. */
export function StepPanel({
  number,
  total,
  step,
  state,
  locked,
  blocked,
  now,
  packet,
  packetPages,
  online,
  onAct,
  data,
  runId,
}: {
  number: number;
  total: number;
  step: StepDto;
  state: StepState;
  locked: boolean;
  blocked: number | null;
  now: number;
  packet: Blob | null;
  packetPages: PacketPages;
  online: boolean;
  onAct: Act;
  data: CartData;
  runId: string;
}) {
  const disabled = locked || blocked !== null;
  // A bought-off step stays as the instructor saw it (the fold ignores changes); notes still go.
  const frozen = disabled || !!state.boughtOff;

  return (
    <li className={`panel flex flex-col gap-4 border-l-8 ${state.checked ? "border-l-ok" : "border-l-line"}`} aria-label={`Step ${number}`}>
      <div className="flex flex-wrap items-center gap-2">
        <h2 className="mr-auto text-2xl font-bold">
          Step {number} <span className="text-base font-normal text-ink-soft">of {total}</span>
        </h2>
        {step.inspectionPoint ? <span className="badge bg-deck text-white">Inspection point: instructor buy-off</span> : null}
      </div>
      {blocked ? (
        <p role="note" className="rounded-md border-4 border-dashed border-deck px-4 py-3 font-semibold">
          Wait: step {blocked} is an inspection point. Your instructor buys it off before this step.
        </p>
      ) : null}
      {sortNotices(step.notices).map((n, j) => (
        <CardNotice key={j} kind={n.kind} text={n.text} />
      ))}
      {step.underRecheck ? (
        <p role="note" className="rounded-md border-4 border-dashed border-deck bg-teal-pale px-4 py-3 font-semibold">
          A newer manual revision changed a page this step cites. Ask your instructor before you go on.
        </p>
      ) : null}
      <div className="text-lg">
        <StepMarkdown text={step.text} />
      </div>

      {step.references.length ? (
        <StepReferences references={step.references} packet={packet} packetPages={packetPages} online={online} />
      ) : null}

      {step.calculator ? (
        <p>
          Calculator for this step:{" "}
          <a href={`/calculators/${step.calculator}`} className="font-semibold">
            {calculators[step.calculator].title}
          </a>
        </p>
      ) : null}

      {step.measurement ? (
        <StepReading number={number} stepId={step.id} measurement={step.measurement} recorded={state.value} frozen={frozen} onAct={onAct} />
      ) : null}

      {step.timerMinutes ? (
        <StepTimer
          number={number}
          stepId={step.id}
          minutes={step.timerMinutes}
          timer={state.timer}
          now={now}
          locked={locked}
          frozen={frozen}
          onAct={onAct}
          data={data}
          runId={runId}
        />
      ) : null}

      <StepNotes stepId={step.id} notes={state.notes} locked={locked} onAct={onAct} />

      <StepPhoto
        stepId={step.id}
        count={state.photos.length}
        disabled={locked || !!state.boughtOff}
        onAct={onAct}
        data={data}
        runId={runId}
      />

      {step.inspectionPoint && state.checked ? (
        <p role="note" className={`rounded-md px-4 py-3 font-semibold ${state.boughtOff ? "bg-ok-pale text-ok" : "border-4 border-deck"}`}>
          {state.boughtOff
            ? `Bought off ${state.boughtOff.at.slice(0, 16).replace("T", " ")}.`
            : "Waiting for buy-off: your instructor checks this step here at the cart or from the review queue."}
        </p>
      ) : null}

      <button
        type="button"
        aria-pressed={state.checked}
        className={`btn min-h-16 text-xl ${state.checked ? "btn-secondary" : "btn-primary"}`}
        disabled={frozen}
        onClick={() => void onAct(state.checked ? "step.unchecked" : "step.checked", { stepId: step.id })}
      >
        {state.checked ? `✓ Step ${number} done (tap to undo)` : `Mark step ${number} done`}
      </button>
    </li>
  );
}

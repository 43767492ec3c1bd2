"use client";

import { CardNotice } from "@/components/card-notice";
import { StepMarkdown } from "@/components/step-markdown";
import type { CartData } from "@/lib/client/cart/store";
import { useState } from "react";
import { CalculatorPanel } from "@/components/calculators/calculator-panel";
import { ResultPickContext } from "@/components/calculators/parts";
import { calculators } from "@/lib/domain/calc";
import { initialsOf } from "@/lib/domain/names";
import { clockIn, dateTimeIn } from "@/lib/domain/time";
import { cannotMarkDone } from "@/lib/domain/runs/fold";
import { sortNotices } from "@/lib/domain/validation/cards";
import type { RunToolsDto } from "@/lib/contracts/tools";
import { dayIn } from "@/lib/domain/time";
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
  lockedWhy,
  studentName,
  timeZone,
  blocked,
  now,
  packet,
  packetPages,
  online,
  onAct,
  data,
  runId,
  tools,
}: {
  number: number;
  total: number;
  step: StepDto;
  state: StepState;
  locked: boolean;
  /** Why the whole run takes no more work (handed in, signed off), said under each control it stops. */
  lockedWhy: string | null;
  studentName: string;
  timeZone: string;
  blocked: number | null;
  now: number;
  packet: Blob | null;
  packetPages: PacketPages;
  online: boolean;
  onAct: Act;
  data: CartData;
  runId: string;
  tools: RunToolsDto["checkedOut"];
}) {
  const disabled = locked || blocked !== null;
  // A bought-off step stays as the instructor saw it (the fold ignores changes); notes still go.
  const frozen = disabled || !!state.boughtOff;
  // Every control that cannot be used says why, in the order the student would fix it.
  const frozenWhy = locked
    ? lockedWhy
    : blocked !== null
      ? `Step ${blocked} waits for your instructor's buy-off first.`
      : state.boughtOff
        ? "Bought off: this step stays as your instructor saw it. You can still add a note."
        : null;
  const doneWhy = !state.checked ? cannotMarkDone(step, state) : null;
  const [reading, setReading] = useState("");

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

      {state.reopened && !state.checked ? (
        <p role="note" className="rounded-md border-4 border-danger bg-danger-pale px-4 py-3 font-semibold">
          {state.reopened.why === "new version"
            ? "This step changed in the card's new version your instructor moved you to: do it again"
            : "Your instructor sent this step back for rework: do it again"}
          {step.measurement ? " and record a new reading" : ""}
          {step.inspectionPoint ? ", then call them for a new buy-off" : ""}.
        </p>
      ) : null}

      {step.calculator ? (
        // Inside the run, offline too: the calculator is part of the cart's code, not a page to go to.
        <details className="rounded-md border-2 border-line bg-paper px-3 py-2">
          <summary className="flex min-h-11 cursor-pointer items-center font-semibold">
            Calculator for this step: {calculators[step.calculator].title}
          </summary>
          <div className="pt-3">
            <ResultPickContext.Provider value={step.measurement && !frozen ? setReading : null}>
              <CalculatorPanel slug={step.calculator} headingLevel={4} />
            </ResultPickContext.Provider>
          </div>
        </details>
      ) : null}

      {step.measurement ? (
        <StepReading
          number={number}
          stepId={step.id}
          measurement={step.measurement}
          recorded={state.value}
          frozen={frozen}
          why={frozenWhy}
          value={reading}
          setValue={setReading}
          onAct={onAct}
          calibratedTool={!!step.calibratedTool}
          tools={tools}
          today={dayIn(timeZone)}
        />
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
        <div
          role="note"
          className={`flex flex-col gap-3 rounded-md px-4 py-3 font-semibold ${state.boughtOff ? "bg-ok-pale text-ok" : "border-4 border-deck"}`}
        >
          {state.boughtOff ? (
            `Bought off ${dateTimeIn(timeZone, state.boughtOff.at)}.`
          ) : state.called ? (
            <span>
              You called your instructor at {clockIn(timeZone, state.called.at)}.{" "}
              {online ? "They have been told; wait here with the work open." : "They are told as soon as this cart is back online."}
            </span>
          ) : (
            <>
              <span>Waiting for buy-off: your instructor checks this step here at the aircraft before you go on.</span>
              <button
                type="button"
                className="btn btn-primary min-h-14 self-start text-lg"
                disabled={locked}
                onClick={() => void onAct("inspection.called", { stepId: step.id })}
              >
                Call my instructor to buy off step {number}
              </button>
            </>
          )}
        </div>
      ) : null}

      <button
        type="button"
        aria-pressed={state.checked}
        aria-describedby={frozenWhy || doneWhy ? `why-${step.id}` : undefined}
        className={`btn min-h-16 text-xl ${state.checked ? "btn-secondary" : "btn-primary"}`}
        disabled={frozen || !!doneWhy}
        onClick={() => void onAct(state.checked ? "step.unchecked" : "step.checked", { stepId: step.id })}
      >
        {state.checked ? `✓ Step ${number} done by ${initialsOf(studentName)} (tap to undo)` : `Mark step ${number} done`}
      </button>
      {frozenWhy || doneWhy ? (
        <p id={`why-${step.id}`} className={doneWhy && !frozenWhy ? "notice-error" : "hint"}>
          {frozenWhy ?? doneWhy}
        </p>
      ) : null}
    </li>
  );
}

"use client";

// The cart screen for one run: one step at a time (or the whole list), big targets, the notices
// before their step, values judged at once, notes, photos, timers, cited pages from the offline
// packet, and the inspection point that stops the run until an instructor buys it off. Every
// action is an event queued in IndexedDB and sent when the network allows (lib/client/cart/cart.ts).
import { useState } from "react";
import type { CartData } from "@/lib/client/cart/store";
import { HandIn } from "./hand-in";
import { RunAircraft } from "./run-aircraft";
import { RunHeader } from "./run-header";
import { RunMissing } from "./run-missing";
import { useStepKeys } from "./step-keys";
import { StepModeToggle, StepPager, type StepMode } from "./step-navigation";
import { StepPanel } from "./step-panel";
import { RefusedChanges, SyncNow } from "./sync-notices";
import { useNow, useRun } from "./use-run";

export function Runner({ data, runId, online }: { data: CartData; runId: string; online: boolean }) {
  const { detail, pending, packet, refused, state, act } = useRun(data, runId);
  const [mode, setMode] = useState<StepMode>("one");
  // ?step=N (from the offline search) opens that step; the runner only renders in the browser.
  const [index, setIndex] = useState(() => Math.max(0, Number(new URLSearchParams(window.location.search).get("step")) - 1 || 0));
  const now = useNow(!!state && Object.values(state.steps).some((s) => s.timer && !s.timer.stoppedAt));
  const steps = detail?.version.steps ?? [];
  useStepKeys({ enabled: mode === "one", count: steps.length, setIndex });

  if (detail === undefined) return <p role="status">Opening the card…</p>;
  if (detail === null || !state) return <RunMissing online={online} />;

  const version = detail.version;
  const locked = state.status === "submitted" || state.status === "signed_off";
  const waitingIndex = state.waitingAt ? steps.findIndex((s) => s.id === state.waitingAt) : -1;
  const allDone = steps.every((s) => state.steps[s.id]?.checked);
  const returned = [...detail.events, ...pending].filter((e) => e.type === "run.returned").at(-1);
  const shown = mode === "one" ? [steps[Math.min(index, steps.length - 1)]!].filter(Boolean) : steps;

  return (
    <article className="flex flex-col gap-5 pb-28" aria-label={`Run of ${version.title}`}>
      <RunHeader detail={detail} status={state.status} returned={returned} />

      <RunAircraft
        data={data}
        runId={runId}
        events={[...detail.events, ...pending]}
        act={act}
        stepId={mode === "one" ? (shown[0]?.id ?? null) : null}
        stepNumber={mode === "one" && shown[0] ? steps.indexOf(shown[0]) + 1 : null}
        locked={state.status === "signed_off"}
        online={online}
      />

      <StepModeToggle mode={mode} onMode={setMode} done={steps.filter((s) => state.steps[s.id]?.checked).length} total={steps.length} />

      <RefusedChanges refused={refused} />

      <ol className="flex flex-col gap-5" aria-label="Steps">
        {shown.map((step) => {
          const i = steps.indexOf(step);
          const blocked = waitingIndex >= 0 && i > waitingIndex;
          return (
            <StepPanel
              key={step.id}
              number={i + 1}
              total={steps.length}
              step={step}
              state={state.steps[step.id]!}
              locked={locked}
              lockedWhy={
                state.status === "signed_off"
                  ? "Signed off: the record cannot change."
                  : state.status === "submitted"
                    ? "Waiting for inspection: your instructor reviews it now. Nothing changes until it is signed off or sent back for rework."
                    : null
              }
              studentName={detail.run.studentName}
              timeZone={detail.timeZone ?? "UTC"}
              blocked={blocked ? waitingIndex + 1 : null}
              now={now}
              packet={packet}
              packetPages={detail.packet?.pages ?? []}
              online={online}
              onAct={act}
              data={data}
              runId={runId}
              tools={detail.tools?.checkedOut ?? []}
            />
          );
        })}
      </ol>

      {mode === "one" && steps.length > 1 ? <StepPager index={index} total={steps.length} onIndex={setIndex} /> : null}

      {!locked ? (
        <HandIn
          waitingIndex={waitingIndex}
          allDone={allDone}
          holds={detail.tools?.holds ?? []}
          onHandIn={() => void act("run.submitted")}
        />
      ) : null}
      {!online ? <p className="hint">Offline: everything you do is kept on this laptop and sent when the network is back.</p> : null}
      <SyncNow data={data} online={online} />
    </article>
  );
}

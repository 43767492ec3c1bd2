"use client";

// The cart screen for one run: one step at a time (or the whole list), big targets, the notices
// before their step, values judged at once, notes, photos, timers, cited pages from the offline
// packet, and the inspection point that stops the run until an instructor buys it off. Every
// action is an event queued in IndexedDB and sent when the network allows (lib/client/cart/cart.ts).
import dynamic from "next/dynamic";
import { useCallback, useEffect, useMemo, useState } from "react";
import { CardNotice } from "@/components/card-notice";
import { LimitCheckField } from "@/components/limit-check-field";
import { StepMarkdown } from "@/components/step-markdown";
import { calculators } from "@/lib/domain/calc";
import { describeLimit } from "@/lib/domain/calc/limits";
import { record, refreshRun, syncer } from "@/lib/client/cart/cart";
import type { CartData, RefusedItem } from "@/lib/client/cart/store";
import type { RunDetailDto } from "@/lib/contracts/runs";
import { foldRun, type RunEvent, type RunEventType } from "@/lib/domain/runs/fold";
import { sortNotices } from "@/lib/domain/validation/cards";
import { maxPhotoBytes, photoTypes } from "@/lib/domain/validation/runs";
import { formatLeft } from "./timer-watch";

const PacketPage = dynamic(() => import("./packet-page"), { ssr: false, loading: () => <p role="status">Opening the page…</p> });

const statusText: Record<string, string> = {
  not_started: "Not started",
  in_progress: "In progress",
  submitted: "Handed in: waiting for your instructor",
  returned: "Returned: see your instructor's comment",
  signed_off: "Signed off",
};

function useNow(active: boolean) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (!active) return;
    const id = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(id);
  }, [active]);
  return now;
}

export function Runner({ data, runId, online }: { data: CartData; runId: string; online: boolean }) {
  const [detail, setDetail] = useState<RunDetailDto | null | undefined>(undefined);
  const [pending, setPending] = useState<RunEvent[]>([]);
  const [packet, setPacket] = useState<Blob | null>(null);
  const [mode, setMode] = useState<"one" | "all">("one");
  // ?step=N (from the offline search) opens that step; the runner only renders in the browser.
  const [index, setIndex] = useState(() => Math.max(0, Number(new URLSearchParams(window.location.search).get("step")) - 1 || 0));
  const [refused, setRefused] = useState<RefusedItem[]>([]);

  const load = useCallback(
    () =>
      Promise.all([data.run(runId), data.pending(), data.packet(runId), data.refused()]).then(([stored, queued, blob, refused]) => {
        setRefused(refused.filter((r) => r.runId === runId));
        setDetail(stored ?? null);
        setPending(queued.filter((p) => p.runId === runId).map((p) => ({ ...p.event, userId: data.userId, type: p.event.type as RunEventType })));
        setPacket((old) => old ?? blob ?? null); // a new Blob each read would reload the page view
      }),
    [data, runId],
  );

  useEffect(() => {
    void load();
    // Fresh from the server when it answers; what is stored otherwise.
    void refreshRun(data, runId).then(load, () => undefined);
    return data.onChange(() => void load());
  }, [data, runId, load]);

  const state = useMemo(() => {
    if (!detail) return null;
    const steps = detail.version.steps.map((s) => ({ id: s.id, inspectionPoint: s.inspectionPoint, measurement: s.measurement, timerMinutes: s.timerMinutes }));
    return foldRun([...detail.events, ...pending], steps, new Set(detail.reviewers));
  }, [detail, pending]);

  const now = useNow(!!state && Object.values(state.steps).some((s) => s.timer && !s.timer.stoppedAt));

  const act = useCallback(
    async (type: RunEventType, options: { stepId?: string | null; payload?: Record<string, unknown> } = {}) => {
      if (!detail) return;
      await record(data, detail, type, options);
    },
    [data, detail],
  );

  const steps = detail?.version.steps ?? [];
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const target = e.target as HTMLElement | null;
      if (mode !== "one" || target?.closest("input, textarea, select, [contenteditable]")) return;
      if (e.key === "ArrowRight" || e.key === "PageDown") setIndex((i) => Math.min(steps.length - 1, i + 1));
      if (e.key === "ArrowLeft" || e.key === "PageUp") setIndex((i) => Math.max(0, i - 1));
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [mode, steps.length]);

  if (detail === undefined) return <p role="status">Opening the card…</p>;
  if (detail === null || !state) {
    return (
      <div className="notice-error">
        <p className="font-semibold">This run is not stored on this laptop.</p>
        <p>{online ? "It is not one of your runs." : "Connect to the network once with this run open, then it works offline."}</p>
        <a href="/cart" className="btn btn-secondary mt-2">
          Back to my work
        </a>
      </div>
    );
  }

  const version = detail.version;
  const locked = state.status === "submitted" || state.status === "signed_off";
  const waitingIndex = state.waitingAt ? steps.findIndex((s) => s.id === state.waitingAt) : -1;
  const allDone = steps.every((s) => state.steps[s.id]?.checked);
  const returned = [...detail.events, ...pending].filter((e) => e.type === "run.returned").at(-1);
  const shown = mode === "one" ? [steps[Math.min(index, steps.length - 1)]!].filter(Boolean) : steps;

  return (
    <article className="flex flex-col gap-5 pb-28" aria-label={`Run of ${version.title}`}>
      <header className="flex flex-col gap-1">
        <p className="text-sm font-bold uppercase tracking-wider text-ink-soft">Task card · version {version.number}</p>
        <h1 className="text-3xl">{version.title}</h1>
        <p className="text-ink-soft">
          {[detail.run.dueOn ? `Due ${detail.run.dueOn}` : null, detail.run.note || null, version.estimatedMinutes ? `About ${version.estimatedMinutes} min` : null].filter(Boolean).join(" · ")}
        </p>
        <p>
          <span data-testid="run-status" className={`badge text-base ${state.status === "signed_off" ? "bg-ok-pale text-ok" : state.status === "returned" ? "bg-danger-pale text-danger" : "bg-teal-pale text-teal-dark"}`}>
            {statusText[state.status]}
          </span>
        </p>
      </header>

      {detail.run.newerVersion ? (
        <p role="note" className="rounded-md border-4 border-dashed border-deck bg-teal-pale px-4 py-3 font-semibold">
          Version {detail.run.newerVersion} of this card is published. This assignment uses version {version.number}, as it was given; ask your instructor before you switch.
        </p>
      ) : null}
      {returned && state.status !== "signed_off" ? (
        <div role="note" aria-label="Instructor's comment" className="rounded-md border-4 border-danger bg-danger-pale px-4 py-3">
          <p className="font-bold">Returned by your instructor</p>
          <p className="whitespace-pre-line text-lg">{String(returned.payload?.comment ?? "")}</p>
        </div>
      ) : null}
      {detail.signOff ? (
        <p role="note" className="rounded-md border-4 border-ok bg-ok-pale px-4 py-3 text-lg font-semibold">
          Signed off by {detail.signOff.instructorName} on {detail.signOff.signedAt.slice(0, 10)}.{detail.signOff.comment ? ` “${detail.signOff.comment}”` : ""}
        </p>
      ) : null}

      <div className="grid gap-3 sm:grid-cols-3">
        {[["Protective equipment", version.protectiveEquipment], ["Tools", version.tools], ["Consumables", version.consumables]].map(([title, items]) =>
          (items as string[]).length ? (
            <section key={title as string} aria-label={title as string} className="panel">
              <h2 className="text-lg font-bold">{title as string}</h2>
              <ul className="ml-5 list-disc">
                {(items as string[]).map((item) => (
                  <li key={item}>{item}</li>
                ))}
              </ul>
            </section>
          ) : null,
        )}
      </div>

      <div className="flex flex-wrap items-center gap-2" role="group" aria-label="How to show the steps">
        <button type="button" className={`btn ${mode === "one" ? "btn-primary" : "btn-secondary"}`} aria-pressed={mode === "one"} onClick={() => setMode("one")}>
          One step at a time
        </button>
        <button type="button" className={`btn ${mode === "all" ? "btn-primary" : "btn-secondary"}`} aria-pressed={mode === "all"} onClick={() => setMode("all")}>
          All steps
        </button>
        <span className="ml-auto text-ink-soft">
          {steps.filter((s) => state.steps[s.id]?.checked).length} of {steps.length} steps done
        </span>
      </div>

      {refused.length ? (
        <div role="alert" className="notice-error">
          <p className="font-semibold">
            The school&apos;s server refused {refused.length} {refused.length === 1 ? "change" : "changes"} made on this laptop: {refused.at(-1)!.reason}
          </p>
          <p>Tell your instructor; those changes are not part of the run.</p>
        </div>
      ) : null}

      <ol className="flex flex-col gap-5" aria-label="Steps">
        {shown.map((step) => {
          const i = steps.indexOf(step);
          const s = state.steps[step.id]!;
          const blocked = waitingIndex >= 0 && i > waitingIndex;
          return (
            <StepPanel
              key={step.id}
              number={i + 1}
              total={steps.length}
              step={step}
              state={s}
              locked={locked}
              blocked={blocked ? waitingIndex + 1 : null}
              now={now}
              packet={packet}
              packetPages={detail.packet?.pages ?? []}
              online={online}
              onAct={act}
              data={data}
              runId={runId}
            />
          );
        })}
      </ol>

      {mode === "one" && steps.length > 1 ? (
        <nav aria-label="Steps" className="flex items-center gap-3">
          <button type="button" className="btn btn-secondary min-w-40 text-lg" disabled={index === 0} onClick={() => setIndex((n) => Math.max(0, n - 1))}>
            ← Previous step
          </button>
          <span className="mx-auto font-semibold">
            Step {Math.min(index, steps.length - 1) + 1} of {steps.length}
          </span>
          <button type="button" className="btn btn-primary min-w-40 text-lg" disabled={index >= steps.length - 1} onClick={() => setIndex((n) => Math.min(steps.length - 1, n + 1))}>
            Next step →
          </button>
        </nav>
      ) : null}

      {!locked ? (
        <section aria-label="Hand in" className="panel flex flex-col gap-2">
          <h2 className="text-xl font-bold">Hand in</h2>
          {waitingIndex >= 0 ? (
            <p>Step {waitingIndex + 1} is an inspection point: your instructor buys it off before you go on.</p>
          ) : allDone ? (
            <p>Every step is done. Hand the run in for your instructor&apos;s sign-off.</p>
          ) : (
            <p>Finish every step to hand the run in.</p>
          )}
          <button type="button" className="btn btn-primary self-start text-lg" disabled={!allDone || waitingIndex >= 0} onClick={() => void act("run.submitted")}>
            Hand in for sign-off
          </button>
        </section>
      ) : null}
      {!online ? <p className="hint">Offline: everything you do is kept on this laptop and sent when the network is back.</p> : null}
      <SyncNow data={data} online={online} />
    </article>
  );
}

function SyncNow({ data, online }: { data: CartData; online: boolean }) {
  if (!online) return null;
  return (
    <button type="button" className="btn btn-secondary self-start" onClick={() => void syncer(data).now()}>
      Send waiting changes now
    </button>
  );
}

type StepDto = RunDetailDto["version"]["steps"][number];
type StepState = ReturnType<typeof foldRun>["steps"][string];

function StepPanel({
  number, total, step, state, locked, blocked, now, packet, packetPages, online, onAct, data, runId,
}: {
  number: number;
  total: number;
  step: StepDto;
  state: StepState;
  locked: boolean;
  blocked: number | null;
  now: number;
  packet: Blob | null;
  packetPages: NonNullable<RunDetailDto["packet"]>["pages"];
  online: boolean;
  onAct: (type: RunEventType, options?: { stepId?: string | null; payload?: Record<string, unknown> }) => Promise<void>;
  data: CartData;
  runId: string;
}) {
  const [value, setValue] = useState("");
  const [note, setNote] = useState("");
  const [openPage, setOpenPage] = useState<number | null>(null);
  // Shown beside the photo field, where the student is looking, not at the top of the card.
  const [photoProblem, setPhotoProblem] = useState<string | null>(null);
  const disabled = locked || blocked !== null;
  // A bought-off step stays as the instructor saw it (the fold ignores changes); notes still go.
  const frozen = disabled || !!state.boughtOff;
  const timerLeft = state.timer && !state.timer.stoppedAt ? Date.parse(state.timer.startedAt) + state.timer.minutes * 60_000 - now : null;

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
        <div className="flex flex-col gap-2">
          <h3 className="font-semibold">Manual pages</h3>
          <div className="flex flex-wrap gap-2">
            {step.references.map((r) => {
              const inPacket = packetPages.find((p) => p.revisionId === r.revisionId && p.page === r.page);
              const key = inPacket?.packetPage ?? -r.page;
              return packet && inPacket ? (
                <button key={key} type="button" className="btn btn-secondary" aria-expanded={openPage === key} onClick={() => setOpenPage(openPage === key ? null : key)}>
                  {openPage === key ? "Hide" : "Show"} page {r.page} · {r.manualTitle}, {r.revisionLabel}
                </button>
              ) : online ? (
                <a key={key} className="btn btn-secondary" href={`/library/${r.manualId}/${r.revisionId}/${r.page}`}>
                  Open page {r.page} · {r.manualTitle}, {r.revisionLabel}
                </a>
              ) : (
                <span key={key} className="hint">
                  Page {r.page} of {r.manualTitle} is not stored on this laptop.
                </span>
              );
            })}
          </div>
          {packet && openPage && openPage > 0 ? <PacketPage file={packet} page={openPage} label={`Cited manual page`} /> : null}
        </div>
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
        <form
          className="flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (!value.trim()) return;
            void onAct("value.recorded", { stepId: step.id, payload: { value: value.trim() } }).then(() => setValue(""));
          }}
        >
          <LimitCheckField id={`value-${step.id}`} label={`${step.measurement.label} (limits ${describeLimit(step.measurement)})`} limit={step.measurement} value={value} onChange={setValue} />
          <button type="submit" className="btn btn-secondary self-start" disabled={frozen || !value.trim()}>
            Record this reading
          </button>
          {state.value ? (
            <p data-testid={`recorded-${number}`} className={state.value.judgement.status === "in" ? "notice-ok" : "notice-error"}>
              Recorded {state.value.text}: {state.value.judgement.status === "in" ? "within limits" : state.value.judgement.status === "out" ? "OUT OF LIMITS" : "not understood"}. {state.value.judgement.message}
            </p>
          ) : null}
        </form>
      ) : null}

      {step.timerMinutes ? (
        <div className="flex flex-wrap items-center gap-3">
          {timerLeft !== null ? (
            <>
              <span role="timer" aria-live="off" className={`text-3xl font-bold tabular-nums ${timerLeft <= 0 ? "text-danger" : ""}`}>
                {timerLeft <= 0 ? "Time is up" : formatLeft(timerLeft)}
              </span>
              <button type="button" className="btn btn-secondary" disabled={locked} onClick={() => void onAct("timer.stopped", { stepId: step.id }).then(() => data.setTimers((t) => t.filter((x) => !(x.runId === runId && x.stepId === step.id))))}>
                Stop timer
              </button>
            </>
          ) : (
            <button
              type="button"
              className="btn btn-secondary"
              disabled={frozen}
              onClick={async () => {
                await onAct("timer.started", { stepId: step.id, payload: { minutes: step.timerMinutes } });
                await data.setTimers((t) => [...t.filter((x) => !(x.runId === runId && x.stepId === step.id)), { runId, stepId: step.id, label: `step ${number} (${step.timerMinutes} min)`, endsAt: Date.now() + step.timerMinutes! * 60_000 }]);
              }}
            >
              Start the {step.timerMinutes} min timer
            </button>
          )}
          {state.timer?.stoppedAt ? <span className="hint">Timer stopped.</span> : null}
        </div>
      ) : null}

      <div className="flex flex-col gap-2">
        <label htmlFor={`note-${step.id}`} className="label">
          Note on this step
        </label>
        <textarea id={`note-${step.id}`} className="input min-h-20" value={note} maxLength={2000} onChange={(e) => setNote(e.target.value)} disabled={locked} />
        <button type="button" className="btn btn-secondary self-start" disabled={locked || !note.trim()} onClick={() => void onAct("note.added", { stepId: step.id, payload: { text: note.trim() } }).then(() => setNote(""))}>
          Add note
        </button>
        {state.notes.length ? (
          <ul className="flex flex-col gap-1" aria-label="Notes">
            {state.notes.map((n, j) => (
              <li key={j} className="rounded border border-line bg-paper px-3 py-2">
                {n.text}
              </li>
            ))}
          </ul>
        ) : null}
      </div>

      <div className="flex flex-col gap-1">
        <label htmlFor={`photo-${step.id}`} className="label">
          Photo of the work {state.photos.length ? `(${state.photos.length} added)` : ""}
        </label>
        <input
          id={`photo-${step.id}`}
          type="file"
          accept={photoTypes.join(",")}
          capture="environment"
          className="input"
          disabled={locked || !!state.boughtOff}
          onChange={async (e) => {
            const file = e.target.files?.[0];
            e.target.value = "";
            setPhotoProblem(null);
            if (!file) return;
            if (!(photoTypes as readonly string[]).includes(file.type)) return setPhotoProblem("Only JPEG, PNG or WebP pictures can be added.");
            if (file.size > maxPhotoBytes) return setPhotoProblem(`That picture is ${(file.size / 1048576).toFixed(1)} MB; at most ${maxPhotoBytes / 1048576} MB. Take it at a lower resolution.`);
            const photoId = crypto.randomUUID();
            await data.queuePhoto({ photoId, runId, stepId: step.id, type: file.type, blob: file });
            await onAct("photo.added", { stepId: step.id, payload: { key: photoId } });
          }}
        />
        {photoProblem ? (
          <p role="alert" className="notice-error">
            {photoProblem}
          </p>
        ) : null}
      </div>

      {step.inspectionPoint && state.checked ? (
        <p role="note" className={`rounded-md px-4 py-3 font-semibold ${state.boughtOff ? "bg-ok-pale text-ok" : "border-4 border-deck"}`}>
          {state.boughtOff ? `Bought off ${state.boughtOff.at.slice(0, 16).replace("T", " ")}.` : "Waiting for buy-off: your instructor checks this step here at the cart or from the review queue."}
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

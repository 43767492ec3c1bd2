"use client";

import { useState } from "react";
import { ElementPicker } from "./element-picker";
import { useFieldArray, useWatch, type Control, type UseFormRegister, type UseFormSetValue } from "react-hook-form";
import { calculators, calculatorSlugs } from "@/lib/domain/calc";
import { allUnits, parseNumber, unitLabel } from "@/lib/domain/calc/units";
import { noticeKinds, noticeLabels } from "@/lib/domain/validation/cards";
import type { CardForm } from "./card-form";

export interface ManualOption {
  manualId: string;
  title: string;
  revisionId: string;
  label: string;
  pageCount: number | null;
}

interface Props {
  index: number;
  count: number;
  control: Control<CardForm>;
  register: UseFormRegister<CardForm>;
  setValue: UseFormSetValue<CardForm>;
  manuals: ManualOption[];
  onMove: (from: number, to: number) => void;
  onRemove: () => void;
  onCiteFromReader: (stepId: string) => void;
  /** What this step still needs before the card can be published (from the last save). */
  problems: string[];
}

/** A number field's text that is not a number is kept as typed but not saved as one: say so beside it. */
function NumberHint({ text }: { text: string }) {
  if (!text.trim() || parseNumber(text) !== null) return null;
  return <span className="field-error">Not a number yet: write it as 12.5, 3/8 or 1 1/2.</span>;
}

/** One step of the editor: its notices, instruction, references, measurement and options. */
export function StepEditor({ index, count, control, register, setValue, manuals, onMove, onRemove, onCiteFromReader, problems }: Props) {
  const n = index + 1;
  const notices = useFieldArray({ control, name: `steps.${index}.notices` });
  const references = useFieldArray({ control, name: `steps.${index}.references` });
  const step = useWatch({ control, name: `steps.${index}` });
  // The picker starts at the manual this step already cites, if it is in the list.
  const citedRevision = step.references.find((r) => manuals.some((m) => m.revisionId === r.revisionId))?.revisionId;
  const [pick, setPick] = useState({ revisionId: citedRevision ?? manuals[0]?.revisionId ?? "", page: "", quote: "" });
  const [pickError, setPickError] = useState("");

  const addReference = () => {
    const manual = manuals.find((m) => m.revisionId === pick.revisionId);
    const page = Number(pick.page);
    if (!manual) return setPickError("Choose a manual.");
    if (!Number.isInteger(page) || page < 1 || (manual.pageCount !== null && page > manual.pageCount)) {
      return setPickError(`Give a page from 1 to ${manual.pageCount ?? "the last page"}.`);
    }
    if (step.references.some((r) => r.revisionId === manual.revisionId && r.page === page))
      return setPickError("That page is already cited on this step.");
    references.append({
      revisionId: manual.revisionId,
      page,
      quote: pick.quote.trim(),
      manualId: manual.manualId,
      manualTitle: manual.title,
      revisionLabel: manual.label,
      current: true,
    });
    setPick({ ...pick, page: "", quote: "" });
    setPickError("");
  };

  const id = (what: string) => `step-${step.uid}-${what}`;
  return (
    <fieldset className="panel flex flex-col gap-4" aria-label={`Step ${n}`}>
      <legend className="sr-only">Step {n}</legend>
      <div className="flex flex-wrap items-center gap-2">
        <h3 className="mr-auto text-xl font-bold" id={id("heading")}>
          Step {n}
        </h3>
        <button
          type="button"
          className="btn btn-secondary btn-small"
          disabled={index === 0}
          onClick={() => onMove(index, index - 1)}
          aria-label={`Move step ${n} up`}
        >
          ↑ Up
        </button>
        <button
          type="button"
          className="btn btn-secondary btn-small"
          disabled={index === count - 1}
          onClick={() => onMove(index, index + 1)}
          aria-label={`Move step ${n} down`}
        >
          ↓ Down
        </button>
        <button type="button" className="btn btn-danger btn-small" onClick={onRemove} aria-label={`Remove step ${n}`}>
          Remove
        </button>
      </div>
      {problems.length ? (
        <ul className="notice-todo list-none" aria-label={`To finish on step ${n} before publishing`}>
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}

      <section className="flex flex-col gap-2" aria-label={`Notices of step ${n}`}>
        <p className="hint">
          WARNING: can injure or kill. CAUTION: can damage equipment. NOTE: information. Shown before the step, in that order.
        </p>
        {notices.fields.map((field, j) => (
          <div key={field.id} className="flex flex-wrap items-start gap-2 rounded-md border-2 border-line p-2">
            <label className="field w-40">
              <span className="label">Kind</span>
              <select className="input" {...register(`steps.${index}.notices.${j}.kind`)}>
                {noticeKinds.map((k) => (
                  <option key={k} value={k}>
                    {noticeLabels[k]}
                  </option>
                ))}
              </select>
            </label>
            <label className="field min-w-64 flex-1">
              <span className="label">Notice text</span>
              <textarea className="input min-h-20" {...register(`steps.${index}.notices.${j}.text`)} />
            </label>
            <button
              type="button"
              className="btn btn-danger btn-small self-end"
              onClick={() => notices.remove(j)}
              aria-label={`Remove notice ${j + 1} of step ${n}`}
            >
              Remove
            </button>
          </div>
        ))}
        <div className="flex flex-wrap gap-2">
          {noticeKinds.map((k) => (
            <button key={k} type="button" className="btn btn-secondary btn-small" onClick={() => notices.append({ kind: k, text: "" })}>
              + {noticeLabels[k]}
            </button>
          ))}
        </div>
      </section>

      <div className="field">
        <label className="label" htmlFor={id("text")}>
          Instruction
        </label>
        <span className="hint" id={id("text-hint")}>
          Markdown: **bold**, lists with “- ”, links as [text](https://…). No HTML.
        </span>
        <textarea id={id("text")} className="input min-h-28" aria-describedby={id("text-hint")} {...register(`steps.${index}.text`)} />
      </div>

      <section className="flex flex-col gap-2" aria-label={`Manual pages of step ${n}`}>
        <h4 className="font-semibold">Manual pages</h4>
        {references.fields.length === 0 ? <p className="hint">No page cited yet.</p> : null}
        <ul className="flex flex-col gap-1">
          {references.fields.map((cited, j) => (
            <li key={cited.id} className="flex flex-wrap items-center gap-2">
              <span>
                {cited.manualTitle}, {cited.revisionLabel}, page {cited.page}
                {cited.quote ? <q className="ml-2 text-ink-soft">{cited.quote}</q> : null}
              </span>
              {cited.current ? null : <span className="badge bg-danger-pale text-danger">superseded revision</span>}
              <button
                type="button"
                className="btn btn-danger btn-small"
                onClick={() => references.remove(j)}
                aria-label={`Remove page ${cited.page} from step ${n}`}
              >
                Remove
              </button>
            </li>
          ))}
        </ul>
        <div className="flex flex-wrap items-end gap-2 rounded-md bg-teal-pale p-2">
          <label className="field">
            <span className="label">Manual</span>
            <select className="input max-w-96" value={pick.revisionId} onChange={(e) => setPick({ ...pick, revisionId: e.target.value })}>
              {manuals.map((m) => (
                <option key={m.revisionId} value={m.revisionId}>
                  {m.title} ({m.label})
                </option>
              ))}
            </select>
          </label>
          <label className="field w-28">
            <span className="label">Page</span>
            <input className="input" inputMode="numeric" value={pick.page} onChange={(e) => setPick({ ...pick, page: e.target.value })} />
          </label>
          <label className="field min-w-48 flex-1">
            <span className="label">Quoted words (optional)</span>
            <input className="input" value={pick.quote} onChange={(e) => setPick({ ...pick, quote: e.target.value })} />
          </label>
          <button type="button" className="btn btn-secondary" onClick={addReference}>
            Add page
          </button>
          <button type="button" className="btn btn-secondary" onClick={() => onCiteFromReader(step.uid)}>
            Find it in the library…
          </button>
          <p className="field-error w-full" aria-live="polite">
            {pickError}
          </p>
        </div>
      </section>

      <section className="flex flex-col gap-2" aria-label={`Measured value of step ${n}`}>
        <label className="flex min-h-11 items-center gap-3 font-semibold">
          <input type="checkbox" className="h-6 w-6" {...register(`steps.${index}.hasMeasurement`)} />
          The student records a measured value
        </label>
        {step.hasMeasurement ? (
          <div className="grid gap-3 rounded-md border-2 border-line p-3 sm:grid-cols-3">
            <label className="field sm:col-span-2">
              <span className="label">What is measured</span>
              <input className="input" {...register(`steps.${index}.measurement.label`)} />
            </label>
            <label className="field">
              <span className="label">Unit</span>
              <select className="input" {...register(`steps.${index}.measurement.unit`)}>
                {allUnits.map((u) => (
                  <option key={u} value={u}>
                    {unitLabel(u)}
                  </option>
                ))}
              </select>
            </label>
            <fieldset className="sm:col-span-3">
              <legend className="label">Limits as</legend>
              <div className="flex flex-wrap gap-4">
                <label className="flex min-h-11 items-center gap-2">
                  <input type="radio" value="range" className="h-5 w-5" {...register(`steps.${index}.measurement.mode`)} /> minimum and
                  maximum
                </label>
                <label className="flex min-h-11 items-center gap-2">
                  <input type="radio" value="tolerance" className="h-5 w-5" {...register(`steps.${index}.measurement.mode`)} /> nominal ±
                  tolerance
                </label>
              </div>
            </fieldset>
            {step.measurement.mode === "range" ? (
              <>
                <label className="field">
                  <span className="label">Minimum</span>
                  <input className="input" inputMode="decimal" {...register(`steps.${index}.measurement.min`)} />
                  <NumberHint text={step.measurement.min} />
                </label>
                <label className="field">
                  <span className="label">Maximum</span>
                  <input className="input" inputMode="decimal" {...register(`steps.${index}.measurement.max`)} />
                  <NumberHint text={step.measurement.max} />
                </label>
              </>
            ) : (
              <>
                <label className="field">
                  <span className="label">Nominal</span>
                  <input className="input" inputMode="decimal" {...register(`steps.${index}.measurement.nominal`)} />
                  <NumberHint text={step.measurement.nominal} />
                </label>
                <label className="field">
                  <span className="label">± Tolerance</span>
                  <input className="input" inputMode="decimal" {...register(`steps.${index}.measurement.tolerance`)} />
                  <NumberHint text={step.measurement.tolerance} />
                </label>
              </>
            )}
          </div>
        ) : null}
      </section>

      <div className="grid gap-3 sm:grid-cols-3">
        <label className="field">
          <span className="label">Calculator</span>
          <select className="input" {...register(`steps.${index}.calculator`)}>
            <option value="">None</option>
            {calculatorSlugs.map((s) => (
              <option key={s} value={s}>
                {calculators[s].title}
              </option>
            ))}
          </select>
        </label>
        <label className="field">
          <span className="label">Timer (minutes)</span>
          <input className="input" inputMode="decimal" placeholder="none" {...register(`steps.${index}.timerMinutes`)} />
        </label>
        <label className="flex min-h-11 items-center gap-3 self-end font-semibold">
          <input
            type="checkbox"
            className="h-6 w-6"
            checked={step.inspectionPoint}
            onChange={(e) => setValue(`steps.${index}.inspectionPoint`, e.target.checked, { shouldDirty: true })}
          />
          Inspection point (instructor buy-off)
        </label>
        {step.hasMeasurement ? (
          <label className="flex min-h-11 items-center gap-3 self-end font-semibold">
            <input
              type="checkbox"
              className="h-6 w-6"
              checked={step.calibratedTool}
              onChange={(e) => setValue(`steps.${index}.calibratedTool`, e.target.checked, { shouldDirty: true })}
            />
            Taken with a calibrated tool (the cart asks which one)
          </label>
        ) : null}
        <ElementPicker
          id={`step-${n}-elements`}
          value={step.elements}
          onChange={(codes) => setValue(`steps.${index}.elements`, codes, { shouldDirty: true })}
          problem={problems.find((p) => /element code/.test(p))}
        />
      </div>
    </fieldset>
  );
}

"use client";

import { createContext, useContext, useId, type ReactNode } from "react";
import { parseNumber } from "@/lib/domain/calc/units";

/** A number field that takes decimals and shop fractions ("0.040", "1/8", "1 1/4"). */
export function NumberField({
  label,
  value,
  onChange,
  unit,
  hint,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  unit?: string;
  hint?: string;
}) {
  const id = useId();
  const bad = value.trim() !== "" && parseNumber(value) === null;
  return (
    <div className="field">
      <label htmlFor={id} className="label">
        {label}
        {unit ? <span className="font-normal text-ink-soft"> ({unit})</span> : null}
      </label>
      {hint ? (
        <span id={`${id}-hint`} className="hint">
          {hint}
        </span>
      ) : null}
      <input
        id={id}
        className="input max-w-48 text-lg"
        inputMode="decimal"
        autoComplete="off"
        value={value}
        aria-invalid={bad}
        aria-describedby={[hint ? `${id}-hint` : "", `${id}-error`].join(" ").trim()}
        onChange={(e) => onChange(e.target.value)}
      />
      <span id={`${id}-error`} className="field-error" aria-live="polite">
        {bad ? "Type a number, such as 0.040 or 1/8." : ""}
      </span>
    </div>
  );
}

export function SelectField<T extends string>({
  label,
  value,
  onChange,
  options,
}: {
  label: string;
  value: T;
  onChange: (v: T) => void;
  options: [T, string][];
}) {
  const id = useId();
  return (
    <div className="field">
      <label htmlFor={id} className="label">
        {label}
      </label>
      <select id={id} className="input w-full max-w-md" value={value} onChange={(e) => onChange(e.target.value as T)}>
        {options.map(([v, text]) => (
          <option key={v} value={v}>
            {text}
          </option>
        ))}
      </select>
    </div>
  );
}

export const num = (v: string): number | null => (v.trim() === "" ? null : parseNumber(v));

/** The result rows, with what went wrong first, then the warnings, then notes that go with the result. */
/**
 * Set where a calculator runs inside a step of a run: each plain result gets a button that puts it
 * into the step's reading, so nobody copies a number by hand from one screen to another.
 */
export const ResultPickContext = createContext<((value: string) => void) | null>(null);

export function Results({
  rows,
  warnings = [],
  notes = [],
  error,
}: {
  rows: [string, ReactNode, string?][];
  warnings?: string[];
  notes?: string[];
  error?: string | null;
}) {
  const pick = useContext(ResultPickContext);
  return (
    <div aria-live="polite" className="flex flex-col gap-2">
      {error ? <p className="notice-error">{error}</p> : null}
      {warnings.map((w) => (
        <p key={w} className="notice-error">
          {w}
        </p>
      ))}
      {rows.length
        ? notes.map((n) => (
            <p key={n} className="border-l-[6px] border-ink-soft bg-panel px-3 py-2">
              {n}
            </p>
          ))
        : null}
      {rows.length ? (
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 rounded-md bg-teal-pale p-3">
          {rows.map(([label, value, formula]) => (
            <div key={label} className="contents">
              <dt className="font-semibold">{label}</dt>
              <dd>
                <span className="text-lg font-bold">{value}</span>
                {formula ? <span className="ml-2 text-sm text-ink-soft">{formula}</span> : null}
                {pick && typeof value === "string" ? (
                  <button type="button" className="btn btn-secondary btn-small ml-2" onClick={() => pick(value)}>
                    Put into the reading
                  </button>
                ) : null}
              </dd>
            </div>
          ))}
        </dl>
      ) : null}
    </div>
  );
}

/** Runs a calculation and turns its refusal (AppError "invalid", lib/domain/calc/units.ts `refuse`) into a message instead of a crash. */
export function attempt<T>(fn: () => T): { value: T | null; error: string | null } {
  try {
    return { value: fn(), error: null };
  } catch (error) {
    return { value: null, error: error instanceof Error ? error.message : "That cannot be calculated." };
  }
}

"use client";

import { useId, useState } from "react";
import { judgeValue, type Limit } from "@/lib/domain/calc/limits";
import { dimensionOf, unitLabel, unitsOf } from "@/lib/domain/calc/units";

/** A measured value judged against its limits as it is typed, in any unit of the same kind. */
export function LimitCheckField({
  id,
  label,
  limit,
  value,
  onChange,
}: {
  id?: string;
  label: string;
  limit: Limit;
  value?: string;
  onChange?: (v: string) => void;
}) {
  const ownId = useId();
  const inputId = id ?? ownId;
  const [own, setOwn] = useState("");
  const text = value ?? own;
  const dimension = dimensionOf(limit.unit);
  const other = dimension ? unitsOf(dimension).find((u) => u !== limit.unit) : undefined;
  const judgement = text.trim() ? judgeValue(text, limit) : null;
  const tone = judgement?.status === "in" ? "notice-ok" : judgement?.status === "out" ? "notice-error" : judgement ? "notice-error" : "";
  return (
    <div className="field">
      <label htmlFor={inputId} className="label">
        {label}
      </label>
      <span id={`${inputId}-hint`} className="hint">
        Type the reading in {unitLabel(limit.unit)}
        {other ? <>, or with another unit, which is converted (for example &quot;12 {unitLabel(other)}&quot;)</> : null}.
      </span>
      <input
        id={inputId}
        className="input max-w-xs text-lg"
        inputMode="decimal"
        autoComplete="off"
        value={text}
        aria-describedby={`${inputId}-hint ${inputId}-result`}
        onChange={(e) => (onChange ? onChange(e.target.value) : setOwn(e.target.value))}
      />
      <p id={`${inputId}-result`} aria-live="polite" className={tone}>
        {judgement ? (judgement.status === "in" ? `✓ ${judgement.message}` : judgement.message) : ""}
      </p>
    </div>
  );
}

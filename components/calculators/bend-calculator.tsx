"use client";

import { useState } from "react";
import { checkBendRadius, flatPattern, kFactor, type Temper } from "@/lib/domain/calc/bend";
import { formatNumber } from "@/lib/domain/calc/units";
import { attempt, num, NumberField, Results, SelectField } from "./parts";

export function BendCalculator() {
  const [thickness, setThickness] = useState("0.040");
  const [radius, setRadius] = useState("0.16");
  const [angle, setAngle] = useState("90");
  const [dims, setDims] = useState("1, 2, 1");
  const [temper, setTemper] = useState<Temper>("2024-T3");

  const t = num(thickness);
  const r = num(radius);
  const a = num(angle);
  const dimensions = dims.split(",").map((s) => num(s));
  const ok = t !== null && r !== null && a !== null && dimensions.every((d) => d !== null) && dimensions.length >= 2;
  const pattern = ok
    ? attempt(() =>
        flatPattern({
          thickness: t,
          radius: r,
          dimensions: dimensions as number[],
          bends: Array(dimensions.length - 1).fill(a) as number[],
        }),
      )
    : {
        value: null,
        error: dims.trim() && !dimensions.every((d) => d !== null) ? "List the outside dimensions as numbers separated by commas." : null,
      };
  const check =
    t !== null && r !== null ? attempt(() => checkBendRadius({ thickness: t, radius: r, temper })) : { value: null, error: null };

  const rows: [string, string, string?][] = [];
  if (check.value && check.value.low !== null && check.value.high !== null) {
    // Shown rounded up: a minimum radius is never shown smaller than the table's.
    rows.push([
      "Minimum bend radius",
      `${formatNumber(check.value.low, 4, "up")} in; use ${formatNumber(check.value.high, 4, "up")} in unless the drawing says otherwise`,
      check.value.tableThickness !== null
        ? `AC 43.13-1B Table 4-6, ${temper}, row ${check.value.tableThickness} in`
        : `AC 43.13-1B Table 4-6, ${temper}`,
    ]);
  }
  if (pattern.value && a !== null) {
    const k = kFactor(a);
    rows.push(["K factor", formatNumber(k, 5), `tan(${angle}° ÷ 2)`]);
    rows.push(["Setback", `${formatNumber(pattern.value.setbacks[0]!, 4)} in`, `${formatNumber(k, 5)} × (${radius} + ${thickness})`]);
    rows.push([
      "Bend allowance",
      `${formatNumber(pattern.value.allowances[0]!, 4)} in`,
      `(0.01743 × ${radius} + 0.0078 × ${thickness}) × ${angle}`,
    ]);
    rows.push(["Flats", pattern.value.flats.map((f) => `${formatNumber(f, 4)} in`).join(", ")]);
    rows.push(["Developed (flat) length", `${formatNumber(pattern.value.developedLength, 4)} in`, "Σ flats + Σ bend allowances"]);
  }
  const warnings = [...(pattern.value?.warnings ?? [])];
  if (check.value && check.value.status !== "ok") warnings.unshift(check.value.message);

  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Sheet thickness (T)" unit="in" value={thickness} onChange={setThickness} />
        <NumberField label="Inside bend radius (R)" unit="in" value={radius} onChange={setRadius} />
        <NumberField label="Bend angle" unit="degrees" value={angle} onChange={setAngle} />
        <SelectField
          label="Alloy and temper"
          value={temper}
          onChange={setTemper}
          options={[
            ["2024-T3", "2024-T3"],
            ["2024-O", "2024-O (annealed)"],
          ]}
        />
        <div className="sm:col-span-2">
          <NumberFieldText
            label="Outside dimensions, in order (in)"
            hint="Comma-separated, one more than the bends: 1, 2, 1 for a U-channel."
            value={dims}
            onChange={setDims}
          />
        </div>
      </div>
      {check.value?.status === "ok" ? <p className="notice-ok">{check.value.message}</p> : null}
      <Results
        rows={rows}
        warnings={warnings}
        error={check.error ?? pattern.error}
        notes={["Between two gauges of the table, the thicker gauge's row is used: its radii are the safer ones."]}
      />
    </div>
  );
}

function NumberFieldText({ label, hint, value, onChange }: { label: string; hint: string; value: string; onChange: (v: string) => void }) {
  return (
    <label className="field">
      <span className="label">{label}</span>
      <span className="hint">{hint}</span>
      <input className="input max-w-80 text-lg" value={value} onChange={(e) => onChange(e.target.value)} autoComplete="off" />
    </label>
  );
}

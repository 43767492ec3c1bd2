"use client";

import { useState } from "react";
import { coilShotCurrent } from "@/lib/calc/ndt";
import { formatNumber } from "@/lib/calc/units";
import { attempt, num, NumberField, Results } from "./parts";

export function CoilShotCalculator() {
  const [length, setLength] = useState("10");
  const [diameter, setDiameter] = useState("2");
  const [turns, setTurns] = useState("5");
  const l = num(length);
  const d = num(diameter);
  const n = num(turns);
  const shot = l !== null && d !== null && n !== null ? attempt(() => coilShotCurrent({ length: l, diameter: d, turns: n })) : { value: null, error: null };
  const rows: [string, string, string?][] = [];
  if (shot.value) {
    rows.push(["L/D", formatNumber(shot.value.ratio, 4), `${length} ÷ ${diameter}`]);
    rows.push(["Coil current", `${formatNumber(shot.value.amperes, 4)} A`, `45,000 ÷ (${formatNumber(shot.value.ratio, 4)} × ${turns})`]);
  }
  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-3">
        <NumberField label="Part length (L)" unit="in" value={length} onChange={setLength} />
        <NumberField label="Part diameter (D)" unit="in" value={diameter} onChange={setDiameter} />
        <NumberField label="Coil turns (N)" value={turns} onChange={setTurns} />
      </div>
      <Results rows={rows} warnings={shot.value?.warnings} error={shot.error} />
    </div>
  );
}

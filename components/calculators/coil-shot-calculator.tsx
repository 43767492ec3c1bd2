"use client";

import { useState } from "react";
import { coilArrangements, coilRatioRange, coilShotCurrent, type CoilArrangement } from "@/lib/domain/calc/ndt";
import { formatAgainst, formatNumber } from "@/lib/domain/calc/units";
import { attempt, num, NumberField, Results, SelectField } from "./parts";

export function CoilShotCalculator() {
  const [length, setLength] = useState("10");
  const [diameter, setDiameter] = useState("2");
  const [bore, setBore] = useState("");
  const [turns, setTurns] = useState("5");
  const [arrangement, setArrangement] = useState<CoilArrangement>("wall");
  const [coil, setCoil] = useState("");
  const [poles, setPoles] = useState<"no" | "yes">("no");
  const l = num(length);
  const d = num(diameter);
  const id = num(bore);
  const n = num(turns);
  const c = num(coil);
  const shot =
    l !== null && d !== null && n !== null
      ? attempt(() =>
          coilShotCurrent({
            length: l,
            diameter: d,
            turns: n,
            arrangement,
            insideDiameter: id ?? 0,
            coilDiameter: c,
            polePieces: poles === "yes",
          }),
        )
      : { value: null, error: null };
  const rows: [string, string, string?][] = [];
  if (shot.value) {
    const v = shot.value;
    rows.push([
      "L/D",
      formatAgainst(v.ratio, v.ratio < 9 ? coilRatioRange.lowest : coilRatioRange.cap, 4),
      `${length} ÷ ${formatNumber(v.effectiveDiameter, 4)}${v.ratioUsed !== v.ratio ? `; ${v.ratioUsed} used` : ""}`,
    ]);
    if (v.fillFactor !== null) rows.push(["Fill factor", formatNumber(v.fillFactor, 3), "coil area ÷ part area"]);
    rows.push(["Coil current", `${formatNumber(v.amperes, 4)} A`, v.formula]);
    rows.push(["±10 %", `${formatNumber(v.range[0], 4)} to ${formatNumber(v.range[1], 4)} A`]);
  }
  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="How the part sits in the coil"
          value={arrangement}
          onChange={setArrangement}
          options={Object.entries(coilArrangements).map(([k, v]) => [k as CoilArrangement, v])}
        />
        <NumberField label="Coil turns (N)" value={turns} onChange={setTurns} />
        <NumberField
          label="Part length (L)"
          unit="in"
          hint="With pole pieces, the part and the pieces together."
          value={length}
          onChange={setLength}
        />
        <NumberField label="Part outside diameter (D)" unit="in" value={diameter} onChange={setDiameter} />
        <NumberField label="Bore of a hollow part" unit="in" hint="Leave empty for a solid part." value={bore} onChange={setBore} />
        <NumberField
          label="Coil inside diameter"
          unit="in"
          hint="Needed for a centred part; gives the fill factor."
          value={coil}
          onChange={setCoil}
        />
        <SelectField
          label="Pole pieces fitted?"
          value={poles}
          onChange={setPoles}
          options={[
            ["no", "No"],
            ["yes", "Yes"],
          ]}
        />
      </div>
      <Results rows={rows} warnings={shot.value?.warnings} notes={shot.value?.notes} error={shot.error} />
    </div>
  );
}

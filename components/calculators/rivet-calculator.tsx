"use client";

import { useState } from "react";
import {
  chooseRivetDiameter, fractionOfInch, headStyles, rivetLayout, rivetLength, rivetMaterials, rivetPartNumber, rivetsForSplice,
  type HeadStyle, type RivetMaterial,
} from "@/lib/calc/rivets";
import { formatNumber } from "@/lib/calc/units";
import { attempt, num, NumberField, Results, SelectField } from "./parts";

const inch = (v: number) => `${formatNumber(v, 4)} in${fractionOfInch(v) ? ` (${fractionOfInch(v)})` : ""}`;

export function RivetCalculator() {
  const [thickest, setThickest] = useState("0.032");
  const [grip, setGrip] = useState("0.064");
  const [head, setHead] = useState<HeadStyle>("MS20470");
  const [material, setMaterial] = useState<RivetMaterial>("AD");
  const [width, setWidth] = useState("10");
  const [perInch, setPerInch] = useState("4.9");
  const [factor, setFactor] = useState<"1" | "0.75" | "0.6">("0.75");
  const [rows, setRows] = useState("2");

  const t = num(thickest);
  const choice = t ? attempt(() => chooseRivetDiameter(t)) : { value: null, error: null };
  const d = choice.value?.suggested ?? null;
  const g = num(grip);
  const length = d && g ? attempt(() => rivetLength({ grip: g, diameter: d })) : { value: null, error: null };
  const layout = d ? rivetLayout({ diameter: d, countersunk: head === "MS20426" }) : null;
  const w = num(width);
  const p = num(perInch);
  const r = num(rows);
  const splice = w && p && r ? attempt(() => rivetsForSplice({ width: w, rivetsPerInch: p, factor: Number(factor), rows: r })) : { value: null, error: null };

  const results: [string, string, string?][] = [];
  if (choice.value) {
    results.push(["Target diameter", `${formatNumber(choice.value.target, 4)} in`, `3 × ${thickest}`]);
    if (d) results.push(["Rivet diameter", inch(d), choice.value.alternative ? `or ${fractionOfInch(choice.value.alternative)} in` : undefined]);
  }
  if (length.value && d) {
    results.push(["Rivet length", `${formatNumber(length.value.length, 4)} in → ${length.value.lengthSixteenths}/16 in`, `${grip} + 1.5 × ${formatNumber(d, 4)}`]);
    results.push(["Part number", rivetPartNumber({ head, material, diameter: d, lengthSixteenths: length.value.lengthSixteenths }), "diameter in 32nds, length in 16ths"]);
  }
  if (layout) {
    results.push(["Edge distance, at least", inch(layout.minimumEdgeDistance), head === "MS20426" ? "2.5 D countersunk" : "2 D"]);
    results.push(["Pitch", `${formatNumber(layout.minimumPitch, 4)} in minimum; usually ${formatNumber(layout.usualPitch[0], 4)}–${formatNumber(layout.usualPitch[1], 4)} in`, "3 D; 4–8 D"]);
    results.push(["Row spacing, at least", inch(layout.minimumRowSpacing), "2.5 D"]);
  }
  if (splice.value) {
    results.push(["Rivets for the splice", `${splice.value.required} (${splice.value.perRow} per row)`, `⌈${width} × ${perInch}⌉ = ${splice.value.fromTable}, × ${factor}`]);
  }

  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Thickest sheet" unit="in" value={thickest} onChange={setThickest} />
        <NumberField label="Grip (all sheets together)" unit="in" value={grip} onChange={setGrip} />
        <SelectField label="Head" value={head} onChange={setHead} options={Object.entries(headStyles).map(([k, v]) => [k as HeadStyle, `${k}, ${v}`])} />
        <SelectField label="Material" value={material} onChange={setMaterial} options={Object.entries(rivetMaterials).map(([k, v]) => [k as RivetMaterial, `${k}, ${v}`])} />
      </div>
      <fieldset className="grid gap-3 rounded-md border border-line p-3 sm:grid-cols-2">
        <legend className="px-1 font-semibold">Rivets for a splice</legend>
        <NumberField label="Width of the splice" unit="in" value={width} onChange={setWidth} />
        <NumberField label="Rivets per inch of width" hint="From AC 43.13-1B Table 4-10 for this sheet and rivet." value={perInch} onChange={setPerInch} />
        <SelectField
          label="Kind of joint"
          value={factor}
          onChange={setFactor}
          options={[["1", "Full table value"], ["0.75", "Single-lap sheet splice: 75 %"], ["0.6", "Intermediate frame: 60 %"]]}
        />
        <NumberField label="Rows" value={rows} onChange={setRows} />
      </fieldset>
      <Results rows={results} warnings={[...(choice.value?.warnings ?? []), ...(splice.value?.warnings ?? [])]} error={choice.error ?? length.error ?? splice.error} />
    </div>
  );
}

"use client";

import { useState } from "react";
import {
  chooseRivetDiameter,
  fractionOfInch,
  headStyles,
  rivetLayout,
  rivetLength,
  rivetMaterials,
  rivetPartNumber,
  rivetsForSplice,
  type HeadStyle,
  type RivetMaterial,
} from "@/lib/domain/calc/rivets";
import { formatNumber } from "@/lib/domain/calc/units";
import { CardNotice } from "../card-notice";
import { attempt, num, NumberField, Results, SelectField } from "./parts";

// A minimum is shown rounded up and a maximum rounded down, so the text never allows more than the rule.
const inch = (v: number, rounding: "up" | "down" | "nearest" = "nearest") =>
  `${formatNumber(v, 4, rounding)} in${fractionOfInch(v) ? ` (${fractionOfInch(v)})` : ""}`;
const range = (low: number, high: number) => `${formatNumber(low, 4, "up")} to ${formatNumber(high, 4, "down")} in`;

export function RivetCalculator() {
  const [thickest, setThickest] = useState("0.032");
  const [grip, setGrip] = useState("0.064");
  const [picked, setPicked] = useState("");
  const [head, setHead] = useState<HeadStyle>("MS20470");
  const [material, setMaterial] = useState<RivetMaterial>("AD");
  const [pitch, setPitch] = useState("");
  const [width, setWidth] = useState("10");
  const [perInch, setPerInch] = useState("4.9");
  const [factor, setFactor] = useState<"1" | "0.75" | "0.6">("0.75");
  const [rows, setRows] = useState("2");

  const t = num(thickest);
  const choice = t !== null ? attempt(() => chooseRivetDiameter(t)) : { value: null, error: null };
  const options = choice.value?.options ?? [];
  // The user's choice while the sheet still allows it; else the size the handbook's example picks.
  const d = options.find((o) => String(o.diameter) === picked)?.diameter ?? choice.value?.suggested ?? null;
  const g = num(grip);
  const length = d && g !== null ? attempt(() => rivetLength({ grip: g, diameter: d })) : { value: null, error: null };
  const pt = num(pitch);
  const layout = d ? attempt(() => rivetLayout({ diameter: d, countersunk: head === "MS20426", pitch: pt })) : { value: null, error: null };
  const w = num(width);
  const p = num(perInch);
  const r = num(rows);
  const splice =
    w !== null && p !== null && r !== null
      ? attempt(() => rivetsForSplice({ width: w, rivetsPerInch: p, factor: Number(factor), rows: r }))
      : { value: null, error: null };

  const results: [string, string, string?][] = [];
  if (choice.value) {
    results.push([
      "Diameter range",
      `${formatNumber(choice.value.minimum, 4, "up")} to ${formatNumber(choice.value.target, 4)} in`,
      `t to 3 × ${thickest} (NAVEDTRA 14018)`,
    ]);
    if (d)
      results.push([
        "Rivet diameter",
        inch(d),
        d === choice.value.suggested ? "next size at or above 3 t (AC 43.13-1B 4-58g)" : "your choice",
      ]);
  }
  if (length.value && d) {
    const standard = length.value.lengthSixteenths / 16;
    results.push([
      "Rivet length",
      `${formatNumber(length.value.length, 4, "up")} in → ${fractionOfInch(standard) ?? formatNumber(standard, 4)} in`,
      `${grip} + 1.5 × ${formatNumber(d, 4)}, next standard length up`,
    ]);
    results.push([
      "Part number",
      rivetPartNumber({ head, material, diameter: d, lengthSixteenths: length.value.lengthSixteenths }),
      "diameter in 32nds, length in 16ths",
    ]);
  }
  if (layout.value) {
    const l = layout.value;
    results.push([
      "Edge distance",
      range(l.edgeDistance[0], l.edgeDistance[1]),
      head === "MS20426" ? "2.5 D countersunk to 4 D" : "2 D to 4 D",
    ]);
    results.push(["Pitch", `at least ${inch(l.minimumPitch, "up")}; usually ${range(l.usualPitch[0], l.usualPitch[1])}`, "3 D; 4–8 D"]);
    results.push([
      "Row spacing (transverse pitch)",
      l.transversePitch[0] === l.transversePitch[1] ? inch(l.transversePitch[0], "up") : range(l.transversePitch[0], l.transversePitch[1]),
      `about 75 % of ${pt !== null ? "the pitch" : "4–8 D"}, never under 2.5 D = ${formatNumber(l.minimumRowSpacing, 4, "up")} in`,
    ]);
  }
  if (splice.value) {
    results.push([
      "Rivets for the splice",
      `${splice.value.required} (${splice.value.perRow} per row)`,
      `⌈${width} × ${perInch}⌉ = ${splice.value.fromTable}, × ${factor}`,
    ]);
  }

  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Thickest sheet" unit="in" value={thickest} onChange={setThickest} />
        <NumberField label="Grip (all sheets together)" unit="in" value={grip} onChange={setGrip} />
        <SelectField
          label="Rivet diameter"
          value={d !== null ? String(d) : ""}
          onChange={setPicked}
          options={[
            ...(d === null ? [["", options.length ? "Choose a diameter" : "Type the thickest sheet"] as [string, string]] : []),
            ...options.map((o): [string, string] => [String(o.diameter), `${fractionOfInch(o.diameter)} in: ${o.basis}`]),
          ]}
        />
        <NumberField label="Pitch you lay out" unit="in" hint="Leave empty for the usual 4–8 D." value={pitch} onChange={setPitch} />
        <SelectField
          label="Head"
          value={head}
          onChange={setHead}
          options={Object.entries(headStyles).map(([k, v]) => [k as HeadStyle, `${k}, ${v}`])}
        />
        <SelectField
          label="Material"
          value={material}
          onChange={setMaterial}
          options={Object.entries(rivetMaterials).map(([k, v]) => [k as RivetMaterial, `${k}, ${v}`])}
        />
      </div>
      {material !== "AD" ? (
        <CardNotice
          kind="caution"
          text={`${material} rivets are heat-treated (icebox) rivets: drive them within the time the approved data gives after they leave the refrigerator, or heat-treat them again.`}
        />
      ) : null}
      <fieldset className="grid gap-3 rounded-md border border-line p-3 sm:grid-cols-2">
        <legend className="px-1 font-semibold">Rivets for a splice</legend>
        <NumberField label="Width of the splice" unit="in" value={width} onChange={setWidth} />
        <NumberField
          label="Rivets per inch of width"
          hint="From AC 43.13-1B Table 4-10 for this sheet and rivet."
          value={perInch}
          onChange={setPerInch}
        />
        <SelectField
          label="Kind of joint"
          value={factor}
          onChange={setFactor}
          options={[
            ["1", "Full table value"],
            ["0.75", "Single-lap sheet splice: 75 %"],
            ["0.6", "Intermediate frame: 60 %"],
          ]}
        />
        <NumberField label="Rows" value={rows} onChange={setRows} />
      </fieldset>
      <Results
        rows={results}
        warnings={[...(choice.value?.warnings ?? []), ...(layout.value?.warnings ?? []), ...(splice.value?.warnings ?? [])]}
        notes={["Shown minimums are rounded up and maximums down. The approved repair data comes first."]}
        error={choice.error ?? length.error ?? layout.error ?? splice.error}
      />
    </div>
  );
}

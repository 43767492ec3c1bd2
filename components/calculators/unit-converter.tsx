"use client";

import { useState } from "react";
import { convert, dimensionOf, formatNumber, unitLabel, unitsOf, type Dimension } from "@/lib/domain/calc/units";
import { num, NumberField, Results, SelectField } from "./parts";

const kinds: [Dimension, string][] = [
  ["length", "Length"],
  ["torque", "Torque"],
  ["temperature", "Temperature"],
  ["pressure", "Pressure"],
  ["force", "Force"],
  ["volume", "Volume"],
];

export function UnitConverter() {
  const [kind, setKind] = useState<Dimension>("torque");
  const [value, setValue] = useState("100");
  const [from, setFrom] = useState("in-lb");
  const units = unitsOf(kind);
  const source = dimensionOf(from) === kind ? from : units[0]!;
  const v = num(value);
  const rows: [string, string][] =
    v === null ? [] : units.filter((u) => u !== source).map((u) => [unitLabel(u), formatNumber(convert(v, source, u), 6)]);
  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-3">
        <SelectField
          label="Quantity"
          value={kind}
          onChange={(k) => {
            setKind(k);
            setFrom(unitsOf(k)[0]!);
          }}
          options={kinds}
        />
        <NumberField label="Value" value={value} onChange={setValue} />
        <SelectField label="From" value={source} onChange={setFrom} options={units.map((u) => [u, unitLabel(u)])} />
      </div>
      <Results rows={rows} />
    </div>
  );
}

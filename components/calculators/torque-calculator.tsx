"use client";

import { useState } from "react";
import { adapterWarnings, appliedTorque, wrenchSetting, type AdapterDirection } from "@/lib/domain/calc/torque";
import { convert, formatNumber } from "@/lib/domain/calc/units";
import { attempt, num, NumberField, Results, SelectField } from "./parts";

const torqueUnits: [string, string][] = [
  ["in-lb", "in-lb"],
  ["ft-lb", "ft-lb"],
  ["N·m", "N·m"],
];

export function TorqueCalculator() {
  const [desired, setDesired] = useState("300");
  const [unit, setUnit] = useState("in-lb");
  const [lever, setLever] = useState("10");
  const [adapter, setAdapter] = useState("4");
  const [direction, setDirection] = useState<AdapterDirection>("lengthens");

  const ta = num(desired);
  const l = num(lever);
  const a = num(adapter);
  const setting =
    ta !== null && l !== null && a !== null
      ? attempt(() => wrenchSetting({ desired: ta, lever: l, adapter: a, direction }))
      : { value: null, error: null };
  const rows: [string, string, string?][] = [];
  if (setting.value !== null && ta !== null && l !== null && a !== null) {
    rows.push([
      "Set the wrench to",
      `${formatNumber(setting.value, 4)} ${unit}`,
      `${desired} × ${lever} ÷ (${lever} ${direction === "lengthens" ? "+" : "−"} ${adapter})`,
    ]);
    rows.push([
      "Check: applied at that setting",
      `${formatNumber(appliedTorque({ setting: setting.value, lever: l, adapter: a, direction }), 4)} ${unit}`,
    ]);
    for (const [other] of torqueUnits.filter(([u]) => u !== unit)) {
      rows.push([`Setting in ${other}`, `${formatNumber(convert(setting.value, unit, other), 4)} ${other}`]);
    }
  }
  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Torque the manual asks for (TA)" value={desired} onChange={setDesired} />
        <SelectField label="Unit" value={unit} onChange={setUnit} options={torqueUnits} />
        <NumberField label="Wrench length, drive to grip mark (L)" unit="in" value={lever} onChange={setLever} />
        <NumberField label="Adapter length along the wrench (A)" unit="in" value={adapter} onChange={setAdapter} />
        <SelectField
          label="The adapter"
          value={direction}
          onChange={setDirection}
          options={[
            ["lengthens", "points away from the handle (lengthens)"],
            ["shortens", "points back toward the handle (shortens)"],
          ]}
        />
      </div>
      <Results
        rows={rows}
        warnings={setting.value !== null && l !== null && a !== null ? adapterWarnings({ lever: l, adapter: a, direction }) : []}
        notes={["Set the wrench to the value shown; if the manual gives a range, aim inside it and never past its maximum."]}
        error={setting.error}
      />
    </div>
  );
}

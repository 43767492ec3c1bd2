"use client";

import { useState } from "react";
import { developmentWindows, penetrantDwell, penetrantWindowF, type DeveloperForm } from "@/lib/domain/calc/ndt";
import { formatAgainst, formatNumber } from "@/lib/domain/calc/units";
import { attempt, num, NumberField, Results, SelectField } from "./parts";

export function PenetrantCalculator() {
  const [specified, setSpecified] = useState("10");
  const [temperature, setTemperature] = useState("70");
  const [unit, setUnit] = useState<"°F" | "°C">("°F");
  const [service, setService] = useState<"no" | "yes">("no");
  const [developer, setDeveloper] = useState<DeveloperForm>("nonaqueous");

  const s = num(specified);
  const t = num(temperature);
  const result =
    s !== null && t !== null
      ? attempt(() => penetrantDwell({ specifiedMinutes: s, temperature: t, unit, serviceInduced: service === "yes", developer }))
      : { value: null, error: null };
  const rows: [string, string, string?][] = [];
  const warnings: string[] = [];
  if (result.value) {
    const r = result.value;
    // Near an edge of the window, enough digits to show which side the part is on (39.99 °F, not 40).
    const edge = r.temperatureF < (penetrantWindowF.min + penetrantWindowF.max) / 2 ? penetrantWindowF.min : penetrantWindowF.max;
    rows.push([
      "Part temperature",
      `${formatAgainst(r.temperatureF, edge, 4)} °F`,
      `tests are done from ${penetrantWindowF.min} to ${penetrantWindowF.max} °F`,
    ]);
    if (r.allowed && r.dwellMinutes !== null) {
      rows.push(["Rule", r.rule]);
      rows.push([
        "Penetrant dwell",
        `${formatNumber(r.dwellMinutes, 3)} min`,
        r.shortestMinutes !== null && r.shortestMinutes < r.dwellMinutes
          ? `may be as short as ${formatNumber(r.shortestMinutes, 3)} min`
          : undefined,
      ]);
      const w = developmentWindows[developer];
      rows.push([
        "Development time",
        `${formatNumber(r.developmentMinutes!, 3)} min`,
        `about ½ the dwell (TM 1-1500-204-23-7), ${w.min} to ${w.max} min for ${w.label} developer (${w.source})`,
      ]);
    }
    warnings.push(...r.warnings);
  }
  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Dwell the procedure specifies" unit="min" value={specified} onChange={setSpecified} />
        <NumberField label="Part temperature" value={temperature} onChange={setTemperature} />
        <SelectField
          label="Temperature unit"
          value={unit}
          onChange={setUnit}
          options={[
            ["°F", "°F"],
            ["°C", "°C"],
          ]}
        />
        <SelectField
          label="Developer form"
          value={developer}
          onChange={setDeveloper}
          options={Object.entries(developmentWindows).map(([k, v]) => [k as DeveloperForm, v.label])}
        />
        <SelectField
          label="Looking for service-induced flaws (fatigue, stress corrosion)?"
          value={service}
          onChange={setService}
          options={[
            ["no", "No"],
            ["yes", "Yes"],
          ]}
        />
      </div>
      <Results rows={rows} warnings={warnings} error={result.error} />
    </div>
  );
}

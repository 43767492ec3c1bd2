"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { settingsApi } from "@/lib/contracts/endpoints/settings";

const sectionNames = ["General", "Airframe", "Powerplant"] as const;

/** The hours the school plans per section; an empty box means no plan for that section. */
export function PlannedHoursForm({ plannedHours }: { plannedHours: Partial<Record<string, number>> }) {
  const router = useRouter();
  const [values, setValues] = useState<Record<string, string>>(
    Object.fromEntries(sectionNames.map((s) => [s, plannedHours[s] !== undefined ? String(plannedHours[s]) : ""])),
  );
  const [fields, setFields] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  return (
    <form
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        const body: Record<string, number | null> = {};
        const wrong: Record<string, string> = {};
        for (const s of sectionNames) {
          const text = values[s]!.trim();
          if (!text) body[s] = null;
          else if (/^\d+$/.test(text)) body[s] = Number(text);
          else wrong[s] = "Whole hours, such as 420, or empty for no plan.";
        }
        setFields(wrong);
        if (Object.keys(wrong).length) return;
        setBusy(true);
        setResult(null);
        call(settingsApi.update, { body: { plannedHours: body } })
          .then(() => {
            setResult({ ok: true, message: "Saved: attendance is shown against these hours." });
            router.refresh();
          })
          .catch((error: unknown) => {
            if (error instanceof ApiError && error.fields)
              setFields(Object.fromEntries(Object.entries(error.fields).map(([k, v]) => [k.replace(/^plannedHours\./, ""), v])));
            setResult({ ok: false, message: error instanceof ApiError ? error.message : "That did not work." });
          })
          .finally(() => setBusy(false));
      }}
    >
      <div className="grid gap-4 sm:grid-cols-3">
        {sectionNames.map((s) => (
          <div key={s} className="flex flex-col gap-1">
            <label htmlFor={`planned-${s}`} className="label">
              {s} (hours)
            </label>
            <input
              id={`planned-${s}`}
              className="input"
              inputMode="numeric"
              value={values[s]}
              aria-invalid={fields[s] ? true : undefined}
              aria-describedby={fields[s] ? `planned-${s}-error` : undefined}
              onChange={(e) => setValues((v) => ({ ...v, [s]: e.target.value }))}
            />
            {fields[s] ? (
              <p id={`planned-${s}-error`} className="font-semibold text-danger">
                {fields[s]}
              </p>
            ) : null}
          </div>
        ))}
      </div>
      <button type="submit" className="btn btn-primary self-start" disabled={busy}>
        Save the planned hours
      </button>
      <FormResult result={result} />
    </form>
  );
}

"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { settingsApi } from "@/lib/contracts/endpoints/settings";

/** The school's time zone, picked from the zones this browser knows (typed to filter the list). */
export function SettingsForm({ timeZone }: { timeZone: string }) {
  const router = useRouter();
  const zones = useMemo(() => ["UTC", ...Intl.supportedValuesOf("timeZone").filter((z) => z !== "UTC")], []);
  const [value, setValue] = useState(timeZone);
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  return (
    <form
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        setBusy(true);
        setResult(null);
        call(settingsApi.update, { body: { timeZone: value } })
          .then(({ settings }) => {
            setResult({ ok: true, message: `Saved: times are told in ${settings.timeZone}.` });
            router.refresh();
          })
          .catch((error: unknown) => setResult({ ok: false, message: error instanceof ApiError ? error.message : "That did not work." }))
          .finally(() => setBusy(false));
      }}
    >
      <label htmlFor="time-zone" className="label">
        The school&apos;s time zone
      </label>
      <input
        id="time-zone"
        className="input max-w-md"
        list="time-zones"
        value={value}
        onChange={(e) => setValue(e.target.value)}
        autoComplete="off"
        spellCheck={false}
      />
      <datalist id="time-zones">
        {zones.map((z) => (
          <option key={z} value={z} />
        ))}
      </datalist>
      <p className="hint">Type a city or region to narrow the list, for example Denver, Chicago or Oslo.</p>
      <button type="submit" className="btn btn-primary self-start" disabled={busy || value === timeZone}>
        Save the time zone
      </button>
      <FormResult result={result} />
    </form>
  );
}

"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { attendanceApi } from "@/lib/contracts/endpoints/attendance";
import { sectionNames } from "@/lib/domain/attendance";

/** Puts a session on the class's timetable; its register is then taken from the list. */
export function PlanSessionForm({ classId }: { classId: string }) {
  const router = useRouter();
  const [startsAt, setStartsAt] = useState("");
  const [minutes, setMinutes] = useState("240");
  const [section, setSection] = useState<string>("General");
  const [subject, setSubject] = useState("");
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  return (
    <form
      className="panel flex flex-col gap-4"
      aria-labelledby="plan-title"
      noValidate
      onSubmit={async (e) => {
        e.preventDefault();
        if (!startsAt || !subject.trim()) return setResult({ ok: false, message: "Give the start and what the session covers." });
        setBusy(true);
        setResult(null);
        try {
          // The browser's local time, as the instructor typed it.
          await call(attendanceApi.createSession, {
            body: { classId, startsAt: new Date(startsAt).toISOString(), minutes: Number(minutes), section, subject },
          });
          setResult({ ok: true, message: `Session "${subject}" planned.` });
          setSubject("");
          router.refresh();
        } catch (error) {
          setResult({ ok: false, message: error instanceof ApiError ? error.message : "Not planned: try again." });
        } finally {
          setBusy(false);
        }
      }}
    >
      <h2 id="plan-title">Plan a session</h2>
      <FormResult result={result} />
      <div className="grid gap-4 md:grid-cols-2">
        <label className="field">
          <span className="label">Starts</span>
          <input className="input" type="datetime-local" value={startsAt} onChange={(e) => setStartsAt(e.target.value)} />
        </label>
        <label className="field">
          <span className="label">Minutes</span>
          <input className="input" inputMode="numeric" value={minutes} onChange={(e) => setMinutes(e.target.value)} />
        </label>
        <label className="field">
          <span className="label">Counts to section</span>
          <select className="input" value={section} onChange={(e) => setSection(e.target.value)}>
            {sectionNames.map((s) => (
              <option key={s}>{s}</option>
            ))}
          </select>
        </label>
        <label className="field">
          <span className="label">Subject</span>
          <input className="input" value={subject} maxLength={120} onChange={(e) => setSubject(e.target.value)} />
        </label>
      </div>
      <button type="submit" className="btn btn-primary self-start" disabled={busy}>
        Plan session
      </button>
    </form>
  );
}

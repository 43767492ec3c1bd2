"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import type { SessionDetailDto } from "@/lib/contracts/attendance";
import { attendanceApi } from "@/lib/contracts/endpoints/attendance";
import { attendanceStatuses, attendanceWords, type AttendanceStatus } from "@/lib/domain/attendance";

type Row = { status: AttendanceStatus | ""; minutes: string; makeup: string };

/**
 * The register: one row per student with four large choices and the minutes (filled in from the
 * choice), a make-up note for someone missing. After closing, saving asks why.
 */
export function RegisterForm({ session }: { session: SessionDetailDto }) {
  const router = useRouter();
  const [rows, setRows] = useState<Record<string, Row>>(() =>
    Object.fromEntries(
      session.roster.map((r) => [
        r.userId,
        { status: r.current?.status ?? "", minutes: r.current ? String(r.current.minutes) : "", makeup: r.current?.makeup ?? "" },
      ]),
    ),
  );
  const [reason, setReason] = useState("");
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const closed = !!session.closedAt;
  const set = (userId: string, patch: Partial<Row>) => setRows((all) => ({ ...all, [userId]: { ...all[userId]!, ...patch } }));
  const marked = session.roster.filter((r) => rows[r.userId]!.status);

  return (
    <form
      className="panel flex flex-col gap-4"
      aria-labelledby="register-title"
      noValidate
      onSubmit={async (e) => {
        e.preventDefault();
        setResult(null);
        setFieldErrors({});
        if (!marked.length) return setResult({ ok: false, message: "Mark at least one student." });
        setBusy(true);
        try {
          await call(attendanceApi.recordAttendance, {
            params: { id: session.id },
            body: {
              entries: marked.map((r) => {
                const row = rows[r.userId]!;
                return {
                  userId: r.userId,
                  status: row.status as AttendanceStatus,
                  minutes: row.minutes.trim() ? Number(row.minutes) : undefined,
                  makeup: row.makeup,
                };
              }),
              reason,
            },
          });
          setResult({ ok: true, message: closed ? "Correction saved; the earlier entries are kept." : "Attendance saved." });
          setReason("");
          router.refresh();
        } catch (error) {
          if (error instanceof ApiError) setFieldErrors(error.fields);
          setResult({ ok: false, message: error instanceof ApiError ? error.message : "Not saved: try again." });
        } finally {
          setBusy(false);
        }
      }}
    >
      <h2 id="register-title">{closed ? "Correct the register" : "Take attendance"}</h2>
      <FormResult result={result} />
      <ul className="flex flex-col gap-3">
        {session.roster.map((r, i) => {
          const row = rows[r.userId]!;
          const index = marked.indexOf(r);
          const error = index >= 0 ? fieldErrors[`entries.${index}`] : undefined;
          return (
            <li key={r.userId} className="rounded-md border-2 border-line p-3">
              <fieldset className="flex flex-col gap-2">
                <legend className="text-lg font-bold">{r.name}</legend>
                <div className="flex flex-wrap gap-2">
                  {attendanceStatuses.map((s) => (
                    <label
                      key={s}
                      className={`btn ${row.status === s ? "btn-primary" : "btn-secondary"} cursor-pointer has-[:focus-visible]:outline-4 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-[#f2b01e]`}
                    >
                      <input
                        type="radio"
                        className="sr-only"
                        name={`status-${i}`}
                        checked={row.status === s}
                        onChange={() =>
                          set(r.userId, {
                            status: s,
                            minutes: s === "present" ? String(session.minutes) : s === "late" ? "" : "0",
                          })
                        }
                      />
                      {attendanceWords[s]}
                    </label>
                  ))}
                </div>
                <div className="flex flex-wrap gap-4">
                  <label className="field">
                    <span className="label">Minutes attended (of {session.minutes})</span>
                    <input
                      className="input w-32"
                      inputMode="numeric"
                      value={row.minutes}
                      aria-invalid={error ? true : undefined}
                      onChange={(e) => set(r.userId, { minutes: e.target.value })}
                    />
                  </label>
                  {row.status === "absent" || row.status === "excused" ? (
                    <label className="field grow">
                      <span className="label">Make-up work (optional)</span>
                      <input
                        className="input"
                        value={row.makeup}
                        maxLength={300}
                        onChange={(e) => set(r.userId, { makeup: e.target.value })}
                      />
                    </label>
                  ) : null}
                </div>
                {error ? <p className="field-error">{error}</p> : null}
                {r.history.length > 1 ? (
                  <p className="hint">
                    Earlier:{" "}
                    {r.history
                      .slice(1)
                      .map((h) => `${attendanceWords[h.status]} ${h.minutes} min (${h.recordedByName})`)
                      .join("; ")}
                    {r.current?.correctionReason ? `. Corrected: ${r.current.correctionReason}` : ""}
                  </p>
                ) : null}
              </fieldset>
            </li>
          );
        })}
      </ul>
      {closed ? (
        <label className="field">
          <span className="label">Why the closed register is corrected</span>
          <input
            className="input"
            value={reason}
            maxLength={300}
            onChange={(e) => setReason(e.target.value)}
            aria-invalid={fieldErrors.reason ? true : undefined}
          />
          {fieldErrors.reason ? <span className="field-error">{fieldErrors.reason}</span> : null}
        </label>
      ) : null}
      <button type="submit" className="btn btn-primary self-start text-lg" disabled={busy}>
        {closed ? "Save the correction" : "Save attendance"}
      </button>
    </form>
  );
}

export function CloseRegister({ sessionId }: { sessionId: string }) {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  return (
    <div className="flex flex-col gap-2">
      {asking ? (
        <div role="alertdialog" aria-label="Close the register" className="panel flex flex-col gap-2 border-4 border-deck">
          <p>Close the register? Afterwards every change is a correction that says why, and the first entries stay in the record.</p>
          <div className="flex gap-3">
            <button
              type="button"
              className="btn btn-primary"
              onClick={async () => {
                try {
                  await call(attendanceApi.closeSession, { params: { id: sessionId } });
                  setAsking(false);
                  router.refresh();
                } catch (error) {
                  setResult({ ok: false, message: error instanceof ApiError ? error.message : "Not closed: try again." });
                }
              }}
            >
              Close it
            </button>
            <button type="button" className="btn btn-secondary" onClick={() => setAsking(false)}>
              Not yet
            </button>
          </div>
        </div>
      ) : (
        <button type="button" className="btn btn-secondary self-start" onClick={() => setAsking(true)}>
          Close the register…
        </button>
      )}
      <FormResult result={result} />
    </div>
  );
}

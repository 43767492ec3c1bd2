"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, call } from "@/lib/client/api";
import { runsApi } from "@/lib/contracts/endpoints/runs";

interface Props {
  cardId: string;
  /** The school's today: the first day a due date may be. */
  today: string;
  versions: number[];
  classes: { id: string; name: string }[];
  students: { id: string; name: string; className: string }[];
  /** Hangar bookings of the coming weeks the card can be done in ("Mon 08:00 HL-TR1 in Bay 1, Day Cohort"). */
  bookings?: { id: string; label: string }[];
}

/** To a whole class, or to chosen students; a due date and a place (aircraft, station) are optional. */
export function AssignForm({ cardId, today, versions, classes, students, bookings = [] }: Props) {
  const router = useRouter();
  const [classId, setClassId] = useState(classes[0]?.id ?? "");
  const [chosen, setChosen] = useState<Set<string>>(new Set());
  const [to, setTo] = useState<"class" | "students">(classes.length ? "class" : "students");
  const [versionNumber, setVersion] = useState(versions.at(-1)!);
  const [dueOn, setDueOn] = useState("");
  const [note, setNote] = useState("");
  const [bookingId, setBookingId] = useState("");
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; text: string; fields?: Record<string, string> } | null>(null);
  // Set when the server named students who already have the card open: the next submit assigns anyway.
  const [duplicates, setDuplicates] = useState<string | null>(null);
  const className = classes.find((c) => c.id === classId)?.name;
  const chosenNames = students.filter((s) => chosen.has(s.id)).map((s) => s.name);
  const giving =
    to === "class"
      ? className
        ? `Giving it to every student of ${className}.`
        : "Choose a class."
      : chosenNames.length
        ? `Giving it to ${chosenNames.length === 1 ? chosenNames[0] : `${chosenNames.length} students: ${chosenNames.join(", ")}`}.`
        : "Tick the students to give it to.";
  const submit = async (confirmDuplicates: boolean) => {
    setBusy(true);
    setResult(null);
    setDuplicates(null);
    try {
      const { assignment } = await call(runsApi.createAssignment, {
        body: {
          cardId,
          versionNumber,
          classId: to === "class" ? classId || null : null,
          studentIds: to === "students" ? [...chosen] : [],
          dueOn,
          note,
          bookingId: bookingId || null,
          confirmDuplicates,
        },
      });
      setResult({
        ok: true,
        text: `Assigned: ${assignment.runs} ${assignment.runs === 1 ? "student has" : "students have"} it in their work.`,
      });
      router.refresh();
      setChosen(new Set());
      setDueOn("");
      setNote("");
    } catch (error) {
      if (error instanceof ApiError && error.status === 409 && error.fields.confirmDuplicates) {
        setDuplicates(error.fields.confirmDuplicates);
        return;
      }
      // The field's own words ("Choose a class…"), not the API's "classId: …" form.
      setResult(
        error instanceof ApiError
          ? { ok: false, text: Object.values(error.fields)[0] ?? error.message, fields: error.fields }
          : { ok: false, text: "That did not work." },
      );
    } finally {
      setBusy(false);
    }
  };
  return (
    <form
      className="panel flex flex-col gap-4"
      onSubmit={(e) => {
        e.preventDefault();
        void submit(false);
      }}
    >
      <fieldset className="flex flex-col gap-2">
        <legend className="label">Give it to</legend>
        <label className="flex min-h-11 items-center gap-2">
          <input
            type="radio"
            name="to"
            checked={to === "class"}
            onChange={() => setTo("class")}
            disabled={!classes.length}
            className="size-5"
          />{" "}
          A whole class
        </label>
        {to === "class" ? (
          <select aria-label="Class" className="input max-w-md" value={classId} onChange={(e) => setClassId(e.target.value)}>
            {classes.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name}
              </option>
            ))}
          </select>
        ) : null}
        <label className="flex min-h-11 items-center gap-2">
          <input type="radio" name="to" checked={to === "students"} onChange={() => setTo("students")} className="size-5" /> Chosen students
        </label>
        {to === "students" ? (
          <div className="grid gap-1 sm:grid-cols-2">
            {students.map((s) => (
              <label key={s.id} className="flex min-h-11 items-center gap-2">
                <input
                  type="checkbox"
                  className="size-5"
                  checked={chosen.has(s.id)}
                  onChange={(e) =>
                    setChosen((old) => {
                      const next = new Set(old);
                      if (e.target.checked) next.add(s.id);
                      else next.delete(s.id);
                      return next;
                    })
                  }
                />
                {s.name} <span className="text-ink-soft">({s.className})</span>
              </label>
            ))}
            {students.length === 0 ? <p className="hint">No students in your classes.</p> : null}
          </div>
        ) : null}
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-3">
        <div className="field">
          <label htmlFor="assign-version" className="label">
            Version
          </label>
          <select id="assign-version" className="input" value={versionNumber} onChange={(e) => setVersion(Number(e.target.value))}>
            {versions.map((v) => (
              <option key={v} value={v}>
                Version {v}
              </option>
            ))}
          </select>
        </div>
        <div className="field">
          <label htmlFor="assign-due" className="label">
            Due date (optional)
          </label>
          <input
            id="assign-due"
            type="date"
            min={today}
            className="input"
            value={dueOn}
            onChange={(e) => setDueOn(e.target.value)}
            aria-invalid={!!result?.fields?.dueOn}
          />
          {result?.fields?.dueOn ? <span className="field-error">{result.fields.dueOn}</span> : null}
        </div>
        <div className="field">
          <label htmlFor="assign-note" className="label">
            Aircraft or station (optional)
          </label>
          <input id="assign-note" className="input" value={note} maxLength={300} onChange={(e) => setNote(e.target.value)} />
        </div>
        {bookings.length ? (
          <div className="field">
            <label htmlFor="assign-booking" className="label">
              Done in a hangar booking (optional)
            </label>
            <select id="assign-booking" className="input" value={bookingId} onChange={(e) => setBookingId(e.target.value)}>
              <option value="">No booking</option>
              {bookings.map((b) => (
                <option key={b.id} value={b.id}>
                  {b.label}
                </option>
              ))}
            </select>
            <span className="hint">The booked aircraft is named on each student&apos;s run.</span>
          </div>
        ) : null}
      </div>
      <p className="font-semibold" aria-live="polite">
        {giving}
      </p>
      {duplicates ? (
        <div role="alertdialog" aria-labelledby="assign-duplicates" className="notice-todo flex flex-col gap-2">
          <p id="assign-duplicates">{duplicates}</p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn btn-primary" disabled={busy} onClick={() => void submit(true)}>
              Assign anyway
            </button>
            <button type="button" className="btn btn-secondary" onClick={() => setDuplicates(null)}>
              Change who gets it
            </button>
          </div>
        </div>
      ) : (
        <button type="submit" className="btn btn-primary self-start" disabled={busy || (to === "students" && chosen.size === 0)}>
          Assign
        </button>
      )}
      {result ? (
        <p role={result.ok ? "status" : "alert"} className={result.ok ? "notice-ok" : "notice-error"}>
          {result.text}
        </p>
      ) : null}
    </form>
  );
}

"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, call } from "@/lib/client/api";
import type { AssignmentDto } from "@/lib/contracts/runs";
import { runsApi } from "@/lib/contracts/endpoints/runs";

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** What withdrawing does to this assignment's runs, said before it is done. */
export function withdrawImpact(counts: AssignmentDto["counts"]): string[] {
  const open = counts.not_started;
  const started = counts.in_progress + counts.submitted + counts.returned;
  const lines: string[] = [];
  if (open) lines.push(`${plural(open, "run not started leaves", "runs not started leave")} the students' work.`);
  if (started)
    lines.push(
      `${plural(started, "run already started leaves", "runs already started leave")} the students' work and the review queue: what was done is kept, nothing more can be added.`,
    );
  if (counts.signed_off)
    lines.push(`${plural(counts.signed_off, "signed-off run stays", "signed-off runs stay")} in the records as it is.`);
  return lines;
}

/** Change the due date or note of an assignment, or withdraw it (saying first what happens to its runs). */
export function AssignmentActions({ assignment, today }: { assignment: AssignmentDto; today: string }) {
  const router = useRouter();
  const [mode, setMode] = useState<"idle" | "edit" | "withdraw">("idle");
  const [dueOn, setDueOn] = useState(assignment.dueOn ?? "");
  const [note, setNote] = useState(assignment.note);
  const [reason, setReason] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  if (assignment.withdrawnAt)
    return (
      <p>
        Withdrawn {assignment.withdrawnAt.slice(0, 10)}
        {assignment.withdrawReason ? `: ${assignment.withdrawReason}` : ""}
      </p>
    );

  const act = async (work: () => Promise<unknown>) => {
    setBusy(true);
    setError(null);
    try {
      await work();
      setMode("idle");
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? (Object.values(e.fields)[0] ?? e.message) : "That did not work. Try again.");
    } finally {
      setBusy(false);
    }
  };
  const label = `${assignment.className ?? "chosen students"}, given ${assignment.createdAt.slice(0, 10)}`;

  if (mode === "edit")
    return (
      <form
        className="flex flex-col gap-2"
        aria-label={`Change the assignment to ${label}`}
        onSubmit={(e) => {
          e.preventDefault();
          void act(() => call(runsApi.updateAssignment, { params: { id: assignment.id }, body: { dueOn: dueOn || null, note } }));
        }}
      >
        <label className="field">
          <span className="label">Due date</span>
          <input type="date" className="input" min={today} value={dueOn} onChange={(e) => setDueOn(e.target.value)} />
        </label>
        <label className="field">
          <span className="label">Aircraft or station</span>
          <input className="input" maxLength={300} value={note} onChange={(e) => setNote(e.target.value)} />
        </label>
        {error ? (
          <p role="alert" className="field-error">
            {error}
          </p>
        ) : null}
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="btn btn-primary btn-small" disabled={busy}>
            Save the change
          </button>
          <button type="button" className="btn btn-secondary btn-small" onClick={() => setMode("idle")}>
            Cancel
          </button>
        </div>
      </form>
    );

  if (mode === "withdraw")
    return (
      <form
        role="alertdialog"
        aria-label={`Withdraw the assignment to ${label}`}
        className="notice-todo flex flex-col gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          void act(() => call(runsApi.withdrawAssignment, { params: { id: assignment.id }, body: { reason } }));
        }}
      >
        <p>Withdrawing this assignment:</p>
        <ul className="list-disc pl-6 font-normal">
          {withdrawImpact(assignment.counts).map((l) => (
            <li key={l}>{l}</li>
          ))}
        </ul>
        <label className="field">
          <span className="label">Why (the students see it)</span>
          <input className="input" required maxLength={300} value={reason} onChange={(e) => setReason(e.target.value)} autoFocus />
        </label>
        {error ? (
          <p role="alert" className="field-error">
            {error}
          </p>
        ) : null}
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="btn btn-danger btn-small" disabled={busy}>
            Withdraw now
          </button>
          <button type="button" className="btn btn-secondary btn-small" onClick={() => setMode("idle")}>
            Keep it
          </button>
        </div>
      </form>
    );

  return (
    <div className="flex flex-wrap gap-2">
      <button
        type="button"
        className="btn btn-secondary btn-small"
        onClick={() => setMode("edit")}
        aria-label={`Change due date or note: ${label}`}
      >
        Change due date or note
      </button>
      <button type="button" className="btn btn-danger btn-small" onClick={() => setMode("withdraw")} aria-label={`Withdraw: ${label}`}>
        Withdraw…
      </button>
    </div>
  );
}

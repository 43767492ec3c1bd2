"use client";

import { useState } from "react";
import type { Act, StepState } from "./use-run";

/** Notes on a step: added as events (even after a buy-off), listed in order. */
export function StepNotes({ stepId, notes, locked, onAct }: { stepId: string; notes: StepState["notes"]; locked: boolean; onAct: Act }) {
  const [note, setNote] = useState("");
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={`note-${stepId}`} className="label">
        Note on this step
      </label>
      <textarea
        id={`note-${stepId}`}
        className="input min-h-20"
        value={note}
        maxLength={2000}
        onChange={(e) => setNote(e.target.value)}
        disabled={locked}
      />
      <button
        type="button"
        className="btn btn-secondary self-start"
        disabled={locked || !note.trim()}
        onClick={() => void onAct("note.added", { stepId, payload: { text: note.trim() } }).then(() => setNote(""))}
      >
        Add note
      </button>
      {notes.length ? (
        <ul className="flex flex-col gap-1" aria-label="Notes">
          {notes.map((n, j) => (
            <li key={j} className="rounded border border-line bg-paper px-3 py-2">
              {n.text}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

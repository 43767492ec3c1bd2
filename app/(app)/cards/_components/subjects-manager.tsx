"use client";

import { useState } from "react";
import { ApiError } from "@/lib/client/api";
import type { SubjectDto } from "@/lib/contracts/cards";
import { useSaveSubject, useSubjects } from "./use-cards";

export function SubjectsManager({ initialSubjects }: { initialSubjects: SubjectDto[] }) {
  const { data: subjects } = useSubjects(initialSubjects);
  const saveSubject = useSaveSubject();
  const [name, setName] = useState("");
  const [editing, setEditing] = useState<{ id: string; name: string } | null>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const submit = (input: { id?: string; name: string }, done: string) =>
    saveSubject
      .mutateAsync(input)
      .then(() => {
        setMessage({ ok: true, text: done });
        setName("");
        setEditing(null);
      })
      .catch((error: unknown) => setMessage({ ok: false, text: error instanceof ApiError ? error.message : "That did not work." }));

  return (
    <div className="flex flex-col gap-4">
      <form
        className="panel flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          void submit({ name }, `“${name.trim()}” is in the list.`);
        }}
      >
        <label className="field min-w-72 flex-1">
          <span className="label">New subject</span>
          <input className="input" value={name} onChange={(e) => setName(e.target.value)} maxLength={120} required />
        </label>
        <button type="submit" className="btn btn-primary" disabled={saveSubject.isPending}>
          Add subject
        </button>
      </form>
      <p aria-live="polite" className={message ? (message.ok ? "notice-ok" : "notice-error") : ""}>
        {message?.text ?? ""}
      </p>
      <ul className="panel flex flex-col divide-y divide-line">
        {subjects.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center gap-3 py-2">
            {editing?.id === s.id ? (
              <form
                className="flex flex-1 flex-wrap items-end gap-2"
                onSubmit={(e) => {
                  e.preventDefault();
                  void submit(editing, "Renamed.");
                }}
              >
                <label className="field flex-1">
                  <span className="label">Name of “{s.name}”</span>
                  <input
                    className="input"
                    value={editing.name}
                    onChange={(e) => setEditing({ id: s.id, name: e.target.value })}
                    autoFocus
                  />
                </label>
                <button type="submit" className="btn btn-primary">
                  Save
                </button>
                <button type="button" className="btn btn-secondary" onClick={() => setEditing(null)}>
                  Cancel
                </button>
              </form>
            ) : (
              <>
                <span className="flex-1 font-semibold">{s.name}</span>
                <button
                  type="button"
                  className="btn btn-secondary btn-small"
                  onClick={() => setEditing({ id: s.id, name: s.name })}
                  aria-label={`Rename ${s.name}`}
                >
                  Rename
                </button>
              </>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}

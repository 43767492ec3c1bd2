"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError } from "@/lib/client/api";
import type { SubjectDto } from "@/lib/contracts/cards";
import { useCreateCard } from "./use-cards";

/** Title and subject first; the editor does the rest, saving as it goes. */
export function NewCardForm({ subjects }: { subjects: SubjectDto[] }) {
  const router = useRouter();
  const create = useCreateCard();
  const [error, setError] = useState<string | null>(null);
  return (
    <form
      className="panel flex max-w-2xl flex-col gap-4"
      onSubmit={(e) => {
        e.preventDefault();
        setError(null);
        // Read from the form itself: typing before the page is interactive is not lost.
        const data = new FormData(e.currentTarget);
        const title = String(data.get("title") ?? "");
        const subjectId = String(data.get("subjectId") ?? "");
        create
          .mutateAsync({ title, subjectId: subjectId || null, steps: [{ id: crypto.randomUUID(), text: "" }] })
          .then((card) => router.push(`/cards/${card.id}/edit`))
          .catch((err: unknown) => setError(err instanceof ApiError ? err.message : "The card could not be made."));
      }}
    >
      <label className="field">
        <span className="label">Title</span>
        <input name="title" className="input text-lg" required maxLength={160} aria-describedby="new-card-error" />
      </label>
      <label className="field">
        <span className="label">Curriculum subject</span>
        <select name="subjectId" className="input" defaultValue="">
          <option value="">Choose later</option>
          {subjects.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      </label>
      <p id="new-card-error" aria-live="polite" className={error ? "notice-error" : ""}>
        {error ?? ""}
      </p>
      <button type="submit" className="btn btn-primary self-start" disabled={create.isPending}>
        {create.isPending ? "Making the draft…" : "Make the draft and open the editor"}
      </button>
    </form>
  );
}

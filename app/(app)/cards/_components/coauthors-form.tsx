"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError } from "@/lib/client/api";
import type { CardDto } from "@/lib/contracts/cards";
import { useSetCoauthors } from "./use-cards";

/** The owner names the colleagues who may edit, publish and archive the card with them. */
export function CoauthorsForm({ card, colleagues }: { card: CardDto; colleagues: { id: string; name: string }[] }) {
  const router = useRouter();
  const save = useSetCoauthors(card.id);
  const [chosen, setChosen] = useState(() => new Set(card.coauthors.map((c) => c.id)));
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const others = colleagues.filter((c) => c.id !== card.ownerId);
  return (
    <details className="flex flex-col gap-2">
      <summary className="inline-flex min-h-11 cursor-pointer items-center font-bold">Co-authors ({card.coauthors.length})</summary>
      <form
        className="flex flex-col gap-2"
        onSubmit={(event) => {
          event.preventDefault();
          save
            .mutateAsync([...chosen])
            .then(() => {
              setMessage({ ok: true, text: "Co-authors saved." });
              router.refresh();
            })
            .catch((error: unknown) => setMessage({ ok: false, text: error instanceof ApiError ? error.message : "That did not work." }));
        }}
      >
        <fieldset className="flex flex-wrap gap-3">
          <legend className="hint">They can edit, publish and archive this card as you can.</legend>
          {others.map((c) => (
            <label key={c.id} className="inline-flex min-h-11 items-center gap-2">
              <input
                type="checkbox"
                className="h-6 w-6"
                checked={chosen.has(c.id)}
                onChange={(e) =>
                  setChosen((old) => {
                    const next = new Set(old);
                    if (e.target.checked) next.add(c.id);
                    else next.delete(c.id);
                    return next;
                  })
                }
              />
              {c.name}
            </label>
          ))}
        </fieldset>
        <div>
          <button type="submit" className="btn btn-secondary" disabled={save.isPending}>
            Save co-authors
          </button>
        </div>
        <p aria-live="polite" className={message ? (message.ok ? "notice-ok" : "notice-error") : ""}>
          {message?.text ?? ""}
        </p>
      </form>
    </details>
  );
}

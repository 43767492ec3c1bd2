"use client";

import { useRouter } from "next/navigation";
import { useState, type ReactNode } from "react";
import { ApiError, call } from "@/lib/client/api";
import { cardsApi } from "@/lib/contracts/endpoints/cards";

interface Item {
  id: string;
  stepNumber: number;
  heading: string;
  stepText: string;
  suggestedPage: number | null;
  similarity: number;
  newLabel: string;
  pageCount: number | null;
  diff: ReactNode;
}

type Choice = { action: "accept" | "relink" | "drop"; page: string };

export function RecheckForm({ cardId, items }: { cardId: string; items: Item[] }) {
  const router = useRouter();
  const [choices, setChoices] = useState<Record<string, Choice>>(() =>
    Object.fromEntries(items.map((i) => [i.id, { action: i.suggestedPage ? "accept" : "relink", page: "" }])),
  );
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (id: string, change: Partial<Choice>) => setChoices((c) => ({ ...c, [id]: { ...c[id]!, ...change } }));

  const finish = async () => {
    setError(null);
    setBusy(true);
    try {
      const decisions = items.map((i) => {
        const c = choices[i.id]!;
        return c.action === "relink" ? { id: i.id, action: c.action, page: Number(c.page) } : { id: i.id, action: c.action };
      });
      await call(cardsApi.applyRechecks, { params: { id: cardId }, body: { decisions } });
      router.push(`/cards/${cardId}/edit`);
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "The recheck could not be saved.");
    } finally {
      setBusy(false);
    }
  };

  return (
    <form
      className="flex flex-col gap-6"
      aria-label="Recheck citations"
      onSubmit={(e) => {
        e.preventDefault();
        void finish();
      }}
    >
      {items.map((item) => {
        const c = choices[item.id]!;
        const name = `recheck-${item.id}`;
        return (
          <fieldset key={item.id} className="flex flex-col gap-3 rounded-lg border-2 border-line p-4">
            <legend className="px-1 text-lg font-bold">{item.heading}</legend>
            {item.stepText ? <p className="text-ink-soft">The step says: “{item.stepText.slice(0, 200)}”</p> : null}
            {item.diff}
            <div className="flex flex-wrap items-end gap-4">
              <label className="flex min-h-11 items-center gap-2 font-semibold">
                <input
                  type="radio"
                  name={name}
                  className="h-6 w-6"
                  checked={c.action === "accept"}
                  disabled={!item.suggestedPage}
                  onChange={() => set(item.id, { action: "accept" })}
                />
                {item.suggestedPage ? `Cite page ${item.suggestedPage} of ${item.newLabel}` : "No suggestion to keep"}
              </label>
              <label className="flex min-h-11 items-center gap-2 font-semibold">
                <input
                  type="radio"
                  name={name}
                  className="h-6 w-6"
                  checked={c.action === "relink"}
                  onChange={() => set(item.id, { action: "relink" })}
                />
                Cite another page of {item.newLabel}:
              </label>
              <label className="field w-32">
                <span className="label">Page</span>
                <input
                  className="input"
                  inputMode="numeric"
                  value={c.page}
                  onChange={(e) => set(item.id, { action: "relink", page: e.target.value })}
                  aria-label={`Page of ${item.newLabel} for step ${item.stepNumber}`}
                  placeholder={item.pageCount ? `1–${item.pageCount}` : ""}
                />
              </label>
              <label className="flex min-h-11 items-center gap-2 font-semibold">
                <input
                  type="radio"
                  name={name}
                  className="h-6 w-6"
                  checked={c.action === "drop"}
                  onChange={() => set(item.id, { action: "drop" })}
                />
                Drop this citation
              </label>
            </div>
          </fieldset>
        );
      })}
      <p aria-live="polite" className={error ? "notice-error" : ""}>
        {error ?? ""}
      </p>
      <button type="submit" className="btn btn-primary self-start" disabled={busy}>
        {busy ? "Saving…" : "Finish: make the new draft version"}
      </button>
    </form>
  );
}

"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError } from "@/lib/client/api";
import type { CardDto } from "@/lib/contracts/cards";
import { useCardAction } from "./use-cards";

/** What an author can do with a card from its page. */
export function CardActions({ card }: { card: CardDto }) {
  const router = useRouter();
  const action = useCardAction(card.id);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const run = (what: Parameters<typeof action.mutateAsync>[0], done: string) =>
    action
      .mutateAsync(what)
      .then((result) => {
        if (what === "duplicate" && result && "card" in result) return router.push(`/cards/${result.card.id}/edit`);
        setMessage({ ok: true, text: done });
        router.refresh();
      })
      .catch((error: unknown) => setMessage({ ok: false, text: error instanceof ApiError ? error.message : "That did not work." }));

  const archived = !!card.archivedAt;
  return (
    <div className="flex flex-col gap-3">
      {card.canEdit ? null : (
        <p className="hint">
          {card.ownerName ?? "Another author"} owns this card: only the owner, the co-authors they name or an admin can change it. Duplicate
          it to make a card of your own.
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        {archived || !card.canEdit ? null : (
          <Link href={`/cards/${card.id}/edit`} className="btn btn-primary">
            {card.draft ? `Edit draft v${card.draft.number}` : "Edit (makes a new draft)"}
          </Link>
        )}
        {card.draft && !archived && card.canEdit ? (
          <button
            type="button"
            className="btn btn-primary"
            disabled={action.isPending}
            onClick={() => void run("publish", `Version ${card.draft!.number} is published.`)}
          >
            Publish draft v{card.draft.number}
          </button>
        ) : null}
        <button type="button" className="btn btn-secondary" disabled={action.isPending} onClick={() => void run("duplicate", "")}>
          Duplicate
        </button>
        {card.draft && card.published && !archived && card.canEdit ? (
          <button
            type="button"
            className="btn btn-danger"
            disabled={action.isPending}
            onClick={() => void run("discard", "The draft was discarded.")}
          >
            Discard draft
          </button>
        ) : null}
        {card.canEdit ? (
          <button
            type="button"
            className="btn btn-danger"
            disabled={action.isPending}
            onClick={() => void run(archived ? "restore" : "archive", archived ? "The card is back in the list." : "The card is archived.")}
          >
            {archived ? "Bring back from the archive" : "Archive"}
          </button>
        ) : null}
      </div>
      <p aria-live="polite" className={message ? (message.ok ? "notice-ok" : "notice-error") : ""}>
        {message?.text ?? ""}
      </p>
    </div>
  );
}

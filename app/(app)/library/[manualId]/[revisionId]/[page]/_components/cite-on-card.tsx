"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useEffect, useState } from "react";
import { ApiError, call } from "@/lib/client/api";
import { readCitingTarget, writeCitingTarget, type CitingTarget } from "@/lib/client/citing-target";
import { cardsApi } from "@/lib/contracts/endpoints/cards";

/** The page the reader shows now: it keeps the URL's last segment current while scrolling. */
function currentPage(fallback: number): number {
  const last = Number(window.location.pathname.split("/").at(-1));
  return Number.isInteger(last) && last > 0 ? last : fallback;
}

/**
 * "Put this page on a card": with a card draft open for citing, the reader adds the page it shows
 * (and any selected words as the quote) to the chosen step.
 */
export function CiteOnCard({
  userId,
  revisionId,
  revisionLabel,
  superseded,
  initialPage,
}: {
  userId: string;
  revisionId: string;
  revisionLabel: string;
  superseded: boolean;
  initialPage: number;
}) {
  const [target, setTarget] = useState<CitingTarget | null>(null);
  const [stepId, setStepId] = useState("");
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const client = useQueryClient();

  useEffect(() => {
    // localStorage exists only in the browser: read after mount, not during the server render.
    const found = readCitingTarget(userId);
    // eslint-disable-next-line react-hooks/set-state-in-effect
    setTarget(found);
    if (found?.stepId) setStepId(found.stepId);
  }, [userId]);

  const cardKey = ["cards", "card", target?.cardId ?? null];
  const card = useQuery({
    queryKey: cardKey,
    queryFn: async () => (await call(cardsApi.get, { params: { id: target!.cardId } })).card,
    enabled: !!target,
  });
  const cite = useMutation({
    mutationFn: async (input: { stepId: string; revisionId: string; page: number; quote: string }) =>
      (await call(cardsApi.citePage, { params: { id: target!.cardId }, body: input })).citation,
    onSuccess: () => client.invalidateQueries({ queryKey: cardKey }),
  });

  if (!target) return null;
  const version = card.data?.draft ?? card.data?.published;
  const steps = version?.steps ?? [];
  const chosen = stepId && steps.some((s) => s.id === stepId) ? stepId : (steps[0]?.id ?? "");

  const add = () => {
    const page = currentPage(initialPage);
    const quote = (window.getSelection()?.toString() ?? "").replace(/\s+/g, " ").trim().slice(0, 300);
    setMessage(null);
    cite
      .mutateAsync({ stepId: chosen, revisionId, page, quote })
      .then((r) =>
        setMessage({
          ok: true,
          text: r.added
            ? `Page ${page} is on step ${r.stepNumber} of draft version ${r.versionNumber}.`
            : `Page ${page} was already on step ${r.stepNumber}.`,
        }),
      )
      .catch((error: unknown) =>
        setMessage({ ok: false, text: error instanceof ApiError ? error.message : "The page could not be added." }),
      );
  };

  return (
    <section
      className="flex w-full flex-wrap items-end gap-3 rounded-md border-4 border-teal bg-teal-pale p-3"
      aria-label="Cite this page on a task card"
    >
      <p className="w-full font-semibold">
        Citing pages for the card <Link href={`/cards/${target.cardId}/edit`}>{target.title}</Link>
        {superseded ? <span className="ml-2 text-danger">— {revisionLabel} is superseded: cite the current revision instead.</span> : null}
      </p>
      <label className="field">
        <span className="label">Step</span>
        <select className="input max-w-96" value={chosen} onChange={(e) => setStepId(e.target.value)} disabled={!steps.length}>
          {steps.map((s, i) => (
            <option key={s.id} value={s.id}>
              Step {i + 1}: {s.text.slice(0, 50) || "(no instruction yet)"}
            </option>
          ))}
        </select>
      </label>
      <button type="button" className="btn btn-primary" onClick={add} disabled={!chosen || cite.isPending}>
        Put this page on the step
      </button>
      <Link href={`/cards/${target.cardId}/edit`} className="btn btn-secondary">
        Back to the card
      </Link>
      <button
        type="button"
        className="btn btn-secondary"
        onClick={() => {
          writeCitingTarget(userId, null);
          setTarget(null);
        }}
      >
        Stop citing
      </button>
      <p className="hint w-full">Select words on the page first to quote them with the citation.</p>
      <p aria-live="polite" className={`w-full ${message ? (message.ok ? "notice-ok" : "notice-error") : ""}`}>
        {message?.text ?? ""}
      </p>
      {card.error ? <p className="notice-error w-full">The card could not be loaded; it may have been archived.</p> : null}
    </section>
  );
}

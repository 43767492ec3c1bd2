"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useEffect, useState } from "react";
import { readerPageEvent } from "@/components/reader-events";
import { ApiError, call } from "@/lib/client/api";
import type { PageMarkDto } from "@/lib/contracts/marks";
import { libraryApi } from "@/lib/contracts/endpoints/library";

const where = (m: PageMarkDto) => {
  if (!m.here) return `made on ${m.made.revisionLabel}, page ${m.made.page}`;
  if (m.here.page === null) return `its page (${m.made.revisionLabel}, page ${m.made.page}) was removed in this revision`;
  if (m.here.status === "moved") return `moved here from ${m.made.revisionLabel}, page ${m.made.page}`;
  if (m.here.status === "changed") return `the page changed since ${m.made.revisionLabel}: check it still says what was marked`;
  return "";
};

/**
 * Bookmarks and notes in the reader: a bookmark for the page shown, a note (an instructor may show
 * it to a class), the notes on this page in full, and every mark of the manual placed in this
 * revision, each saying when its page moved, changed or went.
 */
export function PageMarks({
  manualId,
  revisionId,
  initialPage,
  baseHref,
  classes,
}: {
  manualId: string;
  revisionId: string;
  initialPage: number;
  baseHref: string;
  /** The classes the reader teaches: a note can be shown to one of them. */
  classes: { id: string; name: string }[];
}) {
  const [page, setPage] = useState(initialPage);
  const [open, setOpen] = useState(false);
  const [writing, setWriting] = useState(false);
  const [text, setText] = useState("");
  const [classId, setClassId] = useState("");
  const [message, setMessage] = useState<string | null>(null);
  const client = useQueryClient();
  const key = ["marks", manualId, revisionId];
  const marks = useQuery({
    queryKey: key,
    queryFn: () => call(libraryApi.listMarks, { params: { id: manualId }, query: { revision: revisionId } }),
  });

  useEffect(() => {
    const onPage = (event: Event) => setPage((event as CustomEvent<number>).detail);
    window.addEventListener(readerPageEvent, onPage);
    return () => window.removeEventListener(readerPageEvent, onPage);
  }, []);

  const add = useMutation({
    mutationFn: (body: { kind: "bookmark" | "note"; text?: string; classId?: string | null }) =>
      call(libraryApi.createMark, { body: { revisionId, page, kind: body.kind, text: body.text ?? "", classId: body.classId ?? null } }),
    onSuccess: (_d, body) => {
      setMessage(body.kind === "bookmark" ? `Page ${page} is bookmarked.` : `Your note is on page ${page}.`);
      setWriting(false);
      setText("");
      void client.invalidateQueries({ queryKey: key });
    },
    onError: (e) => setMessage(e instanceof ApiError ? (Object.values(e.fields)[0] ?? e.message) : "Not saved. Try again."),
  });
  const remove = useMutation({
    mutationFn: (id: string) => call(libraryApi.deleteMark, { params: { id } }),
    onSuccess: () => void client.invalidateQueries({ queryKey: key }),
  });

  const all = marks.data?.marks ?? [];
  const here = all.filter((m) => m.here?.page === page);
  const notesHere = here.filter((m) => m.kind === "note");
  const bookmarked = here.some((m) => m.kind === "bookmark" && m.mine);

  return (
    <>
      <button
        type="button"
        className={`btn btn-small ${notesHere.length ? "btn-primary" : "btn-secondary"}`}
        aria-expanded={open}
        aria-controls="page-marks"
        onClick={() => setOpen((o) => !o)}
      >
        {/* Short below wide screens, so the bar stays one row on a 1024-pixel cart screen. */}
        {notesHere.length ? (
          <>
            NOTE<span className="sr-only xl:not-sr-only"> on this page</span> ({notesHere.length})
          </>
        ) : (
          <>
            {bookmarked ? "★" : "☆"}
            <span className="sr-only xl:not-sr-only"> Marks</span>
          </>
        )}
      </button>
      {open ? (
        <div id="page-marks" className="order-last flex w-full flex-col gap-2 border-t-2 border-line pt-2">
          <div className="flex flex-wrap items-center gap-2">
            <button
              type="button"
              className="btn btn-secondary btn-small"
              aria-pressed={bookmarked}
              disabled={add.isPending || bookmarked}
              title={bookmarked ? "This page is already in your bookmarks." : undefined}
              onClick={() => add.mutate({ kind: "bookmark" })}
            >
              {bookmarked ? `★ Page ${page} bookmarked` : `☆ Bookmark page ${page}`}
            </button>
            <button type="button" className="btn btn-secondary btn-small" aria-expanded={writing} onClick={() => setWriting((w) => !w)}>
              Note on page {page}…
            </button>
            {message ? (
              <span role="status" className="font-semibold">
                {message}
              </span>
            ) : null}
          </div>
          {notesHere.length ? (
            <ul aria-label={`Notes on page ${page}`} className="flex flex-col gap-1">
              {notesHere.map((m) => (
                <li key={m.id} className="notice-todo py-1">
                  NOTE from {m.authorName}
                  {m.className ? ` to ${m.className}` : ""}: <span className="font-normal">{m.text}</span>
                  {m.here?.status === "changed" || m.here?.status === "moved" ? (
                    <span className="block text-sm font-normal">({where(m)})</span>
                  ) : null}
                </li>
              ))}
            </ul>
          ) : null}
          {writing ? (
            <form
              className="panel flex flex-col gap-2 p-3"
              aria-label={`A note on page ${page}`}
              onSubmit={(e) => {
                e.preventDefault();
                add.mutate({ kind: "note", text, classId: classId || null });
              }}
            >
              <label className="field">
                <span className="label">Note</span>
                <textarea className="input min-h-16" maxLength={2000} value={text} onChange={(e) => setText(e.target.value)} />
              </label>
              {classes.length ? (
                <label className="field">
                  <span className="label">Who sees it</span>
                  <select className="input" value={classId} onChange={(e) => setClassId(e.target.value)}>
                    <option value="">Only me</option>
                    {classes.map((c) => (
                      <option key={c.id} value={c.id}>
                        Everyone in {c.name}
                      </option>
                    ))}
                  </select>
                </label>
              ) : null}
              <div className="flex gap-2">
                <button type="submit" className="btn btn-primary btn-small" disabled={add.isPending || !text.trim()}>
                  Save the note
                </button>
                <button type="button" className="btn btn-secondary btn-small" onClick={() => setWriting(false)}>
                  Cancel
                </button>
              </div>
            </form>
          ) : null}
          <section aria-label="Bookmarks and notes in this manual" className="panel p-3">
            {all.length === 0 ? (
              <p>No bookmarks or notes in this manual yet.</p>
            ) : (
              <ul className="flex flex-col gap-1">
                {all.map((m) => (
                  <li key={m.id} className="flex flex-wrap items-center gap-x-3">
                    {m.here?.page ? (
                      <Link
                        href={`${baseHref}/${m.here.page}`}
                        prefetch={false}
                        className="inline-flex min-h-11 items-center font-semibold"
                      >
                        {m.kind === "bookmark" ? "★" : "NOTE"} page {m.here.page}
                      </Link>
                    ) : (
                      <span className="font-semibold">{m.kind === "bookmark" ? "★" : "NOTE"} (no page here)</span>
                    )}
                    {m.kind === "note" ? <span>{m.text}</span> : null}
                    {!m.mine ? <span className="text-ink-soft">from {m.authorName}</span> : null}
                    {where(m) ? <span className="text-ink-soft">— {where(m)}</span> : null}
                    {m.mine ? (
                      <button type="button" className="btn btn-secondary btn-small" onClick={() => remove.mutate(m.id)}>
                        Remove
                      </button>
                    ) : null}
                  </li>
                ))}
              </ul>
            )}
          </section>
        </div>
      ) : null}
    </>
  );
}

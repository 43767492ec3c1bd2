"use client";

import { useEffect, useState } from "react";
import { readerPageEvent } from "@/components/reader-events";
import { MarkedText } from "@/components/marked-text";
import { call } from "@/lib/client/api";
import { libraryApi } from "@/lib/contracts/endpoints/library";
import { highlightWords } from "@/lib/domain/library/highlight";

/**
 * The text of the page the reader shows (for reading aloud, copying, or a slow connection): it
 * follows the reader as it moves, fetched when the reader settles on another page.
 */
export function PageText({
  revisionId,
  initial,
  q,
  corrections,
}: {
  revisionId: string;
  initial: { page: number; text: string; ocr: boolean };
  q: string;
  corrections: string[];
}) {
  const [shown, setShown] = useState(initial);
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    let latest = initial.page;
    const onPage = (event: Event) => {
      const page = (event as CustomEvent<number>).detail;
      if (page === latest) return;
      latest = page;
      call(libraryApi.page, { params: { id: revisionId, n: page } })
        .then((answer) => {
          if (latest !== page) return;
          setFailed(false);
          setShown({ page, text: String(answer.text ?? ""), ocr: answer.ocr === true });
        })
        .catch(() => latest === page && setFailed(true));
    };
    window.addEventListener(readerPageEvent, onPage);
    return () => window.removeEventListener(readerPageEvent, onPage);
  }, [revisionId, initial.page]);
  return (
    <details className="panel">
      <summary className="cursor-pointer py-2 font-semibold">
        Text of page {shown.page} (for reading aloud, copying, or a slow connection)
      </summary>
      <article className="mt-2 whitespace-pre-line leading-relaxed" aria-label={`Text of page ${shown.page}`}>
        {failed ? <p className="notice-error">The text of this page did not arrive. Check the connection.</p> : null}
        {shown.ocr ? (
          <p className="hint mb-2">This page is a scan; its text was read by OCR and may hold errors. Check against the PDF.</p>
        ) : null}
        <MarkedText snippet={highlightWords(shown.text, q, corrections)} />
      </article>
    </details>
  );
}

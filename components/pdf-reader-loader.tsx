"use client";

import dynamic from "next/dynamic";
import { useCallback, useEffect } from "react";
import { prefetchFirstRanges, startPdfWorker } from "./pdf-prefetch";
import type { PdfReaderProps } from "./pdf-reader";

// pdf.js's worker starts while this small module is evaluated, and the reader's own chunk
// (react-pdf and pdf.js, most of the page's script) is asked for at the same moment rather than
// when React first renders the reader after hydration. Fetching and compiling that chunk is still
// the largest wait before the first page (about 0.4 s in bench:reader).
const readerChunk = typeof window !== "undefined" ? (startPdfWorker(), import("./pdf-reader")) : null;

// pdf.js needs the browser (canvas, workers): the reader is never rendered on the server.
const PdfReader = dynamic(() => (readerChunk ?? import("./pdf-reader")).then((m) => m.PdfReader), {
  ssr: false,
  loading: () => <p role="status">Opening the reader…</p>,
});

export function PdfReaderLoader(props: Omit<PdfReaderProps, "pageHref"> & { baseHref: string; query: string }) {
  const { baseHref, query, ...rest } = props;
  const pageHref = useCallback((n: number) => `${baseHref}/${n}${query}`, [baseHref, query]);
  // The file's first bytes are on their way while the reader's code still loads.
  useEffect(() => prefetchFirstRanges(rest.fileUrl, rest.fileSize), [rest.fileUrl, rest.fileSize]);
  return <PdfReader {...rest} pageHref={pageHref} />;
}

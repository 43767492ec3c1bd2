"use client";

import dynamic from "next/dynamic";
import { useCallback } from "react";
import type { PdfReaderProps } from "./pdf-reader";

// pdf.js needs the browser (canvas, workers): the reader is never rendered on the server.
const PdfReader = dynamic(() => import("./pdf-reader").then((m) => m.PdfReader), {
  ssr: false,
  loading: () => <p role="status">Opening the reader…</p>,
});

export function PdfReaderLoader(props: Omit<PdfReaderProps, "pageHref"> & { baseHref: string; query: string }) {
  const { baseHref, query, ...rest } = props;
  const pageHref = useCallback((n: number) => `${baseHref}/${n}${query}`, [baseHref, query]);
  return <PdfReader {...rest} pageHref={pageHref} />;
}

"use client";

// One cited page from the run's offline packet (a Blob in IndexedDB), drawn by react-pdf. Works
// without network: the pdf.js worker and fonts are precached by the service worker.
import { useEffect, useRef, useState } from "react";
import { Document, Page, pdfjs } from "react-pdf";
import "react-pdf/dist/Page/TextLayer.css";

pdfjs.GlobalWorkerOptions.workerSrc = "/pdf.worker.min.mjs";

// One object for the component's life: a new options object makes react-pdf load the document
// again, from a buffer pdf.js has already handed to its worker.
const options = { standardFontDataUrl: "/standard_fonts/" };

export default function PacketPage({ file, page, label }: { file: Blob; page: number; label: string }) {
  const box = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(800);
  const [zoom, setZoom] = useState(1);
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => setWidth(Math.max(300, Math.floor(entry!.contentRect.width))));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-2">
        <button type="button" className="btn btn-secondary" onClick={() => setZoom((z) => Math.max(0.5, z - 0.25))} aria-label="Smaller">
          −
        </button>
        <button type="button" className="btn btn-secondary" onClick={() => setZoom(1)}>
          Fit width
        </button>
        <button type="button" className="btn btn-secondary" onClick={() => setZoom((z) => Math.min(3, z + 0.25))} aria-label="Larger">
          +
        </button>
      </div>
      <div ref={box} className="overflow-auto rounded-md border-2 border-line bg-white" aria-label={label}>
        <Document
          file={file}
          loading={<p role="status">Opening the page…</p>}
          error={<p className="notice-error">This page could not be opened.</p>}
          options={options}
        >
          <Page pageNumber={page} width={width * zoom} renderAnnotationLayer={false} />
        </Document>
      </div>
    </div>
  );
}

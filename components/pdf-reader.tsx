"use client";

// The reader: react-pdf (pdf.js) over the revision's file, loaded by HTTP range so a page deep in
// a large manual opens without the rest. Only pages near the viewport are drawn.
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { Document, Page, pdfjs } from "react-pdf";
import "react-pdf/dist/Page/TextLayer.css";
import { escapeHtml, escapeRegExp } from "@/lib/domain/escape";
import { chunkSize, getRange, takePdfWorker } from "./pdf-prefetch";

// Copied from pdfjs-dist by scripts/lib.mjs (copyPdfWorker) before every build.
pdfjs.GlobalWorkerOptions.workerSrc = "/pdf.worker.min.mjs";

// One worker for the page's life, started as soon as this code arrives: fetching and starting
// pdf.js's worker (a megabyte of script) then overlaps with React mounting the reader.
let sharedWorker: InstanceType<typeof pdfjs.PDFWorker> | null = null;
let earlyPort: Worker | null = null;
function readerWorker() {
  // A worker ended with an earlier document (leaving the reader and coming back) is replaced.
  if (!sharedWorker || sharedWorker.destroyed) {
    // pdf.js does not end a worker it was handed; this one is ended here once it is replaced.
    earlyPort?.terminate();
    earlyPort = takePdfWorker();
    sharedWorker = earlyPort ? pdfjs.PDFWorker.create({ port: earlyPort }) : new pdfjs.PDFWorker();
  }
  return sharedWorker;
}
if (typeof window !== "undefined") readerWorker();

const gap = 16;
const nearby = 2; // pages drawn above and below the visible ones

export interface PdfReaderProps {
  fileUrl: string;
  /** Bytes of the file: with it, every read is an HTTP range request of our own. */
  fileSize: number;
  pageCount: number;
  initialPage: number;
  /** Stems of the words to mark on the page (search terms and their corrections). */
  marks: string[];
  /** Address of page n, for the URL as the reader moves. */
  pageHref: (page: number) => string;
  /** Page pictures: `${thumbnailBase}/${n}/thumbnail` (made shortly after a revision is ready). */
  thumbnailBase: string;
}

/** The strip of page pictures beside the pages; a picture not made yet shows the page number only. */
function Thumbnails({ base, count, current, onPick }: { base: string; count: number; current: number; onPick: (n: number) => void }) {
  const list = useRef<HTMLOListElement>(null);
  // Keep the current page's picture in view, scrolling the strip only (scrollIntoView would move
  // the whole window and push the toolbar away).
  useEffect(() => {
    const box = list.current?.parentElement;
    const item = list.current?.querySelector<HTMLElement>(`[data-thumb="${current}"]`);
    if (!box || !item) return;
    const delta = item.getBoundingClientRect().top - box.getBoundingClientRect().top;
    if (delta < 0 || delta + item.offsetHeight > box.clientHeight) box.scrollTop += delta - (box.clientHeight - item.offsetHeight) / 2;
  }, [current]);
  return (
    <nav aria-label="Pages" className="hidden h-[75vh] w-36 shrink-0 overflow-y-auto rounded border border-line bg-white p-2 lg:block">
      <ol ref={list} className="flex flex-col gap-2">
        {Array.from({ length: count }, (_, i) => i + 1).map((n) => (
          <li key={n} data-thumb={n}>
            <button
              type="button"
              onClick={() => onPick(n)}
              aria-current={n === current ? "page" : undefined}
              aria-label={`Page ${n}`}
              className={`flex w-full flex-col items-center gap-1 rounded p-1 ${n === current ? "bg-teal-pale outline outline-2 outline-teal" : "hover:bg-paper"}`}
            >
              {/* eslint-disable-next-line @next/next/no-img-element -- small private PNGs, loaded as they scroll into view */}
              <img
                src={`${base}/${n}/thumbnail`}
                alt=""
                loading="lazy"
                width={110}
                height={142}
                className="h-auto w-[110px] border border-line bg-paper"
                onError={(e) => {
                  e.currentTarget.style.visibility = "hidden";
                }}
              />
              <span className="text-sm font-semibold">{n}</span>
            </button>
          </li>
        ))}
      </ol>
    </nav>
  );
}

/**
 * pdf.js fetches only the byte ranges it needs through this transport. (Its own range detection
 * needs a Content-Length on the first full response, which a streamed Next.js response lacks.)
 */
function rangeSource(fileUrl: string, fileSize: number, onError: () => void) {
  const transport = new pdfjs.PDFDataRangeTransport(fileSize, null);
  transport.requestDataRange = (begin: number, end: number) => {
    getRange(fileUrl, begin, end)
      .then((bytes) => transport.onDataRange(begin, bytes))
      .catch(onError);
  };
  return { range: transport };
}

/**
 * Runs `fn` once the frame now being prepared is on screen. The neighbours and the strip of 900
 * page pictures that follow the first page kept the main thread busy for about 0.7 s; started in
 * the same frame, they held the first page off the screen that long.
 */
function afterNextPaint(fn: () => void) {
  requestAnimationFrame(() => setTimeout(fn, 0));
}

/** The performance mark set once the page the reader opened at is on screen. */
export const pagePaintedMark = "hangarleaf:page-painted";

export function PdfReader({ fileUrl, fileSize, pageCount, initialPage, marks, pageHref, thumbnailBase }: PdfReaderProps) {
  const scroller = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(800);
  const [zoom, setZoom] = useState(1);
  const [fitWidth, setFitWidth] = useState(true);
  const [aspect, setAspect] = useState(11 / 8.5);
  const [current, setCurrent] = useState(initialPage);
  const [visible, setVisible] = useState<Set<number>>(new Set([initialPage]));
  const [goTo, setGoTo] = useState(String(initialPage));
  const [error, setError] = useState<string | null>(null);
  const jumped = useRef(false);
  // Until the page asked for is painted, nothing else competes with it for the network or the CPU:
  // its neighbours and the strip of page pictures come after.
  const [firstPainted, setFirstPainted] = useState(false);

  const pageWidth = fitWidth ? width : Math.round(612 * zoom * 1.3);
  const pageHeight = Math.round(pageWidth * aspect);
  const file = useMemo(
    () => rangeSource(fileUrl, fileSize, () => setError("Part of the PDF did not arrive. Check the connection and reload.")),
    [fileUrl, fileSize],
  );
  const options = useMemo(
    () => ({
      disableAutoFetch: true,
      disableStream: true,
      rangeChunkSize: chunkSize,
      standardFontDataUrl: "/standard_fonts/",
      worker: readerWorker(),
    }),
    [],
  );
  const pattern = useMemo(
    () => (marks.length ? new RegExp(`(${marks.map(escapeRegExp).join("|")})[\\p{L}\\p{N}]*`, "giu") : null),
    [marks],
  );

  useEffect(() => {
    const element = scroller.current;
    if (!element) return;
    const observer = new ResizeObserver(() => setWidth(Math.max(320, element.clientWidth - 32)));
    observer.observe(element);
    return () => observer.disconnect();
  }, []);

  const scrollToPage = useCallback(
    (page: number) => {
      const target = Math.min(Math.max(1, page), pageCount);
      scroller.current?.scrollTo({ top: (target - 1) * (pageHeight + gap), behavior: "instant" as ScrollBehavior });
      setCurrent(target);
      setGoTo(String(target));
    },
    [pageCount, pageHeight],
  );

  // Which pages are on screen, from the scroll position (every page slot has the same height).
  const onScroll = useCallback(() => {
    const element = scroller.current;
    if (!element) return;
    const first = Math.floor(element.scrollTop / (pageHeight + gap)) + 1;
    const last = Math.floor((element.scrollTop + element.clientHeight) / (pageHeight + gap)) + 1;
    const shown = new Set<number>();
    for (let p = Math.max(1, first - nearby); p <= Math.min(pageCount, last + nearby); p++) shown.add(p);
    setVisible(shown);
    const now = Math.min(pageCount, Math.max(1, Math.round(element.scrollTop / (pageHeight + gap)) + 1));
    setCurrent((before) => {
      if (before !== now) setGoTo(String(now));
      return now;
    });
  }, [pageCount, pageHeight]);

  // Once a link is followed out of the reader, the address is left alone: a replaceState while
  // the app router fetches the next page cancels that navigation (e2e: the superseded banner's link
  // stayed on the old revision when the page number changed as the neighbours appeared).
  const leaving = useRef(false);
  useEffect(() => {
    const onClick = (event: MouseEvent) => {
      const link = event.target instanceof Element ? event.target.closest("a[href]") : null;
      if (link && link.getAttribute("target") !== "_blank" && !link.hasAttribute("download")) leaving.current = true;
    };
    document.addEventListener("click", onClick, true);
    return () => document.removeEventListener("click", onClick, true);
  }, []);

  useEffect(() => {
    // Keep the address on the page being read, so it can be shared or cited. The history API, not
    // a router navigation: that would render the page again on the server and take the focus away.
    // Only when the address differs: a needless replaceState during a link's navigation (the page
    // strip or the neighbours appearing) can cancel that navigation in the app router.
    const timer = setTimeout(() => {
      if (leaving.current) return;
      const target = pageHref(current);
      if (`${window.location.pathname}${window.location.search}` !== target) window.history.replaceState(null, "", target);
    }, 400);
    return () => clearTimeout(timer);
  }, [current, pageHref]);

  const onKeyDown = (event: React.KeyboardEvent) => {
    if ((event.target as HTMLElement).tagName === "INPUT") return;
    if (event.key === "PageDown") {
      event.preventDefault();
      scrollToPage(current + 1);
    } else if (event.key === "PageUp") {
      event.preventDefault();
      scrollToPage(current - 1);
    } else if (event.key === "+" || event.key === "=") {
      setFitWidth(false);
      setZoom((z) => Math.min(3, z + 0.25));
    } else if (event.key === "-") {
      setFitWidth(false);
      setZoom((z) => Math.max(0.5, z - 0.25));
    }
  };

  return (
    <div className="flex flex-col gap-3" onKeyDown={onKeyDown}>
      <div role="toolbar" aria-label="Reader" className="panel flex flex-wrap items-center gap-2 py-2">
        <button type="button" className="btn btn-secondary btn-small" onClick={() => scrollToPage(current - 1)} disabled={current <= 1}>
          ← Previous page
        </button>
        <button
          type="button"
          className="btn btn-secondary btn-small"
          onClick={() => scrollToPage(current + 1)}
          disabled={current >= pageCount}
        >
          Next page →
        </button>
        <form
          className="flex items-center gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            const n = Number(goTo);
            if (Number.isInteger(n)) scrollToPage(n);
          }}
        >
          <label htmlFor="reader-go" className="label">
            Page
          </label>
          <input id="reader-go" className="input w-24" inputMode="numeric" value={goTo} onChange={(e) => setGoTo(e.target.value)} />
          <span>of {pageCount}</span>
          <button type="submit" className="btn btn-secondary btn-small">
            Go
          </button>
        </form>
        <span className="ml-auto flex items-center gap-2">
          <button
            type="button"
            className="btn btn-secondary btn-small"
            aria-label="Zoom out"
            onClick={() => {
              setFitWidth(false);
              setZoom((z) => Math.max(0.5, z - 0.25));
            }}
          >
            −
          </button>
          <span aria-live="polite" className="min-w-16 text-center">
            {fitWidth ? "Fit" : `${Math.round(zoom * 100)} %`}
          </span>
          <button
            type="button"
            className="btn btn-secondary btn-small"
            aria-label="Zoom in"
            onClick={() => {
              setFitWidth(false);
              setZoom((z) => Math.min(3, z + 0.25));
            }}
          >
            +
          </button>
          <button type="button" className="btn btn-secondary btn-small" aria-pressed={fitWidth} onClick={() => setFitWidth(true)}>
            Fit width
          </button>
        </span>
      </div>
      {error ? (
        <p className="notice-error" role="alert">
          {error}
        </p>
      ) : null}
      <div className="flex gap-3">
        {firstPainted ? (
          <Thumbnails base={thumbnailBase} count={pageCount} current={current} onPick={scrollToPage} />
        ) : (
          <div aria-hidden="true" className="hidden w-36 shrink-0 lg:block" />
        )}
        <div
          ref={scroller}
          onScroll={onScroll}
          tabIndex={0}
          aria-label={`PDF pages, page ${current} of ${pageCount}`}
          className="relative h-[75vh] min-w-0 flex-1 overflow-auto rounded border border-line bg-[#d9dde2] p-4"
        >
          <Document
            file={file}
            options={options}
            loading={<p role="status">Opening the PDF…</p>}
            onLoadError={() => setError("The PDF could not be opened. Check the connection and reload.")}
            onLoadSuccess={async (doc) => {
              const first = await doc.getPage(Math.min(initialPage, doc.numPages));
              const viewport = first.getViewport({ scale: 1 });
              setAspect(viewport.height / viewport.width);
              if (!jumped.current) {
                jumped.current = true;
                requestAnimationFrame(() => scrollToPage(initialPage));
              }
            }}
          >
            <div style={{ height: pageCount * (pageHeight + gap) }} className="relative">
              {[...visible]
                .filter((n) => firstPainted || n === current)
                .map((n) => (
                  <div
                    key={n}
                    data-page={n}
                    className="absolute left-1/2 -translate-x-1/2 bg-white shadow"
                    style={{ top: (n - 1) * (pageHeight + gap), width: pageWidth, height: pageHeight }}
                  >
                    <Page
                      pageNumber={n}
                      width={pageWidth}
                      renderAnnotationLayer={false}
                      renderTextLayer
                      // react-pdf puts this into the text layer as HTML: the PDF's text is escaped first.
                      customTextRenderer={({ str }) => {
                        const safe = escapeHtml(str);
                        return pattern ? safe.replace(pattern, (m) => `<mark>${m}</mark>`) : safe;
                      }}
                      loading={<span className="sr-only">Drawing page {n}…</span>}
                      onRenderSuccess={() => {
                        afterNextPaint(() => {
                          // The page asked for is on screen: a mark for bench:reader and any browser's
                          // performance panel (a test polling the canvas notices it later).
                          if (n === initialPage && !performance.getEntriesByName(pagePaintedMark).length) performance.mark(pagePaintedMark);
                          setFirstPainted(true);
                        });
                      }}
                      onRenderError={() => setFirstPainted(true)}
                    />
                  </div>
                ))}
            </div>
          </Document>
        </div>
      </div>
    </div>
  );
}

"use client";

// The reader: react-pdf (pdf.js) over the revision's file, loaded by HTTP range so a page deep in
// a large manual opens without the rest. Only pages near the viewport are drawn.
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type ReactNode } from "react";
import { Document, Page, pdfjs } from "react-pdf";
import "react-pdf/dist/Page/TextLayer.css";
import { escapeHtml, escapeRegExp } from "@/lib/domain/escape";
import { subjectAt, type OutlineChapter } from "@/lib/domain/library/outline";
import { chunkSize, getRange, takePdfWorker } from "./pdf-prefetch";
import { readerPageEvent } from "./reader-events";

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

// The text layer lays the page's words over the drawing in a browser font, stretched line by line
// to the PDF's widths. With the system's stand-in for Helvetica (another sans-serif with other
// letter widths) the marks on searched words drifted off the glyphs by a letter or so along a line.
// pdf.js ships Liberation Sans, drawn to Helvetica's and Arial's widths: once it is loaded, the text
// layer measures and lays out sans-serif text in it, so each letter sits over its glyph. Pages drawn
// before it arrives keep the stand-in (measured and shown in the same font, so still consistent).
if (typeof window !== "undefined" && "FontFace" in window) {
  const face = new FontFace("Hangarleaf Text Sans", "url(/standard_fonts/LiberationSans-Regular.ttf)");
  document.fonts.add(face);
  void face.load().then(
    () =>
      (pdfjs.TextLayer as unknown as { fontFamilyMap: Map<string, string> }).fontFamilyMap.set(
        "sans-serif",
        '"Hangarleaf Text Sans", sans-serif',
      ),
    () => undefined,
  );
}

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
  /** Chapters and subjects from the page headings; the PDF's own outline replaces it when it has one. */
  outline: OutlineChapter[];
  /** "Rev 4", shown in the bar with whether it is the current revision. */
  revisionLabel: string;
  isCurrent: boolean;
  /** More controls for the bar (citing this page while a card is open). */
  barExtra?: ReactNode;
  /** Small controls in the bar's first row, before the zoom (bookmarks and notes). */
  barTools?: ReactNode;
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
    <nav aria-label="Pages" className="min-h-0 flex-1 overflow-y-auto p-2">
      <ol ref={list} className="grid grid-cols-2 gap-2">
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

/** The contents panel: chapters with their subjects, the one being read marked and open. */
function Contents({ outline, current, onPick }: { outline: OutlineChapter[]; current: number; onPick: (n: number) => void }) {
  const here = subjectAt(outline, current);
  if (!outline.length) return <p className="hint p-3">This document has no headings to list. Use the page pictures or the page number.</p>;
  return (
    <nav aria-label="Contents" className="min-h-0 flex-1 overflow-y-auto p-2">
      <ol className="flex flex-col gap-1">
        {outline.map((chapter) => {
          const inChapter = chapter.subjects.includes(here!);
          return (
            <li key={`${chapter.code}-${chapter.firstPage}`}>
              <details open={inChapter || outline.length === 1}>
                <summary className="flex min-h-11 cursor-pointer items-center gap-2 rounded px-2 font-semibold hover:bg-paper">
                  {chapter.code ? <span className="font-mono">{chapter.code}</span> : null}
                  <span>{chapter.title}</span>
                </summary>
                <ol className="ml-2 flex flex-col border-l-2 border-line pl-2">
                  {chapter.subjects.map((subject) => (
                    <li key={`${subject.code}-${subject.firstPage}`}>
                      <button
                        type="button"
                        onClick={() => onPick(subject.firstPage)}
                        aria-current={subject === here ? "location" : undefined}
                        className={`flex min-h-11 w-full items-baseline gap-2 rounded px-2 py-1 text-left ${subject === here ? "bg-teal-pale font-semibold outline outline-2 outline-teal" : "hover:bg-paper"}`}
                      >
                        {subject.code ? <span className="font-mono text-sm">{subject.code}</span> : null}
                        <span className="flex-1">{subject.title}</span>
                        <span className="text-sm text-ink-soft">p. {subject.firstPage}</span>
                      </button>
                    </li>
                  ))}
                </ol>
              </details>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}

type PdfDoc = Parameters<NonNullable<React.ComponentProps<typeof Document>["onLoadSuccess"]>>[0];

/** The PDF's own outline, when it has one, as chapters (top level) and subjects (the level below, or the chapter itself). */
async function pdfOutline(doc: PdfDoc): Promise<OutlineChapter[]> {
  const items = await doc.getOutline().catch(() => null);
  if (!items?.length) return [];
  const pageOf = async (dest: unknown): Promise<number | null> => {
    try {
      const explicit = typeof dest === "string" ? await doc.getDestination(dest) : (dest as unknown[] | null);
      if (!explicit?.length) return null;
      const ref = explicit[0];
      return typeof ref === "number" ? ref + 1 : (await doc.getPageIndex(ref as Parameters<PdfDoc["getPageIndex"]>[0])) + 1;
    } catch {
      return null;
    }
  };
  const chapters: OutlineChapter[] = [];
  for (const item of items.slice(0, 300)) {
    const first = await pageOf(item.dest);
    if (!first) continue;
    const code = /^\s*(\d{2})\b/.exec(item.title)?.[1] ?? "";
    const subjects = [];
    for (const child of (item.items ?? []).slice(0, 300)) {
      const page = await pageOf(child.dest);
      if (page)
        subjects.push({
          code: /^\s*(\d{2}-\d{2}(?:-\d{2})?)\b/.exec(child.title)?.[1] ?? "",
          title: child.title,
          firstPage: page,
          lastPage: page,
        });
    }
    if (!subjects.length) subjects.push({ code: "", title: item.title, firstPage: first, lastPage: first });
    chapters.push({ code, title: item.title, firstPage: first, subjects });
  }
  // Each subject runs to the page before the next one starts.
  const all = chapters.flatMap((c) => c.subjects).sort((a, b) => a.firstPage - b.firstPage);
  all.forEach((s, i) => (s.lastPage = Math.max(s.firstPage, (all[i + 1]?.firstPage ?? doc.numPages + 1) - 1)));
  return chapters;
}

type Fit = "width" | "page" | "zoom";

const typing = (target: EventTarget | null) =>
  target instanceof HTMLElement && (target.isContentEditable || ["INPUT", "TEXTAREA", "SELECT"].includes(target.tagName));

export function PdfReader({
  fileUrl,
  fileSize,
  pageCount,
  initialPage,
  marks,
  pageHref,
  thumbnailBase,
  outline: headingOutline,
  revisionLabel,
  isCurrent,
  barExtra,
  barTools,
}: PdfReaderProps) {
  const scroller = useRef<HTMLDivElement>(null);
  const [box, setBox] = useState({ width: 800, height: 600 });
  const [zoom, setZoom] = useState(1);
  const [fit, setFit] = useState<Fit>("width");
  const [aspect, setAspect] = useState(11 / 8.5);
  const [current, setCurrent] = useState(initialPage);
  const [visible, setVisible] = useState<Set<number>>(new Set([initialPage]));
  const [goTo, setGoTo] = useState(String(initialPage));
  const [error, setError] = useState<string | null>(null);
  const [outline, setOutline] = useState(headingOutline);
  const [panel, setPanel] = useState<"contents" | "pictures" | null>(null);
  const jumped = useRef(false);
  // Until the page asked for is painted, nothing else competes with it for the network or the CPU:
  // its neighbours and the strip of page pictures come after.
  const [firstPainted, setFirstPainted] = useState(false);

  // A wide screen has room for the contents beside the page; a cart screen or a phone opens them on demand.
  useEffect(() => {
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the screen's width is known only in the browser
    if (window.matchMedia("(min-width: 1280px)").matches) setPanel("contents");
  }, []);

  const pageWidth =
    fit === "width"
      ? box.width
      : fit === "page"
        ? Math.max(200, Math.min(box.width, Math.round((box.height - 32) / aspect)))
        : Math.round(612 * zoom * 1.3);
  const pageHeight = Math.round(pageWidth * aspect);
  const slot = pageHeight + gap;
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
    const observer = new ResizeObserver(() => setBox({ width: Math.max(240, element.clientWidth - 32), height: element.clientHeight }));
    observer.observe(element);
    return () => observer.disconnect();
  }, []);

  // Where in the document the reader is, as a page and how far down it: kept while the page size
  // changes (zoom, fit, a narrower window), so the page being read stays the page shown.
  const anchor = useRef({ page: initialPage, fraction: 0 });

  const showRange = useCallback(
    (top: number, height: number) => {
      const first = Math.floor(top / slot) + 1;
      const last = Math.floor((top + height) / slot) + 1;
      const shown = new Set<number>();
      for (let p = Math.max(1, first - nearby); p <= Math.min(pageCount, last + nearby); p++) shown.add(p);
      setVisible(shown);
    },
    [pageCount, slot],
  );

  const scrollToPage = useCallback(
    (page: number) => {
      const target = Math.min(Math.max(1, page), pageCount);
      anchor.current = { page: target, fraction: 0 };
      const element = scroller.current;
      element?.scrollTo({ top: (target - 1) * slot, behavior: "instant" as ScrollBehavior });
      if (element) showRange((target - 1) * slot, element.clientHeight);
      setCurrent(target);
      setGoTo(String(target));
    },
    [pageCount, slot, showRange],
  );

  // The first jump runs a frame after the document opens, when the page's size may have changed.
  const latestScroll = useRef(scrollToPage);
  useEffect(() => {
    latestScroll.current = scrollToPage;
  }, [scrollToPage]);

  // Which pages are on screen, from the scroll position (every page slot has the same height).
  const onScroll = useCallback(() => {
    const element = scroller.current;
    if (!element) return;
    showRange(element.scrollTop, element.clientHeight);
    const top = element.scrollTop;
    const page = Math.min(pageCount, Math.max(1, Math.floor(top / slot) + 1));
    anchor.current = { page, fraction: Math.min(1, (top - (page - 1) * slot) / pageHeight) };
    const now = Math.min(pageCount, Math.max(1, Math.round(top / slot) + 1));
    setCurrent((before) => {
      if (before !== now) setGoTo(String(now));
      return now;
    });
  }, [pageCount, slot, pageHeight, showRange]);

  // The page size changed: put the same place of the same page back where it was, before the
  // browser paints (so 125 % from page 77 shows page 77, not the bottom of 76 or a grey gap).
  useLayoutEffect(() => {
    const element = scroller.current;
    if (!element || !jumped.current) return;
    const { page, fraction } = anchor.current;
    const top = (page - 1) * slot + fraction * pageHeight;
    element.scrollTop = top;
    showRange(top, element.clientHeight);
    // Only the size is the trigger here; the anchor is read, not watched.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [slot]);

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
      window.dispatchEvent(new CustomEvent(readerPageEvent, { detail: current }));
    }, 400);
    return () => clearTimeout(timer);
  }, [current, pageHref]);

  const zoomBy = useCallback(
    (step: number) => {
      // From a fitted size, zoom starts at the size shown.
      setZoom((z) => Math.min(3, Math.max(0.5, (fit === "zoom" ? z : pageWidth / (612 * 1.3)) + step)));
      setFit("zoom");
    },
    [fit, pageWidth],
  );

  // Paging from the keyboard works wherever the focus is, except while typing in a field: a
  // student with gloves should not have to click into the page first.
  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      if (event.defaultPrevented || event.ctrlKey || event.metaKey || event.altKey || typing(event.target)) return;
      const moves: Record<string, number> = { PageDown: 1, PageUp: -1, ArrowRight: 1, ArrowLeft: -1 };
      if (event.key in moves) {
        event.preventDefault();
        scrollToPage(current + moves[event.key]!);
      } else if (event.key === "Home" || event.key === "End") {
        event.preventDefault();
        scrollToPage(event.key === "Home" ? 1 : pageCount);
      } else if (event.key === "+" || event.key === "=") zoomBy(0.25);
      else if (event.key === "-") zoomBy(-0.25);
      else if (event.key === "0") setFit("width");
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [current, pageCount, scrollToPage, zoomBy]);

  const here = subjectAt(outline, current);
  const toggle = (which: "contents" | "pictures") => setPanel((open) => (open === which ? null : which));

  return (
    <div className="flex flex-col gap-2">
      <div
        role="toolbar"
        aria-label="Reader"
        className="sticky top-0 z-20 flex flex-wrap items-center gap-x-2 gap-y-1 rounded-md border-2 border-line bg-white px-2 py-0.5 shadow-sm"
      >
        <button
          type="button"
          className={`btn btn-small ${panel === "contents" ? "btn-primary" : "btn-secondary"}`}
          aria-expanded={panel === "contents"}
          aria-controls="reader-panel"
          onClick={() => toggle("contents")}
        >
          ☰ Contents
        </button>
        <span
          className={`badge text-base ${isCurrent ? "bg-ok-pale text-ok" : "bg-danger-pale text-danger"}`}
          title={isCurrent ? "The current revision of this manual" : "A superseded revision: do not work from it"}
        >
          {revisionLabel} · {isCurrent ? "current" : "superseded"}
        </span>
        <button
          type="button"
          className="btn btn-secondary btn-small"
          aria-label="Previous page"
          onClick={() => scrollToPage(current - 1)}
          disabled={current <= 1}
        >
          ◀
        </button>
        <form
          className="flex items-center gap-1"
          onSubmit={(e) => {
            e.preventDefault();
            const n = Number(goTo);
            if (Number.isInteger(n)) scrollToPage(n);
          }}
        >
          <label htmlFor="reader-go" className="sr-only">
            Page
          </label>
          <input
            id="reader-go"
            className="input w-16 py-1 text-center"
            inputMode="numeric"
            value={goTo}
            onChange={(e) => setGoTo(e.target.value)}
            onBlur={() => setGoTo(String(current))}
          />
          <span className="whitespace-nowrap">/ {pageCount}</span>
        </form>
        <button
          type="button"
          className="btn btn-secondary btn-small"
          aria-label="Next page"
          onClick={() => scrollToPage(current + 1)}
          disabled={current >= pageCount}
        >
          ▶
        </button>
        {here ? (
          <span className="hidden max-w-64 truncate text-sm text-ink-soft xl:inline" title={here.title}>
            {here.code ? `${here.code} ` : ""}
            {here.title}
          </span>
        ) : null}
        {barTools}
        <span className="ml-auto flex flex-wrap items-center gap-1">
          <button type="button" className="btn btn-secondary btn-small" aria-label="Zoom out" onClick={() => zoomBy(-0.25)}>
            −
          </button>
          <span aria-live="polite" className="min-w-14 text-center text-sm">
            {fit === "width" ? "Width" : fit === "page" ? "Page" : `${Math.round(zoom * 100)} %`}
          </span>
          <button type="button" className="btn btn-secondary btn-small" aria-label="Zoom in" onClick={() => zoomBy(0.25)}>
            +
          </button>
          <button type="button" className="btn btn-secondary btn-small" aria-pressed={fit === "width"} onClick={() => setFit("width")}>
            Fit width
          </button>
          <button type="button" className="btn btn-secondary btn-small" aria-pressed={fit === "page"} onClick={() => setFit("page")}>
            Fit page
          </button>
        </span>
        {/* Items of the bar's own row; a part that needs the whole width (the citing panel) says so itself. */}
        {barExtra}
      </div>
      {error ? (
        <p className="notice-error" role="alert">
          {error}
        </p>
      ) : null}
      <div className="relative flex gap-2">
        {panel ? (
          <aside
            id="reader-panel"
            aria-label="Find your way in the manual"
            className="absolute inset-y-0 left-0 z-10 flex h-[calc(100vh-8rem)] min-h-80 w-80 max-w-[85vw] shrink-0 flex-col rounded border-2 border-line bg-white shadow-lg xl:static xl:shadow-none"
          >
            <div role="tablist" aria-label="Ways in" className="flex gap-1 border-b border-line p-1">
              {(["contents", "pictures"] as const).map((which) => (
                <button
                  key={which}
                  type="button"
                  role="tab"
                  aria-selected={panel === which}
                  className={`btn btn-small flex-1 ${panel === which ? "btn-primary" : "btn-secondary"}`}
                  onClick={() => setPanel(which)}
                >
                  {which === "contents" ? "Contents" : "Page pictures"}
                </button>
              ))}
            </div>
            {panel === "contents" ? (
              <Contents outline={outline} current={current} onPick={scrollToPage} />
            ) : firstPainted ? (
              <Thumbnails base={thumbnailBase} count={pageCount} current={current} onPick={scrollToPage} />
            ) : (
              <p className="hint p-3">The page pictures come once the page is drawn.</p>
            )}
          </aside>
        ) : null}
        <div
          ref={scroller}
          onScroll={onScroll}
          tabIndex={0}
          aria-label={`PDF pages, page ${current} of ${pageCount}`}
          className="relative h-[calc(100vh-8rem)] min-h-80 min-w-0 flex-1 overflow-auto rounded border border-line bg-[#d9dde2] p-4"
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
                requestAnimationFrame(() => {
                  latestScroll.current(initialPage);
                  jumped.current = true;
                });
              }
              // The file's own outline, when it has one, is better than one read from headings;
              // read after the first page is drawn, not before it.
              afterNextPaint(() => void pdfOutline(doc).then((own) => own.length && setOutline(own)));
            }}
          >
            <div style={{ height: pageCount * slot }} className="relative">
              {[...visible]
                .filter((n) => firstPainted || n === current)
                .map((n) => (
                  <div
                    key={n}
                    data-page={n}
                    className="absolute left-1/2 -translate-x-1/2 bg-white shadow"
                    style={{ top: (n - 1) * slot, width: pageWidth, height: pageHeight }}
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

// The first bytes pdf.js asks for are always the same two chunks: the head (header, linearisation)
// and the tail (trailer, cross-reference stream). Fetching both as soon as the reader's page is
// interactive, while the reader's code and pdf.js's worker are still loading, takes two sequential
// round trips off the time to the first painted page.
export const chunkSize = 65536;

const cache = new Map<string, Promise<Uint8Array>>();
const key = (url: string, begin: number, end: number) => `${url}#${begin}-${end}`;

async function fetchRange(url: string, begin: number, end: number): Promise<Uint8Array> {
  const response = await fetch(url, { headers: { Range: `bytes=${begin}-${end - 1}` }, credentials: "same-origin" });
  if (response.status !== 206 && response.status !== 200) throw new Error(`status ${response.status}`);
  const bytes = new Uint8Array(await response.arrayBuffer());
  // A server that ignores Range sends the whole file: keep the part that was asked for.
  return response.status === 200 ? bytes.subarray(begin, end) : bytes;
}

/** The chunk-aligned ranges pdf.js requests first for a file of this size. */
export function firstRanges(size: number): [number, number][] {
  const head: [number, number] = [0, Math.min(chunkSize, size)];
  const tailStart = Math.floor((size - 1) / chunkSize) * chunkSize;
  return tailStart > 0 ? [head, [tailStart, size]] : [head];
}

export function prefetchFirstRanges(url: string, size: number) {
  if (size <= 0) return;
  for (const [begin, end] of firstRanges(size)) {
    const k = key(url, begin, end);
    if (!cache.has(k))
      cache.set(
        k,
        fetchRange(url, begin, end).catch((error: unknown) => {
          cache.delete(k);
          throw error;
        }),
      );
  }
}

/** A range, from the prefetched ones when it is one of them (each is handed out once). */
export function getRange(url: string, begin: number, end: number): Promise<Uint8Array> {
  const k = key(url, begin, end);
  const prefetched = cache.get(k);
  if (prefetched) {
    cache.delete(k);
    return prefetched.catch(() => fetchRange(url, begin, end));
  }
  return fetchRange(url, begin, end);
}

// pdf.js's worker (a megabyte of script to fetch and compile) is started here, from the small
// loader, as soon as the reader's page is interactive, instead of after the reader's own chunk
// (react-pdf and pdf.js, most of the page's script) has arrived. The reader hands it to pdf.js
// as the port of its PDFWorker; messages sent before the worker's script runs wait in its queue.
let early: Worker | null = null;

export function startPdfWorker() {
  if (!early && typeof Worker !== "undefined") early = new Worker("/pdf.worker.min.mjs", { type: "module" });
}

/** The worker started early, once; null when it was never started or already taken. */
export function takePdfWorker(): Worker | null {
  const worker = early;
  early = null;
  return worker;
}

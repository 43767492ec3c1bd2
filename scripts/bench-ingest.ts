// `npm run bench:ingest`: ingests a 1,000-page and a 2,000-page text PDF through the real job (a
// worker process, pg-boss, PostgreSQL) and prints, from the same run on the same files:
//   - pages per second end to end (queued → ready) and the worker's peak RSS,
//   - poppler's bare `pdftotext` pages per second, and the ratio of the two (goal ≥ 0.5),
//   - pdf.js (pdfjs-dist legacy build) text extraction in-process, pages per second and peak RSS,
//     the alternative extractor, for the record of why poppler was chosen.
// Goals on the 2,000-page file: ratio ≥ 0.5, worker peak RSS ≤ 400 MB. Prints figures, asserts nothing.
import { spawn, spawnSync } from "node:child_process";
import { readFileSync, writeFileSync } from "node:fs";
import { mkdtemp } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { PDFDocument, StandardFonts } from "pdf-lib";
import { closeDb } from "../db";
import { getQueue } from "@/lib/server/jobs";
import { ingestAndWait, storeManual } from "./bench-support";

const words =
  "inspect torque safety wire cotter pin bearing race grease seal gasket cylinder magneto lead harness bracket rivet doubler skin stringer rib spar fitting bushing shim clamp hose fuel oil filter screen valve actuator cable pulley turnbuckle".split(
    " ",
  );

async function makeTextPdf(pages: number): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  let seed = 7;
  const next = () => (seed = (seed * 48271) % 2147483647);
  for (let p = 1; p <= pages; p++) {
    const page = doc.addPage([612, 792]);
    page.drawText(`${String(20 + (p % 60)).padStart(2, "0")}-10-00 BENCH SECTION ${p}`, { x: 54, y: 740, size: 13, font });
    // About 300 words a page, as in a dense maintenance manual.
    for (let line = 0; line < 30; line++) {
      const text = Array.from({ length: 10 }, () => words[next() % words.length]).join(" ");
      page.drawText(text, { x: 54, y: 712 - line * 20, size: 10, font });
    }
  }
  return doc.save();
}

function peakRssMb(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, "utf8");
  return Number(/VmHWM:\s+(\d+) kB/.exec(status)?.[1] ?? 0) / 1024;
}

function time(fn: () => void): number {
  const start = process.hrtime.bigint();
  fn();
  return Number(process.hrtime.bigint() - start) / 1e9;
}

async function pdfjsExtract(file: string, pages: number): Promise<{ seconds: number; peakMb: number }> {
  const pdfjs = await import("pdfjs-dist/legacy/build/pdf.mjs");
  const data = new Uint8Array(readFileSync(file));
  let peak = process.memoryUsage().rss;
  const start = process.hrtime.bigint();
  const standardFontDataUrl = `${path.resolve("node_modules/pdfjs-dist/standard_fonts")}/`;
  const doc = await pdfjs.getDocument({ data, useSystemFonts: false, disableFontFace: true, standardFontDataUrl }).promise;
  for (let n = 1; n <= pages; n++) {
    const page = await doc.getPage(n);
    const content = await page.getTextContent();
    void content.items.length;
    page.cleanup();
    if (n % 100 === 0) peak = Math.max(peak, process.memoryUsage().rss);
  }
  await doc.destroy();
  const seconds = Number(process.hrtime.bigint() - start) / 1e9;
  return { seconds, peakMb: Math.max(peak, process.memoryUsage().rss) / 1024 / 1024 };
}

async function main() {
  const dir = await mkdtemp(path.join(tmpdir(), "hangarleaf-bench-"));
  const worker = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "worker/index.ts"], {
    env: process.env,
    stdio: ["ignore", "ignore", "inherit"],
  });
  const rows: string[] = [];
  try {
    for (const pages of [1000, 2000]) {
      const bytes = await makeTextPdf(pages);
      const file = path.join(dir, `bench-${pages}.pdf`);
      writeFileSync(file, bytes);

      // Bare poppler on the same file: the baseline, best of three.
      const bare = Math.min(...[0, 1, 2].map(() => time(() => spawnSync("pdftotext", ["-enc", "UTF-8", file, "/dev/null"]))));

      const { revisionId } = await storeManual(`Bench ${pages} pages`, bytes);
      const seconds = await ingestAndWait(revisionId);
      const workerPeak = peakRssMb(worker.pid!);
      const pdfjs = await pdfjsExtract(file, pages);

      const endToEnd = pages / seconds;
      const baseline = pages / bare;
      rows.push(
        `${pages} pages (${(bytes.length / 1024 / 1024).toFixed(1)} MB)`,
        `  ingest end to end (job, pages stored):  ${endToEnd.toFixed(0)} pages/s  (${seconds.toFixed(2)} s)`,
        `  bare pdftotext, same file:             ${baseline.toFixed(0)} pages/s  (${bare.toFixed(2)} s)`,
        `  ratio ingest / bare pdftotext:         ${(endToEnd / baseline).toFixed(2)}   (goal ≥ 0.5)`,
        `  worker peak RSS so far:                ${workerPeak.toFixed(0)} MB   (goal ≤ 400 MB)`,
        `  pdf.js in-process text, same file:     ${(pages / pdfjs.seconds).toFixed(0)} pages/s, peak RSS ${pdfjs.peakMb.toFixed(0)} MB`,
      );
    }
  } finally {
    worker.kill("SIGTERM");
    await (await getQueue()).stop({ graceful: false, wait: true });
    await closeDb();
  }
  console.log(["", "bench:ingest", ...rows, ""].join("\n"));
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});

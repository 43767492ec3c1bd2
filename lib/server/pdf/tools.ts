// Poppler (pdfinfo, pdftotext, pdftoppm) and tesseract, Debian's packages, run as child processes:
// a broken PDF can take down a child, never the worker. Chosen over in-process pdf.js by
// `npm run bench:ingest` (see DEVELOPERS.md for the figures).
import { spawn } from "node:child_process";

/** A PDF problem that will not go away by trying again: the revision fails with this reason. */
export class PdfProblem extends Error {
  constructor(message: string) {
    super(message);
    this.name = "PdfProblem";
  }
}

interface ToolResult {
  code: number | null;
  stdout: Buffer;
  stderr: string;
}

const toolTimeoutMs = 10 * 60 * 1000;

export function runTool(command: string, args: string[], input?: Buffer): Promise<ToolResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: ["pipe", "pipe", "pipe"] });
    const out: Buffer[] = [];
    let err = "";
    const timer = setTimeout(() => child.kill("SIGKILL"), toolTimeoutMs);
    child.stdout.on("data", (chunk: Buffer) => out.push(chunk));
    child.stderr.on("data", (chunk: Buffer) => {
      if (err.length < 8000) err += chunk.toString();
    });
    child.on("error", (error) => {
      clearTimeout(timer);
      reject(error);
    });
    child.on("close", (code) => {
      clearTimeout(timer);
      resolve({ code, stdout: Buffer.concat(out), stderr: err });
    });
    child.stdin.on("error", () => undefined); // the tool may exit before reading all input
    child.stdin.end(input);
  });
}

function reasonFrom(stderr: string): PdfProblem {
  if (/incorrect password|encrypted|password/i.test(stderr)) {
    return new PdfProblem("The PDF is protected by a password. Upload a copy that opens without one.");
  }
  return new PdfProblem("The file is damaged or incomplete and cannot be read as a PDF. Upload a good copy.");
}

export async function readPdfInfo(file: string): Promise<{ pages: number }> {
  const result = await runTool("pdfinfo", [file]);
  if (result.code !== 0) throw reasonFrom(result.stderr);
  const pages = Number(/^Pages:\s+(\d+)/m.exec(result.stdout.toString())?.[1] ?? 0);
  if (!pages) throw new PdfProblem("The PDF has no pages.");
  return { pages };
}

/**
 * Streams the text of every page to `onPage`, in order, from one pdftotext process (pages end with
 * a form feed). Reading pauses while `onPage` works, so memory stays flat on any page count.
 */
export function extractPageTexts(file: string, onPage: (pageNumber: number, text: string) => Promise<void>): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn("pdftotext", ["-enc", "UTF-8", "-eol", "unix", file, "-"], { stdio: ["ignore", "pipe", "pipe"] });
    let pending = "";
    let pageNumber = 0;
    let stderr = "";
    let failed = false;
    let chain = Promise.resolve();
    child.stderr.on("data", (chunk: Buffer) => {
      if (stderr.length < 8000) stderr += chunk.toString();
    });
    child.stdout.setEncoding("utf8");
    child.stdout.on("data", (chunk: string) => {
      pending += chunk;
      const parts = pending.split("\f");
      pending = parts.pop() ?? "";
      if (!parts.length) return;
      child.stdout.pause();
      chain = chain
        .then(async () => {
          for (const text of parts) await onPage(++pageNumber, text);
        })
        .then(() => {
          child.stdout.resume();
        })
        .catch((error: unknown) => {
          failed = true;
          child.kill("SIGKILL");
          reject(error);
        });
    });
    child.on("error", reject);
    child.on("close", (code) => {
      void chain.then(() => {
        if (failed) return;
        if (code !== 0) return reject(reasonFrom(stderr));
        resolve(pageNumber);
      });
    });
  });
}

/** One page as a greyscale PNG, for OCR. */
export async function renderPage(file: string, page: number, dpi = 300): Promise<Buffer> {
  const result = await runTool("pdftoppm", ["-f", String(page), "-l", String(page), "-r", String(dpi), "-gray", "-png", file]);
  if (result.code !== 0 || !result.stdout.length) throw reasonFrom(result.stderr);
  return result.stdout;
}

/** Small PNGs of pages `first`–`last`, written as `${prefix}-NNN.png`. */
export async function renderThumbnails(file: string, first: number, last: number, prefix: string): Promise<void> {
  const result = await runTool("pdftoppm", ["-f", String(first), "-l", String(last), "-scale-to", "220", "-png", file, prefix]);
  if (result.code !== 0) throw reasonFrom(result.stderr);
}

/** Text of an image by tesseract (English). */
export async function ocrImage(png: Buffer): Promise<string> {
  const result = await runTool("tesseract", ["-", "-", "-l", "eng", "--psm", "3"], png);
  if (result.code !== 0) throw new Error(`tesseract failed: ${result.stderr.slice(0, 300)}`);
  return result.stdout.toString("utf8");
}

/**
 * Rewrites a PDF with its objects in object streams (qpdf). pdf.js then finds page n's dictionary
 * in a few compressed chunks instead of one range request per earlier page (a flat page tree with
 * objects spread over 100 MB cost 905 requests for page 700; packed, 5). qpdf exits 3 for "done,
 * with warnings".
 */
export async function packForReading(file: string, out: string): Promise<boolean> {
  const result = await runTool("qpdf", ["--object-streams=generate", "--warning-exit-0", file, out]);
  return result.code === 0;
}

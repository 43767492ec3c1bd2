// Helpers for library tests: PDFs made on the spot, multipart uploads, waiting for ingest.
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { call } from "./http";

export { makePdf } from "./pdf";

/** The same PDF, locked with a user password by qpdf. */
export function encrypt(pdf: Uint8Array): Uint8Array {
  const dir = mkdtempSync(path.join(tmpdir(), "hl-enc-"));
  try {
    writeFileSync(path.join(dir, "in.pdf"), pdf);
    execFileSync("qpdf", ["--encrypt", "user-secret", "owner-secret", "256", "--", path.join(dir, "in.pdf"), path.join(dir, "out.pdf")]);
    return readFileSync(path.join(dir, "out.pdf"));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export async function upload(
  path: string,
  cookie: string | undefined,
  fields: Record<string, string>,
  file?: { bytes: Uint8Array; name?: string; type?: string },
) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  if (file)
    form.append("file", new Blob([new Uint8Array(file.bytes)], { type: file.type ?? "application/pdf" }), file.name ?? "manual.pdf");
  return call("POST", path, { cookie, body: form });
}

export interface RevisionStatus {
  id: string;
  manualId: string;
  status: string;
  pagesDone: number;
  pageCount: number | null;
  error: string | null;
  current: boolean;
}

export async function waitForRevision(cookie: string, id: string, seconds = 60): Promise<RevisionStatus> {
  const deadline = Date.now() + seconds * 1000;
  let last: RevisionStatus | null = null;
  while (Date.now() < deadline) {
    last = (await (await call("GET", `/api/revisions/${id}`, { cookie })).json()) as RevisionStatus;
    if (last.status === "ready" || last.status === "failed") return last;
    await new Promise((r) => setTimeout(r, 400));
  }
  throw new Error(`revision ${id} still ${last?.status} after ${seconds} s`);
}

export const uniqueTitle = (what: string) => `${what} ${Math.random().toString(36).slice(2, 8)}`;

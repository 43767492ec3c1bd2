// One way to answer with a file: its type, how the browser should show it, and how long it may be
// kept. Route handlers that send PDFs, CSVs and pictures all go through here.
import { Readable } from "node:stream";

/** A name safe in a Content-Disposition header and on any file system: letters, digits and dashes. */
export function fileSlug(text: string, fallback: string): string {
  return (
    text
      .replace(/[^A-Za-z0-9]+/g, "-")
      .replace(/^-|-$/g, "")
      .slice(0, 60) || fallback
  );
}

export interface FileOptions {
  type: string;
  /** Shown in the browser (inline) or saved (attachment), under this name. */
  filename?: string;
  download?: boolean;
  /** "private, no-store" unless said: records and packets are one person's. */
  cache?: string;
  size?: number;
  etag?: string;
  headers?: Record<string, string>;
  status?: number;
}

export function fileResponse(body: Uint8Array | string | Readable | ReadableStream | null, options: FileOptions): Response {
  const headers: Record<string, string> = {
    "Content-Type": options.type,
    "Cache-Control": options.cache ?? "private, no-store",
    "X-Content-Type-Options": "nosniff",
    ...options.headers,
  };
  if (options.filename) headers["Content-Disposition"] = `${options.download ? "attachment" : "inline"}; filename="${options.filename}"`;
  if (options.size !== undefined) headers["Content-Length"] = String(options.size);
  if (options.etag) headers.ETag = `"${options.etag}"`;
  const payload =
    body instanceof Readable ? (Readable.toWeb(body) as ReadableStream) : body instanceof Uint8Array ? Buffer.from(body) : body;
  return new Response(payload, { status: options.status ?? 200, headers });
}

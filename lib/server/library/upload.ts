import "server-only";
import { createHash, randomUUID } from "node:crypto";
import { Readable, Transform, type TransformCallback } from "node:stream";
import type { ReadableStream as WebReadableStream } from "node:stream/web";
import { pipeline } from "node:stream/promises";
import busboy from "busboy";
import { AppError } from "@/lib/domain/errors";
import { storageKeys, type ObjectStore } from "@/lib/server/storage";
import { formatBytes } from "@/lib/domain/library/format";

const headerWindow = 1024; // the PDF header may stand anywhere in the first 1024 bytes (ISO 32000-1, 7.5.2)
const trailerWindow = 2048;

/** Watches a file as it streams past: size, SHA-256, and whether it looks like a whole PDF. */
class PdfInspector extends Transform {
  size = 0;
  readonly hash = createHash("sha256");
  private head = Buffer.alloc(0);
  private tail = Buffer.alloc(0);
  private headerChecked = false;

  constructor(private readonly limitBytes: number) {
    super();
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, done: TransformCallback) {
    this.size += chunk.length;
    if (this.size > this.limitBytes) return done(tooLarge(this.limitBytes));
    this.hash.update(chunk);
    if (!this.headerChecked) {
      this.head = Buffer.concat([this.head, chunk]).subarray(0, headerWindow);
      if (this.head.length >= headerWindow) {
        this.headerChecked = true;
        if (!this.head.includes("%PDF-")) return done(notPdf());
      }
    }
    this.tail = Buffer.concat([this.tail, chunk]).subarray(-trailerWindow);
    done(null, chunk);
  }

  override _flush(done: TransformCallback) {
    if (this.size === 0) return done(new AppError("invalid", "The file is empty.", { fields: { file: "The file is empty." } }));
    if (!this.headerChecked && !this.head.includes("%PDF-")) return done(notPdf());
    if (!this.tail.includes("%%EOF")) {
      const message = "The PDF is incomplete: its end is missing. The file was cut short; upload a whole copy.";
      return done(new AppError("invalid", message, { fields: { file: message } }));
    }
    done();
  }
}

const notPdf = () =>
  new AppError("unsupported_media_type", "That file is not a PDF. Upload the manual as a PDF file.", {
    fields: { file: "Not a PDF." },
  });

const tooLarge = (limit: number) =>
  new AppError("payload_too_large", `The file is larger than the limit of ${formatBytes(limit)}.`, {
    fields: { file: "Too large." },
  });

export interface ReceivedUpload {
  fields: Record<string, string>;
  file: { size: number; sha256: string } | null;
}

/**
 * Streams a multipart body: the part named `file` goes straight to `key` in the store, checked on
 * the way (size limit, PDF header and end marker); the other parts come back as fields. Nothing
 * is held in memory but small buffers. On any failure the stored object is removed.
 */
export async function receivePdfUpload(
  request: Request,
  { store, key, limitBytes }: { store: ObjectStore; key: string; limitBytes: number },
): Promise<ReceivedUpload> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError("unsupported_media_type", "Send the upload as multipart/form-data with the PDF in a part named file.");
  }
  const declared = Number(request.headers.get("content-length") ?? 0);
  if (declared > limitBytes + 1024 * 1024) throw tooLarge(limitBytes);
  if (!request.body) throw new AppError("invalid", "The request has no body.", { fields: { file: "Choose a PDF file." } });

  const fields: Record<string, string> = {};
  let stored: Promise<{ size: number; sha256: string }> | null = null;
  let parser: busboy.Busboy;
  try {
    parser = busboy({
      headers: { "content-type": type },
      limits: { files: 1, fields: 30, fieldSize: 4000, parts: 40 },
    });
  } catch {
    throw new AppError("bad_request", "The multipart body could not be read.");
  }

  parser.on("field", (name, value) => {
    fields[name] = value;
  });
  parser.on("file", (name, stream) => {
    if (name !== "file" || stored) {
      stream.resume();
      return;
    }
    const inspector = new PdfInspector(limitBytes);
    stored = Promise.all([pipeline(stream, inspector), store.put(key, inspector, "application/pdf")]).then(() => ({
      size: inspector.size,
      sha256: inspector.hash.digest("hex"),
    }));
    // A refused file (not a PDF, too large) stops the whole body at once: busboy would otherwise
    // wait on the file stream it can no longer feed, and the request would hang.
    stored.catch((error: unknown) => parser.destroy(error instanceof Error ? error : new Error(String(error))));
  });

  try {
    await pipeline(Readable.fromWeb(request.body as WebReadableStream), parser);
    const file = stored ? await stored : null;
    return { fields, file };
  } catch (error) {
    // The stream failure may be the parser's reaction to the inspector's refusal: report the refusal.
    const reason = stored
      ? await (stored as Promise<unknown>).then(
          () => error,
          (e: unknown) => e,
        )
      : error;
    await store.delete(key).catch(() => undefined);
    if (reason instanceof AppError) throw reason;
    throw new AppError("bad_request", "The upload was interrupted or its multipart body is malformed. Try again.", { cause: reason });
  }
}

/**
 * The shape of both upload handlers: stream the PDF to a fresh revision key, then check
 * the fields and `record` it. Whatever fails after the bytes are stored removes them again.
 */
export async function withUploadedPdf<T>(
  request: Request,
  { store, limitBytes }: { store: ObjectStore; limitBytes: number },
  record: (upload: {
    revisionId: string;
    fields: Record<string, string>;
    file: { key: string; size: number; sha256: string };
  }) => Promise<T>,
): Promise<T> {
  const revisionId = randomUUID();
  const key = storageKeys.revisionFile(revisionId);
  const { fields, file } = await receivePdfUpload(request, { store, key, limitBytes });
  try {
    if (!file) throw new AppError("invalid", "Choose a PDF file to upload.", { fields: { file: "Choose a PDF file." } });
    return await record({ revisionId, fields, file: { key, ...file } });
  } catch (error) {
    await store.delete(key).catch(() => undefined);
    throw error;
  }
}

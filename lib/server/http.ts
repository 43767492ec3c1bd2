// Helpers for route handlers: one wrapper that turns any error into the JSON error body, and
// body parsing with zod. Route handlers stay thin: session → permission → parse → lib → respond.
import type { z } from "zod";
import { crossOriginRefusal, unstorableValue, urlRefusal } from "@/lib/domain/edge";
import { getEnv } from "@/lib/server/env";
import { AppError, toAppError, type FieldErrors } from "@/lib/domain/errors";

type Handler<C> = (request: Request, context: C) => Promise<Response>;

/** The path and query exactly as sent (request.url has them still percent-encoded). */
function rawPathAndQuery(request: Request): string {
  const url = request.url;
  const start = url.indexOf("/", url.indexOf("//") + 2);
  return start < 0 ? "/" : url.slice(start);
}

export function route<C = unknown>(fn: Handler<C>): Handler<C> {
  return async (request, context) => {
    try {
      const refusal = urlRefusal(rawPathAndQuery(request)) ?? crossOriginRefusal(request, new URL(getEnv().APP_URL).origin);
      if (refusal) throw refusal;
      return await fn(request, context);
    } catch (error) {
      return toAppError(error).toResponse();
    }
  };
}

export function fieldErrors(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    // The top-level field: what a form shows the message beside ("ataChapters", not "ataChapters.0").
    // A body that wraps the form in an envelope ({ content: {...} }) reports the form's own field.
    const path = issue.path[0] === "content" && issue.path.length > 1 ? issue.path.slice(1) : issue.path;
    const key = path.length ? String(path[0]) : "_";
    // A card's steps are numbered for people: "Step 2: …" says where to look.
    const message = key === "steps" && typeof path[1] === "number" ? `Step ${path[1] + 1}: ${issue.message}` : issue.message;
    fields[key] ??= message;
  }
  return fields;
}

export function parseWith<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  // One rule for every body, query and form field: what cannot be stored never reaches a schema.
  const unstorable = unstorableValue(value);
  if (unstorable) throw new AppError("invalid", unstorable.message, { fields: { [unstorable.field]: unstorable.message } });
  const result = schema.safeParse(value);
  if (!result.success) {
    const fields = fieldErrors(result.error);
    const first = Object.entries(fields)[0];
    const message = first ? (first[0] === "_" ? first[1] : `${first[0]}: ${first[1]}`) : undefined;
    throw new AppError("invalid", message, { fields });
  }
  return result.data;
}

const defaultMaxJsonBytes = 64 * 1024;

/**
 * The body as text, counted while it streams: a declared Content-Length over the limit is refused
 * before reading, and a chunked body without one is cut off as soon as it passes the limit, so a
 * huge body is never held in memory.
 */
export async function readBodyText(request: Request, maxBytes: number): Promise<string> {
  const tooLarge = () => new AppError("payload_too_large", `The request body is larger than ${Math.round(maxBytes / 1024)} KiB.`);
  if (Number(request.headers.get("content-length") ?? 0) > maxBytes) throw tooLarge();
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString("utf8");
}

/** Reads a JSON body (at most 64 KiB unless the route allows more) and validates it. */
export async function readJson<S extends z.ZodType>(
  request: Request,
  schema: S,
  { maxBytes = defaultMaxJsonBytes }: { maxBytes?: number } = {},
): Promise<z.output<S>> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("application/json")) {
    throw new AppError("unsupported_media_type", "Send the body as application/json.");
  }
  const text = await readBodyText(request, maxBytes);
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The body is not valid JSON.");
  }
  return parseWith(schema, value);
}

export { idParam, isUuid } from "@/lib/contracts/endpoint";

/**
 * The client's address for throttling. server/web.mjs rewrites X-Forwarded-For on every request
 * to the one address it believes: the socket's, or behind proxies named in HL_TRUSTED_PROXIES the
 * first untrusted hop. Nothing a client writes gets through.
 */
export function clientAddress(request: Request): string {
  return request.headers.get("x-forwarded-for")?.trim() || "unknown";
}

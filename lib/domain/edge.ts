// Rules every request meets before any handler reads it (pure: no framework, no I/O). route()
// applies them to the API, proxy.ts to pages, so no field needs a fix of its own.
import { AppError } from "@/lib/domain/errors";

const safeMethods = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A state-changing request must come from Hangarleaf's own pages. Browsers say where a request
 * came from (Sec-Fetch-Site, Origin) and a page elsewhere cannot hide it; a client that is not a
 * browser sends neither, and cannot carry someone else's cookie anyway (as Go's net/http
 * CrossOriginProtection decides). `appOrigin` is APP_URL's; the request's own Host counts too.
 */
export function crossOriginRefusal(request: { method: string; headers: Headers }, appOrigin: string): AppError | null {
  if (safeMethods.has(request.method.toUpperCase())) return null;
  const refused = () =>
    new AppError(
      "forbidden",
      "This request did not come from Hangarleaf's own pages, so it was refused. Open the app and try again there.",
    );
  const site = request.headers.get("sec-fetch-site");
  if (site) return site === "same-origin" || site === "none" ? null : refused();
  const origin = request.headers.get("origin");
  if (!origin) return null;
  if (origin === appOrigin) return null;
  try {
    const host = request.headers.get("host");
    return host && new URL(origin).host === host ? null : refused();
  } catch {
    return refused(); // "null" and other unreadable origins
  }
}

/** A lone UTF-16 surrogate: a string no database, file or mail can store as it is. */
const loneSurrogate = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export function unstorableText(value: string): string | null {
  if (value.includes("\u0000")) return "cannot hold a NUL character.";
  if (loneSurrogate.test(value)) return "holds a broken character (a lone UTF-16 surrogate).";
  return null;
}

/**
 * The path and query as the client wrote them: malformed percent-encoding is a 400, and a NUL or a
 * broken character anywhere in them too (a search for "%00" must not reach the database).
 */
export function urlRefusal(rawPathAndQuery: string): AppError | null {
  const [pathPart = "", query = ""] = rawPathAndQuery.split(/\?(.*)/s, 2);
  try {
    const parts = [decodeURIComponent(pathPart), ...query.split("&").map((p) => decodeURIComponent(p.replace(/\+/g, " ")))];
    for (const part of parts) if (unstorableText(part)) return new AppError("bad_request", `The address ${unstorableText(part)}`);
  } catch {
    return new AppError("bad_request", "The address has broken percent-encoding (such as %E0%A4 cut short).");
  }
  return null;
}

/** Deeper than any body Hangarleaf takes (a card is about six levels). */
export const maxJsonDepth = 32;

/**
 * Walks a parsed body without recursion (a body nested thousands deep must not overflow the
 * stack): too deep, or a string or key that cannot be stored, is a 422 naming the top field.
 */
export function unstorableValue(value: unknown): { field: string; message: string } | null {
  const stack: { v: unknown; depth: number; field: string }[] = [{ v: value, depth: 0, field: "_" }];
  while (stack.length) {
    const { v, depth, field } = stack.pop()!;
    if (typeof v === "string") {
      const problem = unstorableText(v);
      if (problem) return { field, message: `This field ${problem}` };
      continue;
    }
    if (!v || typeof v !== "object") continue;
    if (depth >= maxJsonDepth) return { field, message: `The body is nested more than ${maxJsonDepth} levels deep.` };
    for (const [key, child] of Object.entries(v)) {
      const problem = unstorableText(key);
      if (problem) return { field, message: `A name in this field ${problem}` };
      stack.push({ v: child, depth: depth + 1, field: depth === 0 ? key : field });
    }
  }
  return null;
}

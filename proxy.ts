import { NextResponse, type NextRequest } from "next/server";
import { sessionCookieName } from "@/lib/server/auth/cookie";
import { urlRefusal } from "@/lib/domain/edge";

// A convenience only: visitors without a session cookie are sent to sign-in before a page renders.
// Whether a cookie is valid, and what its user may do, every page and handler checks itself.
// The cart's shells (/cart, /cart/run) hold no data and must open offline and be precached by the
// service worker before anyone signs in; they ask the API (or IndexedDB) who is signed in.
const publicPaths = [/^\/sign-in$/, /^\/forgot-password$/, /^\/set-password\/[^/]+$/, /^\/cart$/, /^\/cart\/run$/];

export function proxy(request: NextRequest) {
  // The same edge rules as the API's route(): a broken address is a 400 page, not a 500.
  const raw = request.url.slice(request.url.indexOf("/", request.url.indexOf("//") + 2));
  const refusal = urlRefusal(raw);
  if (refusal) return new NextResponse(`${refusal.message}\n`, { status: 400, headers: { "content-type": "text/plain; charset=utf-8" } });
  const { pathname, search } = request.nextUrl;
  if (publicPaths.some((p) => p.test(pathname))) return NextResponse.next();
  if (request.cookies.has(sessionCookieName)) return NextResponse.next();
  const url = request.nextUrl.clone();
  url.pathname = "/sign-in";
  url.search = pathname === "/" ? "" : `?next=${encodeURIComponent(pathname + search)}`;
  return NextResponse.redirect(url);
}

export const config = {
  // API routes answer 401 themselves; static files and Next internals pass untouched.
  matcher: ["/((?!api/|_next/|icon.svg|favicon.ico|sw.js|pdf.worker.min.mjs|standard_fonts/).*)"],
};

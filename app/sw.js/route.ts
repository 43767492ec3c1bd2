import { readFile } from "node:fs/promises";
import path from "node:path";

// The service worker, bundled after the build by scripts/lib.mjs (buildServiceWorker). Served from
// the root so its scope is the whole app. Not cached by the browser's HTTP cache: an update must
// reach carts at their next visit.
export const dynamic = "force-dynamic";

export async function GET() {
  try {
    const code = await readFile(path.join(process.cwd(), ".next", "hangarleaf-sw.js"), "utf8");
    return new Response(code, {
      headers: { "Content-Type": "text/javascript; charset=utf-8", "Cache-Control": "no-cache", "Service-Worker-Allowed": "/" },
    });
  } catch {
    return new Response("// no service worker in this build (next dev)\n", { status: 404, headers: { "Content-Type": "text/javascript" } });
  }
}

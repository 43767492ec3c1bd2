// The service worker (bundled by scripts/lib.mjs → buildServiceWorker, served at /sw.js). Serwist
// precaches the app shell, the cart pages, fonts and the pdf.js worker, so the cart opens after a
// reload without network. API answers are never cached here: the cart keeps its data in
// IndexedDB per user (lib/cart/store.ts). At start it sends waiting changes, as Safari has no
// Background Sync.
import { NetworkOnly, Serwist, type PrecacheEntry } from "serwist";
import { cartData, lastUser } from "@/lib/cart/store";
import { syncOnce } from "@/lib/cart/sync";

declare const __HL_PRECACHE__: PrecacheEntry[];

interface WorkerScope {
  addEventListener(type: "activate" | "message", listener: (event: { data?: unknown; waitUntil?(p: Promise<unknown>): void }) => void): void;
}
const scope = self as unknown as WorkerScope;

const isPage = (request: Request) => request.mode === "navigate";

const serwist = new Serwist({
  precacheEntries: __HL_PRECACHE__,
  // /work/run?id=… is the precached /work/run shell; other parameters (such as Next's _rsc) are
  // different requests.
  precacheOptions: { cleanupOutdatedCaches: true, ignoreURLParametersMatching: [/^id$/, /^q$/] },
  skipWaiting: true,
  clientsClaim: true,
  runtimeCaching: [
    { matcher: ({ url }) => url.pathname.startsWith("/api/"), handler: new NetworkOnly() },
    { matcher: ({ request }) => isPage(request), handler: new NetworkOnly() },
  ],
  // Offline, a page that is not part of the cart opens "my work", which works from what is stored.
  fallbacks: {
    entries: [
      { url: "/work/run", matcher: ({ request }) => isPage(request) && new URL(request.url).pathname === "/work/run" },
      { url: "/work", matcher: ({ request }) => isPage(request) },
    ],
  },
});
serwist.addEventListeners();

async function sendWaiting() {
  const user = await lastUser();
  if (user) await syncOnce(cartData(user.id).syncPort((input, init) => fetch(input, init)));
}

scope.addEventListener("activate", (event) => event.waitUntil?.(sendWaiting().catch(() => undefined)));
scope.addEventListener("message", (event) => {
  if (event.data === "sync") event.waitUntil?.(sendWaiting().catch(() => undefined));
});

// The service worker (bundled by scripts/steps/build.mjs → buildServiceWorker, served at /sw.js). Serwist
// precaches the app shell, the cart pages, fonts and the pdf.js worker, so the cart opens after a
// reload without network. API answers are never cached here: the cart keeps its data in
// IndexedDB per user (lib/client/cart/store.ts). At start it sends waiting changes, as Safari has no
// Background Sync.
import { NetworkOnly, Serwist, type PrecacheEntry } from "serwist";
import { sessionUserId } from "@/lib/client/cart/cart";
import { cartData, lastUser } from "@/lib/client/cart/store";
import { syncOnce } from "@/lib/client/cart/sync";

// Written in by @serwist/build's injectManifest after `next build` (scripts/steps/build.mjs).
declare const self: { __SW_MANIFEST: (PrecacheEntry | string)[] | undefined };

interface WorkerScope {
  addEventListener(
    type: "activate" | "message",
    listener: (event: { data?: unknown; waitUntil?(p: Promise<unknown>): void }) => void,
  ): void;
}
const scope = globalThis as unknown as WorkerScope;

const isPage = (request: Request) => request.mode === "navigate";

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  // /cart/run?id=… is the precached /cart/run shell; other parameters (such as Next's _rsc) are
  // different requests.
  precacheOptions: { cleanupOutdatedCaches: true, ignoreURLParametersMatching: [/^id$/, /^q$/] },
  // A new version waits until the cart's pages are closed: taking over at once would remove the
  // old build's files from the precache while an open page still needs its lazy chunks. The first
  // install takes control at once (clientsClaim), so a cart works offline after its first visit.
  skipWaiting: false,
  clientsClaim: true,
  // Only page loads pass through a handler here (for the offline fallbacks below). API requests
  // match no route, so the browser fetches them itself: no cache of per-user data, and the
  // reader's range requests do not queue behind the worker.
  runtimeCaching: [{ matcher: ({ request }) => isPage(request), handler: new NetworkOnly() }],
  // Offline, a page that is not part of the cart opens "my work", which works from what is stored.
  fallbacks: {
    entries: [
      { url: "/cart/run", matcher: ({ request }) => isPage(request) && new URL(request.url).pathname === "/cart/run" },
      { url: "/cart", matcher: ({ request }) => isPage(request) },
    ],
  },
});
serwist.addEventListeners();

/**
 * Sends the waiting changes of the user the cart opened for, and only while that user's session is
 * the one the browser holds: another student's cookie must never carry them (they would be refused
 * and lost). One sender at a time with the page, through the same Web Lock.
 */
async function sendWaiting() {
  const user = await lastUser();
  if (!user) return;
  if ((await sessionUserId()) !== user.id) return;
  const pass = () => syncOnce(cartData(user.id).syncPort((input, init) => fetch(input, init)));
  await (navigator.locks ? navigator.locks.request(`hangarleaf-sync-${user.id}`, pass) : pass());
}

scope.addEventListener("activate", (event) => event.waitUntil?.(sendWaiting().catch(() => undefined)));
scope.addEventListener("message", (event) => {
  if (event.data === "sync") event.waitUntil?.(sendWaiting().catch(() => undefined));
});

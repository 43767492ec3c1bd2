// The cart in the browser: who is signed in (or was, when offline), keeping "my work" and each
// run's card, events and cited pages in IndexedDB, recording new events, and sending them when the
// network is there (on start, on the online event, on focus, after each change, with backoff).
import type { RunDetailDto, WorkItemDto } from "@/lib/contracts/runs";
import type { RunEventType } from "@/lib/domain/runs/fold";
import {
  cartData,
  clearSignOutPending,
  lastUser,
  rememberUser,
  signOutPending,
  type CartAsset,
  type CartData,
  type CartUser,
} from "@/lib/client/cart/store";
import { backoffDelay, syncOnce, type SyncResult } from "@/lib/client/cart/sync";

/**
 * Ends a session that a sign-out made offline could not end. "none": nothing was pending;
 * "ended": the server ended it now; "failed": still pending (offline), try again later.
 */
export async function endPendingSignOut(): Promise<"none" | "ended" | "failed"> {
  if (!(await signOutPending())) return "none";
  const ended = await fetch("/api/session", { method: "DELETE" }).then(
    (r) => r.ok,
    () => false,
  );
  if (!ended) return "failed";
  await clearSignOutPending();
  return "ended";
}

/** Whose session the browser holds: a user id, null when nobody is signed in, or "offline". */
export async function sessionUserId(): Promise<string | null | "offline"> {
  try {
    const response = await fetch("/api/session", { cache: "no-store" });
    if (!response.ok) return response.status === 401 ? null : "offline";
    return ((await response.json()) as { user: CartUser }).user.id;
  } catch {
    return "offline";
  }
}

export type CartSession = { user: CartUser; online: boolean } | { user: null; online: boolean };

/** The signed-in user from the server, or offline the one who signed in last on this cart. */
export async function openSession(): Promise<CartSession> {
  // A sign-out made offline ends the session on the server first, before anyone uses it.
  const pending = await endPendingSignOut();
  if (pending !== "none") return { user: null, online: pending === "ended" };
  try {
    const response = await fetch("/api/session", { cache: "no-store" });
    if (response.status === 401) return { user: null, online: true };
    if (!response.ok) throw new Error(String(response.status));
    const { user } = (await response.json()) as { user: CartUser };
    await rememberUser(user);
    return { user, online: true };
  } catch {
    const user = await lastUser();
    return user ? { user, online: false } : { user: null, online: false };
  }
}

const activeStatuses = new Set(["not_started", "in_progress", "returned", "submitted"]);

/**
 * Fetches "my work" and stores it with every open run's card version, events and offline packet.
 * Returns what was fetched; throws when offline (the caller shows what is stored).
 */
export async function refreshWork(data: CartData): Promise<WorkItemDto[]> {
  const response = await fetch("/api/my-work", { cache: "no-store" });
  if (!response.ok) throw new Error(`my work answered ${response.status}`);
  const { work, timeZone } = (await response.json()) as { work: WorkItemDto[]; timeZone?: string };
  await data.saveWork(work, timeZone);
  // The fleet too, so the aircraft pick and its out-of-service warning work offline.
  await fetch("/api/assets", { cache: "no-store" })
    .then(async (r) => (r.ok ? data.saveFleet(((await r.json()) as { assets: CartAsset[] }).assets) : undefined))
    .catch(() => undefined);
  for (const item of work.filter((w) => activeStatuses.has(w.status))) {
    await refreshRun(data, item.runId).catch(() => undefined);
  }
  // Ask once that the browser keep this data under storage pressure (Chrome grants it to
  // installed or much-used sites; elsewhere it may be refused, and the cart still works).
  await navigator.storage?.persist?.().catch(() => false);
  return work;
}

export async function refreshRun(data: CartData, runId: string): Promise<RunDetailDto> {
  const response = await fetch(`/api/runs/${runId}`, { cache: "no-store" });
  if (!response.ok) throw new Error(`run answered ${response.status}`);
  const detail = (await response.json()) as RunDetailDto;
  const serverDate = Date.parse(response.headers.get("date") ?? "");
  if (Number.isFinite(serverDate)) {
    const offset = serverDate - Date.now();
    // The Date header has whole seconds: only a clock that is clearly off is corrected.
    await data.saveClockOffset(Math.abs(offset) > 5_000 ? offset : 0);
  }
  await data.saveRun(detail);
  if (detail.packet && !(await data.packet(runId))) {
    const packet = await fetch(detail.packet.url, { cache: "no-store" });
    if (packet.ok) await data.savePacket(runId, await packet.blob());
  }
  for (const file of detail.keepOnCarts) {
    if (await data.wholeFile(file.revisionId)) continue;
    const whole = await fetch(file.url, { cache: "no-store" });
    if (whole.ok) await data.saveWholeFile(file.revisionId, await whole.blob());
  }
  return detail;
}

/**
 * Records one thing done on the cart. Its time is the school's clock as last seen, and never
 * earlier than the run's latest known event, so an instructor's return is never folded after the
 * fix it asked for.
 */
export async function record(
  data: CartData,
  detail: RunDetailDto,
  type: RunEventType,
  { stepId = null, payload = {} }: { stepId?: string | null; payload?: Record<string, unknown> } = {},
) {
  const pending = (await data.pending()).filter((p) => p.runId === detail.run.runId);
  const latest = Math.max(0, ...detail.events.map((e) => Date.parse(e.clientTime)), ...pending.map((p) => Date.parse(p.event.clientTime)));
  const now = Date.now() + (await data.clockOffset());
  const event = { id: crypto.randomUUID(), type, stepId, payload, clientTime: new Date(Math.max(now, latest + 1)).toISOString() };
  await data.queue([{ runId: detail.run.runId, event }]);
  void syncer(data).now();
  return event;
}

interface Syncer {
  now(): Promise<SyncResult | null>;
  last: SyncResult | null;
}
const syncers = new Map<string, Syncer>();

/** One sender per user and tab; several callers share its pass, and failed passes back off. */
export function syncer(data: CartData): Syncer {
  const known = syncers.get(data.userId);
  if (known) return known;
  let running: Promise<SyncResult | null> | null = null;
  let failures = 0;
  let again = false;
  let retry: ReturnType<typeof setTimeout> | null = null;
  const self: Syncer = {
    last: null,
    now() {
      // A change queued while a pass runs may have been read too late: one more pass follows.
      if (running) {
        again = true;
        return running;
      }
      if (retry) clearTimeout(retry);
      retry = null;
      const pass = async (): Promise<SyncResult> => {
        // Only under this user's own session: with another student's cookie the server would refuse
        // these changes as not theirs, and they would be set aside for good.
        const session = await sessionUserId();
        if (session === "offline") return { sent: 0, refused: 0, stop: "offline" };
        if (session !== data.userId) return (self.last = { sent: 0, refused: 0, stop: "signed_out" });
        const result = await syncOnce(data.syncPort());
        self.last = result;
        if (result.stop === "offline" || result.stop === "server") {
          // The wait grows only while nothing gets through.
          failures = result.sent + result.refused > 0 ? 0 : failures + 1;
          retry = setTimeout(() => void self.now(), backoffDelay(failures));
        } else {
          failures = 0;
        }
        return result;
      };
      // The tab and the service worker may both try: the Web Locks API lets one send at a time.
      const locked: Promise<SyncResult> =
        typeof navigator !== "undefined" && navigator.locks
          ? (navigator.locks.request(`hangarleaf-sync-${data.userId}`, pass) as unknown as Promise<SyncResult>)
          : pass();
      const current = locked.finally(() => {
        running = null;
        if (again) {
          again = false;
          void self.now();
        }
      });
      running = current;
      return current;
    },
  };
  syncers.set(data.userId, self);
  if (typeof window !== "undefined") {
    window.addEventListener("online", () => void self.now());
    window.addEventListener("focus", () => void self.now());
  }
  return self;
}

export { cartData };

// What the cart keeps in the browser (IndexedDB through idb-keyval), one database per user, so on
// a shared cart one student never reads another's runs, notes or waiting changes; signing out
// deletes that user's database. A small shared database only says who signed in last, so the cart
// opens offline. Runs in the page and in the service worker (no window, no React).
import { del, get, set, update, type UseStore } from "idb-keyval";
import type { RunDetailDto, WorkItemDto } from "@/lib/contracts/runs";
import type { PendingEvent, PendingPhoto, SyncPort } from "@/lib/client/cart/sync";

export interface CartUser {
  id: string;
  name: string;
  role: string;
}

/**
 * idb-keyval's store, but one that lets go: when another tab or the service worker deletes the
 * database (sign-out), every open connection closes at its versionchange event, so the deletion
 * is not blocked by a connection this page or the worker still holds.
 */
// Databases of users who signed out here: a timer or a late render must not create them again.
const retired = new Set<string>();

function closableStore(name: string, storeName: string): UseStore {
  let db: Promise<IDBDatabase> | null = null;
  const open = () =>
    (db ??= new Promise<IDBDatabase>((resolve, reject) => {
      if (retired.has(name)) {
        db = null;
        return reject(new Error("signed out on this laptop"));
      }
      const request = indexedDB.open(name);
      request.onupgradeneeded = () => request.result.createObjectStore(storeName);
      request.onsuccess = () => {
        const connection = request.result;
        connection.onversionchange = () => {
          connection.close();
          db = null;
        };
        resolve(connection);
      };
      request.onerror = () => {
        db = null;
        reject(request.error);
      };
    }));
  return (mode, callback) => open().then((connection) => callback(connection.transaction(storeName, mode).objectStore(storeName)));
}

const sharedStore = closableStore("hangarleaf-cart", "shared");
const shared = () => sharedStore;
const dbName = (userId: string) => `hangarleaf-user-${userId}`;
const stores = new Map<string, UseStore>();
function userStore(userId: string): UseStore {
  let store = stores.get(userId);
  if (!store) {
    store = closableStore(dbName(userId), "data");
    stores.set(userId, store);
  }
  return store;
}

export const lastUser = () => get<CartUser>("user", shared());
export const rememberUser = (user: CartUser) => {
  retired.delete(dbName(user.id));
  return set("user", { id: user.id, name: user.name, role: user.role }, shared());
};

/** Signed out while offline: the server's session still has to be ended when the network is back. */
export const signOutPending = async () => (await get<boolean>("sign-out-pending", shared())) === true;
export const markSignOutPending = () => set("sign-out-pending", true, shared());
export const clearSignOutPending = () => del("sign-out-pending", shared());

/** Signing out: this user's database goes, and the cart no longer opens as them. */
export async function forgetUser(userId: string): Promise<void> {
  retired.add(dbName(userId));
  stores.delete(userId);
  await del("user", shared());
  // Open connections close themselves (closableStore); a connection of an old page that does not
  // is given a few seconds, then the deletion finishes when it closes.
  await new Promise<void>((resolve) => {
    const request = indexedDB.deleteDatabase(dbName(userId));
    const timer = setTimeout(resolve, 3000);
    request.onsuccess = request.onerror = () => {
      clearTimeout(timer);
      resolve();
    };
  });
}

export interface CartAsset {
  id: string;
  identifier: string;
  kind: string;
  model: string;
  status: string;
  statusReason: string;
  openFindingCount: number;
}

export interface RefusedItem {
  id: string;
  runId: string;
  reason: string;
}

export interface TimerEntry {
  runId: string;
  stepId: string;
  label: string;
  endsAt: number;
}

export function cartData(userId: string) {
  const store = userStore(userId);
  const listeners = new Set<() => void>();
  // Other tabs and the service worker learn of changes too (a channel never hears its own posts).
  const channel = typeof BroadcastChannel !== "undefined" ? new BroadcastChannel(`hangarleaf-${userId}`) : null;
  const changed = () => {
    listeners.forEach((fn) => fn());
    channel?.postMessage("changed");
  };
  return {
    userId,
    onChange(fn: () => void) {
      listeners.add(fn);
      const channel = typeof BroadcastChannel !== "undefined" ? new BroadcastChannel(`hangarleaf-${userId}`) : null;
      if (channel) channel.onmessage = () => fn();
      return () => {
        listeners.delete(fn);
        channel?.close();
      };
    },
    work: () => get<{ items: WorkItemDto[]; savedAt: string; timeZone?: string }>("work", store),
    saveWork: async (items: WorkItemDto[], timeZone = "UTC") => {
      await set("work", { items, savedAt: new Date().toISOString(), timeZone }, store);
      changed();
    },
    run: (runId: string) => get<RunDetailDto & { savedAt: string }>(`run:${runId}`, store),
    saveRun: (detail: RunDetailDto) => set(`run:${detail.run.runId}`, { ...detail, savedAt: new Date().toISOString() }, store),
    packet: (runId: string) => get<Blob>(`packet:${runId}`, store),
    savePacket: (runId: string, blob: Blob) => set(`packet:${runId}`, blob, store),
    wholeFile: (revisionId: string) => get<Blob>(`file:${revisionId}`, store),
    saveWholeFile: (revisionId: string, blob: Blob) => set(`file:${revisionId}`, blob, store),
    /** The fleet as last fetched (identifier, model, status): the aircraft pick and its warnings work offline. */
    fleet: async () => (await get<CartAsset[]>("fleet", store)) ?? [],
    saveFleet: async (assets: CartAsset[]) => {
      await set("fleet", assets, store);
      changed();
    },
    /** The aircraft this cart is at, picked once on the cart's page; runs offer it first. */
    aircraft: () => get<string>("aircraft", store),
    saveAircraft: async (assetId: string | null) => {
      if (assetId) await set("aircraft", assetId, store);
      else await del("aircraft", store);
      changed();
    },
    /** Server time minus the cart's clock, from the last answer: events are stamped on the school's clock. */
    clockOffset: async () => (await get<number>("clock-offset", store)) ?? 0,
    saveClockOffset: (ms: number) => set("clock-offset", ms, store),
    pending: async () => (await get<PendingEvent[]>("outbox", store)) ?? [],
    pendingPhotos: async () => (await get<PendingPhoto[]>("photo-outbox", store)) ?? [],
    queue: async (items: PendingEvent[]) => {
      await update<PendingEvent[]>("outbox", (old) => [...(old ?? []), ...items], store);
      changed();
    },
    queuePhoto: async (photo: PendingPhoto) => {
      await update<PendingPhoto[]>("photo-outbox", (old) => [...(old ?? []), photo], store);
      changed();
    },
    photoBlob: async (photoId: string) => (await get<PendingPhoto[]>("photo-outbox", store))?.find((p) => p.photoId === photoId)?.blob,
    refused: async () => (await get<RefusedItem[]>("refused", store)) ?? [],
    timers: async () => (await get<TimerEntry[]>("timers", store)) ?? [],
    setTimers: async (fn: (old: TimerEntry[]) => TimerEntry[]) => {
      await update<TimerEntry[]>("timers", (old) => fn(old ?? []), store);
      changed();
    },
    syncPort(fetcher: typeof fetch = fetch): SyncPort {
      return {
        events: async () => (await get<PendingEvent[]>("outbox", store)) ?? [],
        photos: async () => (await get<PendingPhoto[]>("photo-outbox", store)) ?? [],
        removeEvents: async (ids, accepted) => {
          const gone = new Set(ids);
          const leaving = ((await get<PendingEvent[]>("outbox", store)) ?? []).filter((p) => gone.has(p.event.id));
          // Accepted events join the stored copy of their run first, so the cart's view of the
          // run never loses them between sending and the next refresh from the server.
          if (accepted) {
            for (const runId of new Set(leaving.map((p) => p.runId))) {
              await update<(RunDetailDto & { savedAt: string }) | undefined>(
                `run:${runId}`,
                (detail) => {
                  if (!detail) return detail;
                  const known = new Set(detail.events.map((e) => e.id));
                  const added = leaving
                    .filter((p) => p.runId === runId && !known.has(p.event.id))
                    .map((p) => ({
                      ...p.event,
                      type: p.event.type as RunDetailDto["events"][number]["type"],
                      userId,
                      userName: "",
                      serverTime: null,
                    }));
                  return { ...detail, events: [...detail.events, ...added] };
                },
                store,
              );
            }
          }
          await update<PendingEvent[]>("outbox", (old) => (old ?? []).filter((p) => !gone.has(p.event.id)), store);
          changed();
        },
        removePhoto: async (photoId) => {
          await update<PendingPhoto[]>("photo-outbox", (old) => (old ?? []).filter((p) => p.photoId !== photoId), store);
          changed();
        },
        refused: async (items) => {
          await update<RefusedItem[]>("refused", (old) => [...(old ?? []), ...items].slice(-200), store);
          changed();
        },
        postEvents: async (runId, events) =>
          answerOf(
            await fetcher(`/api/runs/${runId}/events`, {
              method: "POST",
              headers: { "content-type": "application/json" },
              body: JSON.stringify({ events }),
            }),
          ),
        putPhoto: async (p) =>
          answerOf(
            await fetcher(`/api/runs/${p.runId}/photos/${p.photoId}${p.stepId ? `?step=${p.stepId}` : ""}`, {
              method: "PUT",
              headers: { "content-type": p.type },
              body: p.blob,
            }),
          ),
      };
    },
  };
}

export type CartData = ReturnType<typeof cartData>;

async function answerOf(response: Response) {
  let message: string | undefined;
  if (!response.ok) message = ((await response.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message;
  return { status: response.status, message };
}

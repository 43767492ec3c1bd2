// Unsealed session cookies, kept by their value. Unsealing derives two keys (PBKDF2 through
// WebCrypto) and cost about 2 ms of the web server's one thread on every signed-in request
// (bench:search, CPU profile). The same cookie always unseals to the same data, so the result can
// be kept until the seal expires. Whether the session still counts is not decided here: the user row
// (status, session version) is read on every request, so a sign-out elsewhere, a changed password
// or a deactivated account still ends the session at once.
import { LRUCache } from "lru-cache";

/** The expiry iron writes into a seal (milliseconds, sixth `*` part), or null when it has none. */
export function sealExpiry(seal: string): number | null {
  const part = seal.split("~")[0]!.split("*")[5];
  return part && /^\d+$/.test(part) ? Number(part) : null;
}

export interface SealCache<T> {
  unseal(seal: string, now?: number): Promise<T>;
  readonly size: number;
}

/**
 * `unseal` is only called on a miss; an empty answer (a bad or expired seal) is not kept, so a
 * cookie that fails keeps costing the full check. At `max` entries the least used goes first.
 */
export function createSealCache<T extends object>(
  unseal: (seal: string) => Promise<T>,
  { max = 2000, isEmpty }: { max?: number; isEmpty: (data: T) => boolean },
): SealCache<T> {
  // Each entry lives until its own seal's expiry, on the clock of the call (tests pass their own).
  let clock = Date.now();
  const entries = new LRUCache<string, T>({ max, perf: { now: () => clock }, ttlResolution: 0 });
  return {
    get size() {
      return entries.size;
    },
    async unseal(seal, now = Date.now()) {
      clock = now;
      const hit = entries.get(seal);
      if (hit) return hit;
      const data = await unseal(seal);
      const expires = sealExpiry(seal);
      clock = now;
      // lru-cache counts an entry stale once its age passes its ttl; a seal is dead at its expiry,
      // so the ttl ends a millisecond before it (and a seal that near its end is not kept).
      if (!isEmpty(data) && expires !== null && expires - now > 1) entries.set(seal, Object.freeze(data), { ttl: expires - now - 1 });
      return data;
    },
  };
}

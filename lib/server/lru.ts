// A small in-process cache: at most `max` entries, each with its own expiry, the least recently
// used dropped first. For values that are costly to make and safe to repeat (see its users).

export interface Lru<V> {
  get(key: string, now?: number): V | undefined;
  set(key: string, value: V, expires: number): void;
  clear(): void;
  readonly size: number;
}

export function createLru<V>(max: number): Lru<V> {
  const entries = new Map<string, { value: V; expires: number }>();
  return {
    get size() {
      return entries.size;
    },
    get(key, now = Date.now()) {
      const entry = entries.get(key);
      if (!entry) return undefined;
      entries.delete(key);
      if (entry.expires <= now) return undefined;
      entries.set(key, entry); // now the most recently used (a Map keeps insertion order)
      return entry.value;
    },
    set(key, value, expires) {
      entries.delete(key);
      if (entries.size >= max) entries.delete(entries.keys().next().value!);
      entries.set(key, { value, expires });
    },
    clear() {
      entries.clear();
    },
  };
}

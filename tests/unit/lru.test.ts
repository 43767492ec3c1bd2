import { describe, expect, it } from "vitest";
import { createLru } from "@/lib/server/lru";

describe("lru", () => {
  it("drops the least recently used entry, not the oldest", () => {
    const lru = createLru<number>(2);
    lru.set("a", 1, 100);
    lru.set("b", 2, 100);
    expect(lru.get("a", 0)).toBe(1); // a is now the most recent
    lru.set("c", 3, 100);
    expect(lru.get("b", 0)).toBeUndefined();
    expect(lru.get("a", 0)).toBe(1);
    expect(lru.get("c", 0)).toBe(3);
    expect(lru.size).toBe(2);
  });

  it("forgets an entry at its expiry, and a second set replaces the first", () => {
    const lru = createLru<string>(5);
    lru.set("k", "old", 50);
    lru.set("k", "new", 100);
    expect(lru.size).toBe(1);
    expect(lru.get("k", 99)).toBe("new");
    expect(lru.get("k", 100)).toBeUndefined();
    expect(lru.size).toBe(0);
    lru.set("x", "y", 10);
    lru.clear();
    expect(lru.get("x", 0)).toBeUndefined();
  });
});

import { sealData } from "iron-session";
import { describe, expect, it } from "vitest";
import { createSealCache, sealExpiry } from "@/lib/server/auth/seal-cache";

// The shape iron-session writes: Fe26.2*id*salt*iv*data*expiration*hmacSalt*hmac~2
const seal = (name: string, expires: number | "") => `Fe26.2*1*salt*iv*${name}*${expires}*hsalt*hmac~2`;

function counting() {
  const calls: string[] = [];
  const cache = createSealCache<{ userId?: string }>(
    async (value) => {
      calls.push(value);
      return value.includes("bad") ? {} : { userId: value.split("*")[4] };
    },
    { max: 3, isEmpty: (d) => !d.userId },
  );
  return { cache, calls };
}

describe("session seal cache", () => {
  it("reads the expiry iron puts in the seal", () => {
    expect(sealExpiry(seal("a", 1_700_000_000_000))).toBe(1_700_000_000_000);
    expect(sealExpiry(seal("a", ""))).toBeNull();
    expect(sealExpiry("not a seal")).toBeNull();
  });

  it("finds the expiry in a seal iron-session really made", async () => {
    const before = Date.now();
    const real = await sealData({ userId: "u" }, { password: "p".repeat(40), ttl: 3600 });
    const expiry = sealExpiry(real)!;
    expect(expiry).toBeGreaterThanOrEqual(before + 3_600_000);
    expect(expiry).toBeLessThan(Date.now() + 3_600_001);
  });

  it("unseals a cookie once while it is valid, and again after it expires", async () => {
    const { cache, calls } = counting();
    const value = seal("u1", 10_000);
    expect(await cache.unseal(value, 1_000)).toEqual({ userId: "u1" });
    expect(await cache.unseal(value, 9_999)).toEqual({ userId: "u1" });
    expect(calls).toHaveLength(1);
    await cache.unseal(value, 10_000);
    expect(calls).toHaveLength(2);
    expect(cache.size).toBe(0);
  });

  it("keeps no failed, expired or expiry-less seal", async () => {
    const { cache, calls } = counting();
    await cache.unseal(seal("bad", 10_000), 0);
    await cache.unseal(seal("bad", 10_000), 0);
    await cache.unseal(seal("u2", 5), 10);
    await cache.unseal(seal("u3", ""), 0);
    await cache.unseal(seal("u3", ""), 0);
    expect(calls).toHaveLength(5);
    expect(cache.size).toBe(0);
  });

  it("drops the oldest entry at its size limit, and the data cannot be changed", async () => {
    const { cache, calls } = counting();
    for (const name of ["a", "b", "c", "d"]) await cache.unseal(seal(name, 10_000), 0);
    expect(cache.size).toBe(3);
    await cache.unseal(seal("d", 10_000), 0);
    expect(calls).toHaveLength(4);
    await cache.unseal(seal("a", 10_000), 0);
    expect(calls).toHaveLength(5);
    const data = await cache.unseal(seal("a", 10_000), 0);
    expect(Object.isFrozen(data)).toBe(true);
  });
});

import { describe, expect, it } from "vitest";
import { delayAfterFailures, failuresAfter, throttleKeys, throttlePolicy } from "@/lib/domain/access/throttle";

describe("sign-in throttling policy", () => {
  const rule = throttlePolicy.pair;
  const free = rule.free;

  it("lets the first failures through without waiting", () => {
    for (let n = 0; n < free; n++) expect(delayAfterFailures(n, rule)).toBe(0);
  });

  it("doubles the wait after each further failure", () => {
    expect(delayAfterFailures(free, rule)).toBe(2);
    expect(delayAfterFailures(free + 1, rule)).toBe(4);
    expect(delayAfterFailures(free + 2, rule)).toBe(8);
  });

  it("never makes anyone wait more than the cap", () => {
    expect(delayAfterFailures(free + 100, rule)).toBe(rule.maxDelaySeconds);
  });

  it("counts failures inside the window and starts again after a quiet spell", () => {
    const now = new Date("2026-12-01T10:00:00Z");
    expect(failuresAfter(0, null, now)).toBe(1);
    expect(failuresAfter(4, new Date(now.getTime() - 60_000), now)).toBe(5);
    expect(failuresAfter(9, new Date(now.getTime() - (throttlePolicy.windowSeconds + 1) * 1000), now)).toBe(1);
  });

  it("keeps accounts and addresses apart", () => {
    expect(throttleKeys("a@b.test", "127.0.0.1")).toEqual({
      pair: "pair:a@b.test|127.0.0.1",
      account: "account:a@b.test",
      address: "address:127.0.0.1",
    });
  });

  it("cannot be turned into a lock-out: the account's own count waits a minute at most", () => {
    // A stranger's hundred wrong passwords from many addresses.
    expect(delayAfterFailures(100, throttlePolicy.account)).toBe(60);
    // The same hundred from one address against the account: that pair waits the full cap.
    expect(delayAfterFailures(100, throttlePolicy.pair)).toBe(15 * 60);
  });
});

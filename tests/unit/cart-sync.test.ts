// The cart's sender (lib/client/cart/sync.ts) against a fake server: batches, a lost request retried at
// once, refusals set aside without blocking the queue, sign-out stops, backoff grows only while
// nothing gets through.
import { describe, expect, it } from "vitest";
import { backoffDelay, syncOnce, syncUntilDone, type Answer, type PendingEvent, type SyncPort } from "@/lib/client/cart/sync";

function fakeCart(
  count: number,
  answer: (runId: string, ids: string[], call: number) => Answer | "lost",
  types: Record<string, string> = {},
) {
  let queue: PendingEvent[] = Array.from({ length: count }, (_, i) => ({
    runId: i % 2 ? "run-b" : "run-a",
    event: {
      id: `e${i}`,
      type: types[`e${i}`] ?? "step.checked",
      stepId: null,
      payload: {},
      clientTime: new Date(1_800_000_000_000 + i).toISOString(),
    },
  }));
  const stored = new Set<string>();
  const refused: string[] = [];
  let calls = 0;
  const port: SyncPort = {
    events: async () => queue,
    photos: async () => [],
    removeEvents: async (ids) => {
      queue = queue.filter((p) => !ids.includes(p.event.id));
    },
    removePhoto: async () => undefined,
    refused: async (items) => void refused.push(...items.map((i) => i.id)),
    postEvents: async (runId, events) => {
      const result = answer(
        runId,
        events.map((e) => e.id),
        calls++,
      );
      if (result === "lost") throw new TypeError("fetch failed");
      if (result.status === 200) events.forEach((e) => stored.add(e.id));
      return result;
    },
    putPhoto: async () => ({ status: 201 }),
  };
  return { port, stored, refused, left: () => queue.length, calls: () => calls };
}

describe("sending the cart's events", () => {
  it("sends every event in batches per run and empties the queue", async () => {
    const cart = fakeCart(600, () => ({ status: 200 }));
    expect(await syncOnce(cart.port, { size: 100 })).toEqual({ sent: 600, refused: 0, stop: null });
    expect(cart.stored.size).toBe(600);
    expect(cart.calls()).toBe(6);
    expect(cart.left()).toBe(0);
  });

  it("retries a lost request at once, and stops the pass on a second loss", async () => {
    const once = fakeCart(10, (_r, _i, call) => (call === 0 ? "lost" : { status: 200 }));
    expect(await syncOnce(once.port)).toMatchObject({ sent: 10, stop: null });
    const twice = fakeCart(10, (_r, _i, call) => (call < 2 ? "lost" : { status: 200 }));
    expect(await syncOnce(twice.port)).toMatchObject({ sent: 0, stop: "offline" });
    expect(twice.left()).toBe(10);
  });

  it("sets refused batches aside so they do not block the rest", async () => {
    const cart = fakeCart(10, (runId) => (runId === "run-a" ? { status: 409, message: "This run is signed off." } : { status: 200 }));
    expect(await syncOnce(cart.port)).toEqual({ sent: 5, refused: 5, stop: null });
    expect(cart.refused).toHaveLength(5);
    expect(cart.left()).toBe(0);
  });

  it("stops and keeps everything when the session is gone, and waits out server errors", async () => {
    const signedOut = fakeCart(4, () => ({ status: 401 }));
    expect(await syncOnce(signedOut.port)).toMatchObject({ stop: "signed_out" });
    expect(signedOut.left()).toBe(4);
    const down = fakeCart(4, (_r, _i, call) => (call < 3 ? { status: 503 } : { status: 200 }));
    const waits: number[] = [];
    const result = await syncUntilDone(down.port, { sleep: async (ms) => void waits.push(ms), delay: (n) => n });
    expect(result).toMatchObject({ sent: 4, stop: null, passes: 4 });
    expect(waits).toEqual([1, 2, 3]);
  });

  it("backs off exponentially with jitter, up to 30 s", () => {
    expect(backoffDelay(0, () => 1)).toBe(200);
    expect(backoffDelay(0, () => 0)).toBe(100);
    expect(backoffDelay(3, () => 1)).toBe(1600);
    expect(backoffDelay(20, () => 1)).toBe(30_000);
  });
});

describe("a bad event in a batch", () => {
  it("is found by splitting the batch; the good events are stored", async () => {
    const cart = fakeCart(8, (_runId, ids) => (ids.includes("e4") ? { status: 422, message: "bad event" } : { status: 200 }));
    expect(await syncOnce(cart.port, { size: 8 })).toEqual({ sent: 7, refused: 1, stop: null });
    expect(cart.refused).toEqual(["e4"]);
    expect(cart.stored.size).toBe(7);
  });
});

describe("a hand-in held by a missing tool", () => {
  it("is set aside alone; the work sent with it is stored", async () => {
    // e6 is run-a's hand-in: the server answers 409 for any batch holding it (a missing-tool hold).
    const cart = fakeCart(
      8,
      (_runId, ids) => (ids.includes("e6") ? { status: 409, message: "T-202 was not counted back in" } : { status: 200 }),
      {
        e6: "run.submitted",
      },
    );
    expect(await syncOnce(cart.port, { size: 8 })).toEqual({ sent: 7, refused: 1, stop: null });
    expect(cart.refused).toEqual(["e6"]);
    expect(cart.stored.size).toBe(7);
  });
});

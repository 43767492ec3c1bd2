// The rules at the edge of every request (lib/domain/edge.ts) and who is on the other end of the socket
// (server/edge.mjs).
import { describe, expect, it } from "vitest";
import { crossOriginRefusal, maxJsonDepth, unstorableValue, urlRefusal } from "@/lib/domain/edge";
import { clientAddressOf, hasBrokenEncoding, parseTrustedProxies } from "../../server/edge.mjs";

const request = (method: string, headers: Record<string, string>) => ({ method, headers: new Headers(headers) });
const app = "http://localhost:3000";

describe("requests from other sites", () => {
  it("lets reads through whatever their origin", () => {
    expect(crossOriginRefusal(request("GET", { origin: "https://evil.example", "sec-fetch-site": "cross-site" }), app)).toBeNull();
  });
  it("refuses a state change from another site, by Sec-Fetch-Site or by Origin", () => {
    expect(crossOriginRefusal(request("POST", { "sec-fetch-site": "cross-site" }), app)?.code).toBe("forbidden");
    expect(crossOriginRefusal(request("DELETE", { "sec-fetch-site": "same-site" }), app)?.code).toBe("forbidden");
    expect(crossOriginRefusal(request("PUT", { origin: "https://evil.example", host: "localhost:3000" }), app)?.code).toBe("forbidden");
    expect(crossOriginRefusal(request("POST", { origin: "null" }), app)?.code).toBe("forbidden");
  });
  it("lets the app's own pages and non-browser clients through", () => {
    expect(crossOriginRefusal(request("POST", { "sec-fetch-site": "same-origin" }), app)).toBeNull();
    expect(crossOriginRefusal(request("POST", { origin: app }), app)).toBeNull();
    expect(crossOriginRefusal(request("POST", { origin: "http://10.0.0.5:3000", host: "10.0.0.5:3000" }), app)).toBeNull();
    expect(crossOriginRefusal(request("POST", {}), app)).toBeNull();
  });
});

describe("what cannot be stored", () => {
  it("finds a NUL or a lone surrogate anywhere, naming the top field", () => {
    expect(unstorableValue({ title: "ok", steps: [{ text: "a\u0000b" }] })).toMatchObject({ field: "steps" });
    expect(unstorableValue({ email: "\ud800x" })).toMatchObject({ field: "email" });
    expect(unstorableValue({ ["bad\u0000key"]: 1 })).toMatchObject({ field: "_" });
    expect(unstorableValue({ ok: "a 😀 pair is fine" })).toBeNull();
  });
  it("refuses nesting thousands deep without overflowing the stack", () => {
    let deep: unknown = 1;
    for (let i = 0; i < 100_000; i++) deep = [deep];
    expect(unstorableValue({ events: deep })?.message).toMatch(String(maxJsonDepth));
  });
  it("refuses broken percent-encoding and NUL in addresses", () => {
    expect(urlRefusal("/api/search?q=%00")?.code).toBe("bad_request");
    expect(urlRefusal("/library/%E0%A4%A")?.code).toBe("bad_request");
    expect(urlRefusal("/api/search?q=100%25+torque&limit=5")).toBeNull();
    expect(urlRefusal("/library/abc?x=%F0%9F%98%80")).toBeNull();
    expect(hasBrokenEncoding("/api/search?q=%E0%A4%A")).toBe(true);
    expect(hasBrokenEncoding("/library/%E0%A4%A")).toBe(true);
    expect(hasBrokenEncoding("/api/search?q=100%25+torque")).toBe(false);
  });
});

describe("the client's address", () => {
  const none = parseTrustedProxies("");
  const proxies = parseTrustedProxies("127.0.0.1, ::1");
  it("believes only the socket by default", () => {
    expect(clientAddressOf("203.0.113.9", "198.51.100.1", none)).toBe("203.0.113.9");
    expect(clientAddressOf("::ffff:203.0.113.9", undefined, none)).toBe("203.0.113.9");
  });
  it("reads through trusted proxies, right to left, never past what a client wrote", () => {
    // The client wrote 1.1.1.1; the proxy appended the real peer 198.51.100.7.
    expect(clientAddressOf("127.0.0.1", "1.1.1.1, 198.51.100.7", proxies)).toBe("198.51.100.7");
    expect(clientAddressOf("::1", "198.51.100.7, 127.0.0.1", proxies)).toBe("198.51.100.7");
    expect(clientAddressOf("127.0.0.1", undefined, proxies)).toBe("127.0.0.1");
  });
});

// What the web server decides before Next.js sees a request (pure, shared with the tests): who is on
// the other end, and whether the address can be read at all.
//
// By default only the socket is believed: an X-Forwarded-For that a client writes says nothing.
// When the operator names trusted proxies (HL_TRUSTED_PROXIES), a request from one of them is
// read back through X-Forwarded-For, right to left, skipping trusted hops: the first address not
// trusted is the client (what a proxy appends can be believed, what the client sent cannot).

/** "::ffff:127.0.0.1" and "127.0.0.1" are the same peer. */
export function normaliseAddress(address) {
  const a = String(address ?? "")
    .trim()
    .toLowerCase();
  return a.startsWith("::ffff:") && a.includes(".") ? a.slice(7) : a;
}

/** HL_TRUSTED_PROXIES: addresses separated by commas or spaces. */
export function parseTrustedProxies(value) {
  return new Set(
    String(value ?? "")
      .split(/[\s,]+/)
      .map(normaliseAddress)
      .filter(Boolean),
  );
}

export function clientAddressOf(socketAddress, forwardedFor, trusted) {
  const peer = normaliseAddress(socketAddress) || "unknown";
  if (!trusted.has(peer)) return peer;
  const header = Array.isArray(forwardedFor) ? forwardedFor.join(",") : String(forwardedFor ?? "");
  const hops = header.split(",").map(normaliseAddress).filter(Boolean);
  for (let i = hops.length - 1; i >= 0; i--) if (!trusted.has(hops[i])) return hops[i];
  return hops[0] ?? peer;
}

/**
 * Whether the raw path and query have broken percent-encoding (such as "%E0%A4" cut short). Only the
 * raw request line shows it: Next.js re-encodes what it parsed, so a route handler sees a valid URL.
 */
export function hasBrokenEncoding(rawUrl) {
  const [pathPart = "", query = ""] = String(rawUrl).split(/\?(.*)/s, 2);
  try {
    decodeURIComponent(pathPart);
    for (const part of query.split("&")) decodeURIComponent(part.replace(/\+/g, " "));
    return false;
  } catch {
    return true;
  }
}

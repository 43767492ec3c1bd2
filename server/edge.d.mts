// Types of edge.mjs (plain JavaScript so the web server runs it without a build step).
export function normaliseAddress(address: string | undefined | null): string;
export function parseTrustedProxies(value: string | undefined | null): Set<string>;
export function clientAddressOf(
  socketAddress: string | undefined,
  forwardedFor: string | string[] | undefined,
  trusted: Set<string>,
): string;
export function hasBrokenEncoding(rawUrl: string): boolean;

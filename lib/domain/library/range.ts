export interface ByteRange {
  start: number;
  /** Inclusive, as in an HTTP Range header. */
  end: number;
}

/**
 * One byte range from a Range header (RFC 9110, 14.2), or null for the whole file. Several ranges
 * are answered with the whole file, which the RFC allows; a range past the end is unsatisfiable.
 */
export function parseRange(header: string | null, size: number): ByteRange | null | "unsatisfiable" {
  if (!header) return null;
  const match = /^bytes=(\d*)-(\d*)$/.exec(header.trim());
  if (!match) return null;
  const [, from, to] = match;
  if (from === "" && to === "") return null;
  if (from === "") {
    const suffix = Number(to);
    if (suffix === 0) return "unsatisfiable";
    return { start: Math.max(0, size - suffix), end: size - 1 };
  }
  const start = Number(from);
  const end = to === "" ? size - 1 : Math.min(Number(to), size - 1);
  if (start >= size || end < start) return "unsatisfiable";
  return { start, end };
}

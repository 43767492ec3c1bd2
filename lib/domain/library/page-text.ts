// Page text as stored: pure, so the rules are tested on their own.

/** Fewer visible characters than this and a page counts as having no text layer: it is OCR'd. */
export const minimumTextCharacters = 20;

export function normalisePageText(raw: string): string {
  return raw
    .replace(/\r\n?/g, "\n")
    .split("\n")
    .map((line) => line.replace(/[ \t\u00a0]+$/g, ""))
    .join("\n")
    .replace(/\n{3,}/g, "\n\n")
    .trim();
}

export function needsOcr(text: string): boolean {
  return text.replace(/\s+/g, "").length < minimumTextCharacters;
}

/** The first line with words on it: a page's running heading or title. */
export function headingOf(text: string): string {
  const line = text.split("\n").find((l) => /[A-Za-z]{2,}/.test(l)) ?? "";
  return line.trim().slice(0, 200);
}

/** The words of a text, lower-cased, for comparing two extractions of the same page. */
export function wordsOf(text: string): string[] {
  return text.toLowerCase().match(/[\p{L}\p{N}]+(?:[.'-][\p{L}\p{N}]+)*/gu) ?? [];
}

/** Share of `reference` words found in `candidate`, order aside (a multiset comparison). */
export function wordOverlap(candidate: string[], reference: string[]): number {
  if (!reference.length) return candidate.length ? 0 : 1;
  const counts = new Map<string, number>();
  for (const w of candidate) counts.set(w, (counts.get(w) ?? 0) + 1);
  let found = 0;
  for (const w of reference) {
    const n = counts.get(w) ?? 0;
    if (n > 0) {
      found++;
      counts.set(w, n - 1);
    }
  }
  return found / reference.length;
}

// Marks the searched words in a page's text, for the page view opened from a search hit. Pure.
import { escapeRegExp } from "@/lib/domain/escape";
import { markEnd, markStart, parseQuery, snippetToHtml } from "@/search/query";

/**
 * The beginnings of the words to mark for a query: each word, its expansions, and `also` (the
 * spellings a typo was corrected to). A word's first letters carry it through plurals and endings:
 * "inspect" marks "inspection".
 */
export function markStems(q: string, also: string[] = []): string[] {
  const query = parseQuery(q);
  const words = [
    ...also,
    ...query.words.flatMap((w) => [w.text, ...w.expansions.flatMap((e) => e.split(" "))]),
    ...query.phrases.flatMap((p) => p.split(" ")),
  ].filter((w) => w.length >= 2);
  return [...new Set(words.map((w) => (w.length > 5 ? w.slice(0, w.length - 2) : w)))];
}

/**
 * The text, HTML-escaped, with words that start like a query word, its expansion or one of `also`
 * (the spellings a typo was corrected to) in <mark>.
 */
export function highlightWords(text: string, q: string, also: string[] = []): string {
  const stems = markStems(q, also).map(escapeRegExp);
  if (!stems.length) return snippetToHtml(text);
  const pattern = new RegExp(`\\b(${stems.join("|")})[\\p{L}\\p{N}]*`, "giu");
  return snippetToHtml(text.replace(pattern, (m) => `${markStart}${m}${markEnd}`));
}

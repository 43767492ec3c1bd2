// Turns what a student types into the parts of a search. Pure and forgiving: any input gives a
// query (maybe an empty one), never an error. Supported: words, "quoted phrases", -excluded words
// or -"phrases", and a last word still being typed (searched as a prefix).
import { escapeHtml } from "@/lib/domain/escape";
import abbreviations from "./abbreviations.json";

export interface QueryWord {
  text: string;
  /** The last word while typing: also matches words that start with it. */
  prefix: boolean;
  /** Spelled-out forms from the abbreviations list ("mag" → "magneto"). */
  expansions: string[];
}

export interface ParsedQuery {
  words: QueryWord[];
  phrases: string[];
  excluded: string[];
}

const expansionTable = new Map(
  Object.entries(abbreviations as Record<string, unknown>)
    .filter((entry): entry is [string, string[]] => !entry[0].startsWith("_") && Array.isArray(entry[1]))
    .map(([k, v]) => [k.toLowerCase(), v]),
);

export function expansionsOf(word: string): string[] {
  return expansionTable.get(word.toLowerCase()) ?? [];
}

/** Letters, digits and the joiners inside part numbers and section codes (32-10-00, 0.032, AN4-5). */
function clean(token: string): string {
  return token
    .normalize("NFKC")
    .toLowerCase()
    .replace(/[^\p{L}\p{N}\-./']+/gu, " ")
    .replace(/(^|\s)[-./']+|[-./']+(?=\s|$)/g, " ")
    .trim();
}

export function parseQuery(input: string, { maxTerms = 12 }: { maxTerms?: number } = {}): ParsedQuery {
  const result: ParsedQuery = { words: [], phrases: [], excluded: [] };
  const text = input.slice(0, 500);
  const pattern = /(-?)"([^"]*)"?|(\S+)/g;
  let match: RegExpExecArray | null;
  const plain: string[] = [];
  let lastWasPlainAtEnd = false;
  while ((match = pattern.exec(text))) {
    const [whole, minus, quoted, bare] = match;
    const atEnd = match.index + whole.length === text.length;
    if (quoted !== undefined) {
      const phrase = clean(quoted);
      if (!phrase) continue;
      if (minus) result.excluded.push(phrase);
      else if (phrase.includes(" ")) result.phrases.push(phrase);
      else plain.push(phrase);
      lastWasPlainAtEnd = false;
      continue;
    }
    if (bare!.startsWith("-") && bare!.length > 1 && !/^-\d/.test(bare!)) {
      const excluded = clean(bare!.slice(1));
      if (excluded) result.excluded.push(excluded);
      lastWasPlainAtEnd = false;
      continue;
    }
    for (const part of clean(bare!).split(" ").filter(Boolean)) plain.push(part);
    lastWasPlainAtEnd = atEnd;
  }
  const unique = [...new Set(plain)].slice(0, maxTerms);
  result.words = unique.map((word, i) => ({
    text: word,
    prefix: lastWasPlainAtEnd && i === unique.length - 1 && word === plain[plain.length - 1] && word.length >= 2,
    expansions: expansionsOf(word),
  }));
  result.phrases = result.phrases.slice(0, maxTerms);
  result.excluded = result.excluded.slice(0, maxTerms);
  return result;
}

export function isEmptyQuery(query: ParsedQuery): boolean {
  return query.words.length === 0 && query.phrases.length === 0;
}

/** Marked snippet → parts to render: the engines mark hits with these two characters. */
export const markStart = "\u0002";
export const markEnd = "\u0003";

export function snippetToHtml(snippet: string): string {
  return escapeHtml(snippet).replaceAll(markStart, "<mark>").replaceAll(markEnd, "</mark>");
}

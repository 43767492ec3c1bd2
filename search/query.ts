// Turns what a student types into the parts of a search. Pure and forgiving: any input gives a
// query (maybe an empty one), never an error. Supported: words, "quoted phrases", -excluded words
// or -"phrases", a last word still being typed (searched as a prefix), trade abbreviations and
// concept families (search/abbreviations.json), and an ATA section typed as a code (32-10-00).
import { escapeHtml } from "@/lib/domain/escape";
import abbreviations from "./abbreviations.json";

export interface QueryWord {
  /** As typed, lower case; several words when they form an abbreviation or a family name ("nondestructive testing"). */
  text: string;
  /** The last word while typing: also matches words that start with it. */
  prefix: boolean;
  /**
   * Spelled-out forms from the abbreviations list ("mag" → "magneto") and, for a family's name,
   * the family's other names and its members ("ndt" → "penetrant", "eddy current", …).
   */
  expansions: string[];
}

/** An ATA reference typed as a code: "32-10-00" (a subject) or "32-10" (a section). */
export interface AtaSection {
  /** With a two-digit chapter: "5-10" is "05-10". */
  code: string;
  chapter: string;
}

export interface ParsedQuery {
  words: QueryWord[];
  phrases: string[];
  excluded: string[];
  /** The first ATA code among the words, or null. */
  section: AtaSection | null;
}

type Table = Map<string, string[]>;

const isWordList = (v: unknown): v is string[] => Array.isArray(v) && v.every((x) => typeof x === "string");
const lower = (list: string[]) => list.map((x) => x.toLowerCase().trim()).filter(Boolean);

/** The flat entries: key → spellings. Keys starting with _ are notes or sections (`_families`). */
export function spellingTable(data: Record<string, unknown>): Table {
  const table: Table = new Map();
  for (const [key, value] of Object.entries(data)) {
    if (!key.startsWith("_") && isWordList(value)) table.set(key.toLowerCase().trim(), lower(value));
  }
  return table;
}

export interface Family {
  name: string;
  names: string[];
  members: string[];
}

/** The concept families of `_families`: each name (the key and its `names`) finds the other names and the members. */
export function familiesOf(data: Record<string, unknown>): Family[] {
  const section = data._families;
  if (!section || typeof section !== "object") return [];
  const families: Family[] = [];
  for (const [key, value] of Object.entries(section as Record<string, unknown>)) {
    if (key.startsWith("_") || !value || typeof value !== "object") continue;
    const { names, members } = value as { names?: unknown; members?: unknown };
    families.push({
      name: key.toLowerCase().trim(),
      names: isWordList(names) ? lower(names) : [],
      members: isWordList(members) ? lower(members) : [],
    });
  }
  return families;
}

/** Spellings and families in one table: what a typed word (or words) also finds. */
export function expansionTableOf(data: Record<string, unknown>): Table {
  const table = spellingTable(data);
  for (const family of familiesOf(data)) {
    const all = [family.name, ...family.names];
    for (const name of all) {
      const more = [...all.filter((n) => n !== name), ...family.members];
      table.set(name, [...new Set([...(table.get(name) ?? []), ...more])]);
    }
  }
  return table;
}

const expansionTable = expansionTableOf(abbreviations as Record<string, unknown>);
/** Keys of several words ("mag particle") are matched on words typed side by side, longest first. */
const longestKey = Math.max(1, ...[...expansionTable.keys()].map((k) => k.split(" ").length));

export function expansionsOf(word: string): string[] {
  return expansionTable.get(word.toLowerCase()) ?? [];
}

/** "32-10-00", "32-10" or "5-10" as an ATA section; anything else null. */
export function ataSectionOf(word: string): AtaSection | null {
  const m = /^(\d{1,2})-(\d{2})(?:-(\d{2}))?$/.exec(word.trim());
  if (!m) return null;
  const chapter = m[1]!.padStart(2, "0");
  return { code: [chapter, m[2], m[3]].filter(Boolean).join("-"), chapter };
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
  const result: ParsedQuery = { words: [], phrases: [], excluded: [], section: null };
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
  // Words typed side by side that form a key of the table ("mag particle", "nondestructive testing") go as one.
  const grouped: { text: string; joined: boolean }[] = [];
  for (let i = 0; i < plain.length;) {
    let length = Math.min(longestKey, plain.length - i);
    while (length > 1 && !expansionTable.has(plain.slice(i, i + length).join(" "))) length--;
    grouped.push({ text: plain.slice(i, i + length).join(" "), joined: length > 1 });
    i += length;
  }
  const last = grouped.at(-1);
  const unique = [...new Map(grouped.map((g) => [g.text, g])).values()].slice(0, maxTerms);
  result.words = unique.map((word, i) => {
    // "5-10" also finds the section as manuals write it, "05-10".
    const section = ataSectionOf(word.text);
    const code = section && !section.code.startsWith(word.text) ? [section.code] : [];
    return {
      text: word.text,
      prefix: lastWasPlainAtEnd && i === unique.length - 1 && word === last && !word.joined && word.text.length >= 2,
      expansions: [...expansionsOf(word.text), ...code],
    };
  });
  result.phrases = result.phrases.slice(0, maxTerms);
  result.excluded = result.excluded.slice(0, maxTerms);
  result.section = result.words.map((w) => ataSectionOf(w.text)).find((s) => s !== null) ?? null;
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

// Page-by-page comparison of a revision with the one it supersedes. Pure: no database, no Next.
//
// 1. Each page is normalised: what changes on every page without changing content goes (page
//    numbers, revision labels, dates, running headers and footers, whitespace, case).
// 2. The two sequences of normalised pages are aligned (Myers' diff on page fingerprints): pages
//    inserted or deleted in the middle shift everything after them, and that shift is a move.
// 3. The pages left over on each side are matched by text similarity: the same text elsewhere is a
//    move (a chapter moved), similar text near the same place is a change; the rest are added
//    (new side) or removed (old side).

import { escapeRegExp } from "@/lib/domain/escape";

export type PageStatus = "unchanged" | "changed" | "moved" | "added" | "removed";

export interface PageChange {
  status: PageStatus;
  oldPage: number | null;
  newPage: number | null;
  /** 0..1: how much of the text the two pages share (1 for unchanged and moved). */
  similarity: number;
}

export interface Comparison {
  pages: PageChange[];
  summary: Record<PageStatus, number>;
}

export interface CompareOptions {
  /** Labels printed on the pages ("Rev 3", "Rev 4"): never a change by themselves. */
  labels?: string[];
  /** Below this, a left-over page pair is not "changed" but removed + added. */
  changedThreshold?: number;
  /** How far (in pages) from its expected place a changed page is looked for. */
  window?: number;
}

const dateLike =
  /\b(\d{4}-\d{2}-\d{2}|\d{1,2}\/\d{1,2}\/\d{2,4}|\d{1,2} (jan|feb|mar|apr|may|jun|jul|aug|sep|oct|nov|dec)[a-z]* \d{4}|(jan|feb|mar|apr|may|jun|jul|aug|sep|oct|nov|dec)[a-z]* \d{1,2},? \d{4})\b/g;
const pageWord = /\b(page|pg\.?|p\.)\s*\d+(\s*(of|\/)\s*\d+)?\b/g;

/** The lines of a page with digits masked: the shape a running header keeps from page to page. */
function lineShape(line: string) {
  return line.toLowerCase().replace(/\d+/g, "#").replace(/\s+/g, " ").trim();
}

/**
 * Normalised texts of one revision's pages. A line whose shape (digits masked) appears on most
 * pages of the revision is a running header or footer and is dropped.
 */
export function normalisePages(texts: string[], labels: string[] = []): string[] {
  const counts = new Map<string, number>();
  const pageLines = texts.map((t) =>
    t
      .split(/\r?\n/)
      .map((l) => l.trim())
      .filter(Boolean),
  );
  for (const lines of pageLines) {
    for (const shape of new Set(lines.map(lineShape))) counts.set(shape, (counts.get(shape) ?? 0) + 1);
  }
  const running = (shape: string) => texts.length >= 4 && (counts.get(shape) ?? 0) >= Math.max(3, texts.length * 0.6);
  const labelPattern = labels.length ? new RegExp(`\\b(${labels.map((l) => escapeRegExp(l.toLowerCase())).join("|")})\\b`, "g") : null;
  return pageLines.map((lines) => {
    let text = lines
      .filter((l) => !running(lineShape(l)))
      .join(" ")
      .toLowerCase();
    if (labelPattern) text = text.replace(labelPattern, " ");
    return text
      .replace(pageWord, " ")
      .replace(dateLike, " ")
      .replace(/[^\p{L}\p{N}.,;:%±°/-]+/gu, " ")
      .replace(/\s+/g, " ")
      .trim();
  });
}

/** Each distinct normalised text gets one number, shared by both revisions: equal ids, equal text. */
function textIds(oldNorm: string[], newNorm: string[]): [number[], number[]] {
  const ids = new Map<string, number>();
  const id = (t: string) => {
    let n = ids.get(t);
    if (n === undefined) ids.set(t, (n = ids.size));
    return n;
  };
  return [oldNorm.map(id), newNorm.map(id)];
}

/**
 * Pairs [i, j] of equal elements, in order: a common subsequence found the patience way. Elements
 * that occur once on each side anchor the alignment (their longest increasing run); the gaps
 * between anchors are aligned the same way, and small gaps without anchors by dynamic programming.
 * Pages are nearly always unique, so this is O(n log n) in practice and never holds an n × m table
 * for large n and m.
 */
export function alignSequences(a: number[], b: number[]): [number, number][] {
  const pairs: [number, number][] = [];
  // A work list instead of recursion: a long run of gaps never overflows the call stack.
  const work: [number, number, number, number][] = [[0, a.length, 0, b.length]];
  while (work.length) {
    let [a0, a1, b0, b1] = work.pop()!;
    while (a0 < a1 && b0 < b1 && a[a0] === b[b0]) pairs.push([a0++, b0++]);
    while (a0 < a1 && b0 < b1 && a[a1 - 1] === b[b1 - 1]) pairs.push([--a1, --b1]);
    if (a0 >= a1 || b0 >= b1) continue;
    const anchors = uniqueAnchors(a, b, a0, a1, b0, b1);
    if (anchors.length === 0) {
      pairs.push(...smallLcs(a, b, a0, a1, b0, b1));
      continue;
    }
    let pa = a0;
    let pb = b0;
    for (const [i, j] of anchors) {
      work.push([pa, i, pb, j]);
      pairs.push([i, j]);
      pa = i + 1;
      pb = j + 1;
    }
    work.push([pa, a1, pb, b1]);
  }
  return pairs.sort((x, y) => x[0] - y[0]);
}

/** Elements that occur exactly once in both ranges, as the longest run increasing on both sides. */
function uniqueAnchors(a: number[], b: number[], a0: number, a1: number, b0: number, b1: number): [number, number][] {
  const count = new Map<number, { na: number; nb: number; ia: number; ib: number }>();
  for (let i = a0; i < a1; i++) {
    const c = count.get(a[i]!) ?? { na: 0, nb: 0, ia: i, ib: -1 };
    c.na++;
    c.ia = i;
    count.set(a[i]!, c);
  }
  for (let j = b0; j < b1; j++) {
    const c = count.get(b[j]!);
    if (!c) continue;
    c.nb++;
    c.ib = j;
  }
  const candidates: [number, number][] = [];
  for (const c of count.values()) if (c.na === 1 && c.nb === 1) candidates.push([c.ia, c.ib]);
  candidates.sort((x, y) => x[0] - y[0]);
  // Longest increasing subsequence on j (patience sorting with back links).
  const tails: number[] = [];
  const prev = new Array<number>(candidates.length).fill(-1);
  for (let k = 0; k < candidates.length; k++) {
    const j = candidates[k]![1];
    let lo = 0;
    let hi = tails.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (candidates[tails[mid]!]![1] < j) lo = mid + 1;
      else hi = mid;
    }
    if (lo > 0) prev[k] = tails[lo - 1]!;
    tails[lo] = k;
  }
  const result: [number, number][] = [];
  for (let k = tails.length ? tails[tails.length - 1]! : -1; k >= 0; k = prev[k]!) result.push(candidates[k]!);
  return result.reverse();
}

/** Plain LCS for a gap with no unique anchor (repeated blank pages, say); large gaps match nothing. */
function smallLcs(a: number[], b: number[], a0: number, a1: number, b0: number, b1: number): [number, number][] {
  const n = a1 - a0;
  const m = b1 - b0;
  if (n * m > 250_000) return [];
  const table = Array.from({ length: n + 1 }, () => new Uint16Array(m + 1));
  for (let i = n - 1; i >= 0; i--) {
    for (let j = m - 1; j >= 0; j--) {
      table[i]![j] = a[a0 + i] === b[b0 + j] ? table[i + 1]![j + 1]! + 1 : Math.max(table[i + 1]![j]!, table[i]![j + 1]!);
    }
  }
  const pairs: [number, number][] = [];
  let i = 0;
  let j = 0;
  while (i < n && j < m) {
    if (a[a0 + i] === b[b0 + j]) pairs.push([a0 + i++, b0 + j++]);
    else if (table[i + 1]![j]! >= table[i]![j + 1]!) i++;
    else j++;
  }
  return pairs;
}

function wordSet(text: string): Set<string> {
  return new Set(text.split(" ").filter((w) => w.length > 0));
}

/**
 * Similarity of two pages: the Dice coefficient over their word sets, each word weighed by how
 * rare it is across both revisions (inverse document frequency). Words every page has (the
 * manual's boilerplate, a template's fixed sentences) weigh almost nothing, so two pages made from
 * one template do not look alike; the words that say what a page is about decide.
 */
export class PageSimilarity {
  private readonly weight = new Map<string, number>();
  private readonly sets: Set<string>[][];
  private readonly totals: number[][];

  constructor(sides: string[][]) {
    this.sets = sides.map((texts) => texts.map(wordSet));
    const pagesCount = this.sets.reduce((n, side) => n + side.length, 0);
    const df = new Map<string, number>();
    for (const side of this.sets) for (const set of side) for (const w of set) df.set(w, (df.get(w) ?? 0) + 1);
    for (const [w, n] of df) this.weight.set(w, Math.log((pagesCount + 1) / n));
    this.totals = this.sets.map((side) => side.map((set) => this.sum(set)));
  }

  private sum(set: Set<string>) {
    let total = 0;
    for (const w of set) total += this.weight.get(w) ?? 0;
    return total;
  }

  /** Similarity of page i of side a and page j of side b, 0..1. */
  between(a: number, i: number, b: number, j: number): number {
    const x = this.sets[a]![i]!;
    const y = this.sets[b]![j]!;
    const tx = this.totals[a]![i]!;
    const ty = this.totals[b]![j]!;
    if (tx + ty === 0) return x.size === 0 && y.size === 0 ? 1 : 0;
    let shared = 0;
    const [small, large] = x.size < y.size ? [x, y] : [y, x];
    for (const w of small) if (large.has(w)) shared += this.weight.get(w) ?? 0;
    return (2 * shared) / (tx + ty);
  }
}

export function comparePages(oldTexts: string[], newTexts: string[], options: CompareOptions = {}): Comparison {
  const { labels = [], changedThreshold = 0.5, window = 20 } = options;
  const oldNorm = normalisePages(oldTexts, labels);
  const newNorm = normalisePages(newTexts, labels);
  const [oldIds, newIds] = textIds(oldNorm, newNorm);
  const aligned = alignSequences(oldIds, newIds);

  const byNew = new Map<number, PageChange>();
  const oldUsed = new Set<number>();
  for (const [i, j] of aligned) {
    oldUsed.add(i);
    byNew.set(j, { status: i === j ? "unchanged" : "moved", oldPage: i + 1, newPage: j + 1, similarity: 1 });
  }

  // Where each left-over new page would sit in the old sequence: after the last aligned pair
  // before it, shifted by its distance from that pair.
  const expectedOld = new Array<number>(newTexts.length);
  let last: [number, number] | null = null;
  let next = 0;
  for (let j = 0; j < newTexts.length; j++) {
    while (next < aligned.length && aligned[next]![1] < j) last = aligned[next++]!;
    expectedOld[j] = last ? last[0] + (j - last[1]) : j;
  }

  // Left-over pages whose exact text exists on the other side: a moved block.
  const leftOld = new Map<string, number[]>();
  for (let i = 0; i < oldTexts.length; i++) {
    if (oldUsed.has(i)) continue;
    const list = leftOld.get(oldNorm[i]!) ?? [];
    list.push(i);
    leftOld.set(oldNorm[i]!, list);
  }
  const pending: number[] = [];
  for (let j = 0; j < newTexts.length; j++) {
    if (byNew.has(j)) continue;
    const same = leftOld.get(newNorm[j]!);
    const i = same?.shift();
    if (i !== undefined && newNorm[j]!.length > 0) {
      oldUsed.add(i);
      byNew.set(j, { status: "moved", oldPage: i + 1, newPage: j + 1, similarity: 1 });
    } else {
      pending.push(j);
    }
  }

  // The rest: the most similar left-over old page near where it would be, if similar enough.
  const sim = new PageSimilarity([oldNorm, newNorm]);
  const candidates: { i: number; j: number; s: number }[] = [];
  for (const j of pending) {
    const centre = expectedOld[j]!;
    for (let i = Math.max(0, centre - window); i <= Math.min(oldTexts.length - 1, centre + window); i++) {
      if (oldUsed.has(i)) continue;
      const s = sim.between(0, i, 1, j);
      if (s >= changedThreshold) candidates.push({ i, j, s });
    }
  }
  // Best pairs first, each page used once.
  candidates.sort((a, b) => b.s - a.s || Math.abs(a.i - a.j) - Math.abs(b.i - b.j));
  const newUsed = new Set<number>();
  for (const c of candidates) {
    if (oldUsed.has(c.i) || newUsed.has(c.j)) continue;
    oldUsed.add(c.i);
    newUsed.add(c.j);
    byNew.set(c.j, { status: "changed", oldPage: c.i + 1, newPage: c.j + 1, similarity: round(c.s) });
  }
  for (const j of pending) {
    if (!byNew.has(j)) byNew.set(j, { status: "added", oldPage: null, newPage: j + 1, similarity: 0 });
  }

  // Effective pages of the new revision in order, each removed page after the page before it.
  const pages: PageChange[] = [];
  const removedAfter = new Map<number, PageChange[]>();
  let anchor = 0; // new page the removed old page follows
  const newOfOld = new Map<number, number>();
  for (const change of byNew.values()) if (change.oldPage) newOfOld.set(change.oldPage, change.newPage!);
  for (let i = 0; i < oldTexts.length; i++) {
    if (newOfOld.has(i + 1)) {
      anchor = newOfOld.get(i + 1)!;
      continue;
    }
    const list = removedAfter.get(anchor) ?? [];
    list.push({ status: "removed", oldPage: i + 1, newPage: null, similarity: 0 });
    removedAfter.set(anchor, list);
  }
  pages.push(...(removedAfter.get(0) ?? []));
  for (let j = 0; j < newTexts.length; j++) {
    pages.push(byNew.get(j)!);
    pages.push(...(removedAfter.get(j + 1) ?? []));
  }

  const summary: Record<PageStatus, number> = { unchanged: 0, changed: 0, moved: 0, added: 0, removed: 0 };
  for (const p of pages) summary[p.status]++;
  return { pages, summary };
}

const round = (x: number) => Math.round(x * 1000) / 1000;

/** The least similarity at which a page is suggested in place of a removed one. */
export const minimumSuggestion = 0.5;

/**
 * The page of the new revision to suggest for a citation of an old page: where it moved, or what
 * it became; for a removed page, the most similar new page (with its score), if any is similar.
 */
export function suggestPage(
  comparison: Comparison,
  oldPage: number,
  texts?: { oldTexts: string[]; newTexts: string[]; labels?: string[] },
): { page: number | null; similarity: number; status: PageStatus | null } {
  const entry = comparison.pages.find((p) => p.oldPage === oldPage);
  if (!entry) return { page: null, similarity: 0, status: null };
  if (entry.status !== "removed") return { page: entry.newPage, similarity: entry.similarity, status: entry.status };
  if (!texts) return { page: null, similarity: 0, status: "removed" };
  const oldNorm = normalisePages(texts.oldTexts, texts.labels);
  const newNorm = normalisePages(texts.newTexts, texts.labels);
  const sim = new PageSimilarity([oldNorm, newNorm]);
  let best = { page: null as number | null, similarity: 0 };
  newNorm.forEach((_, j) => {
    const s = sim.between(0, oldPage - 1, 1, j);
    if (s > best.similarity) best = { page: j + 1, similarity: round(s) };
  });
  // A weak match would send a student to the wrong procedure: no suggestion is the honest answer.
  return best.similarity >= minimumSuggestion
    ? { ...best, status: "removed" }
    : { page: null, similarity: best.similarity, status: "removed" };
}

// `npm run bench:compare`: two generated 2,000-page revisions (pages inserted, deleted, a chapter
// moved, pages edited, new labels and dates on every page) compared by lib/domain/revisions/compare.ts.
// Prints the median of 5 runs, and as the baseline of the same run the `diff` package's array diff
// over the same normalised pages (alignment only, no similarity matching). Goal: a few seconds.
import { diffArrays } from "diff";
import { comparePages, normalisePages } from "@/lib/domain/revisions/compare";

const pagesCount = 2000;
const syllables = ["ba", "ke", "lo", "mi", "nu", "ra", "so", "ti", "vu", "za", "pe", "do", "fi", "gu", "ha", "je", "co", "wy"];
const vocabulary = Array.from(
  { length: 20_000 },
  (_, k) => syllables[k % 18]! + syllables[Math.floor(k / 18) % 18]! + syllables[Math.floor(k / 324) % 18]! + (k % 7 ? "" : "n"),
);
const common = ["the", "and", "check", "install", "remove", "torque", "inspect", "record", "step", "limits", "see", "figure"];
let seed = 42;
const random = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;

function body(k: number): string {
  const words: string[] = [`SECTION ${k}`];
  const n = 150 + Math.floor(random() * 300); // 150–450 words, as the search benchmark
  for (let i = 0; i < n; i++)
    words.push(random() < 0.5 ? common[Math.floor(random() * common.length)]! : vocabulary[Math.floor(random() * vocabulary.length)]!);
  return words.join(" ");
}
const page = (n: number, text: string, label: string, date: string) =>
  `BENCH MAINTENANCE MANUAL ${label} ${date}\nPage ${n}\n${text}\nEnd of page ${n}`;

const bodies = Array.from({ length: pagesCount }, (_, k) => body(k));
const next = [...bodies];
next.splice(1500, 20); // a chapter withdrawn
const moved = next.splice(1200, 40); // a chapter moved …
next.splice(300, 0, ...moved); // … to an earlier place
next.splice(100, 0, ...Array.from({ length: 30 }, (_, k) => body(10_000 + k))); // a chapter added
for (const k of [50, 700, 900, 1100, 1600]) next[k] = `${next[k]} with a changed limit 120 to 150 in-lb`; // edits
const oldTexts = bodies.map((b, i) => page(i + 1, b, "Rev 7", "2025-01-15"));
const newTexts = next.map((b, i) => page(i + 1, b, "Rev 8", "2026-06-30"));
const labels = ["Rev 7", "Rev 8"];

function median(values: number[]) {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}
function time(fn: () => unknown, runs = 5) {
  const ms: number[] = [];
  let result: unknown;
  for (let i = 0; i < runs; i++) {
    const started = performance.now();
    result = fn();
    ms.push(performance.now() - started);
  }
  return { ms: median(ms), result };
}

const ours = time(() => comparePages(oldTexts, newTexts, { labels }));
const baseline = time(() => diffArrays(normalisePages(oldTexts, labels), normalisePages(newTexts, labels)));
const summary = (ours.result as ReturnType<typeof comparePages>).summary;
console.log(`pages: ${oldTexts.length} old, ${newTexts.length} new`);
console.log(`result: ${JSON.stringify(summary)}`);
console.log(`comparePages: ${ours.ms.toFixed(0)} ms (median of 5)`);
console.log(`baseline, diff package diffArrays over the normalised pages: ${baseline.ms.toFixed(0)} ms`);
console.log(`ratio to baseline: ${(ours.ms / baseline.ms).toFixed(2)}`);
console.log(`goal: two 2,000-page revisions in a few seconds (≤ 5000 ms): ${ours.ms <= 5000 ? "met" : "NOT met"}`);

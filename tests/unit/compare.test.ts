// The page comparison on synthetic revision pairs, and its alignment checked against an outside
// reference: the `diff` package's array diff over the same normalised page texts.
import { diffArrays } from "diff";
import { describe, expect, it } from "vitest";
import { comparePages, normalisePages, suggestPage, type Comparison } from "@/lib/domain/revisions/compare";

const words = [
  "magneto",
  "timing",
  "breaker",
  "points",
  "rotor",
  "cable",
  "tension",
  "turnbuckle",
  "rigging",
  "brake",
  "lining",
  "axle",
  "nut",
  "torque",
  "cotter",
  "pin",
  "propeller",
  "blade",
  "nick",
  "spinner",
  "fuel",
  "sump",
  "drain",
  "oil",
  "filter",
  "gasket",
  "seal",
  "bearing",
  "hub",
  "strut",
];

/** A page of a made-up manual: running header with page number, label and date, then body text. */
function page(n: number, body: string, label = "Rev 3", date = "2025-06-01") {
  return `TRAINER MAINTENANCE MANUAL ${label} ${date}\nPage ${n}\n${body}\nPrinted ${date}`;
}

let seed = 7;
function random() {
  seed = (seed * 1103515245 + 12345) % 2 ** 31;
  return seed / 2 ** 31;
}

// Like a manual: common trade words on every page, and words that say what a page is about.
const syllables = ["ba", "ke", "lo", "mi", "nu", "ra", "so", "ti", "vu", "za", "pe", "do", "fi", "gu", "ha"];
const rare = Array.from(
  { length: 4000 },
  (_, k) => syllables[k % 15]! + syllables[Math.floor(k / 15) % 15]! + syllables[Math.floor(k / 225) % 15]! + "x",
);

function body(k: number) {
  const out: string[] = [`Section ${k}.`];
  for (let i = 0; i < 120; i++) out.push(i % 2 ? words[Math.floor(random() * words.length)]! : rare[Math.floor(random() * rare.length)]!);
  return out.join(" ");
}

const bodies = Array.from({ length: 60 }, (_, k) => body(k));
const render = (list: string[], label: string, date: string) => list.map((b, i) => page(i + 1, b, label, date));
const oldRev = render(bodies, "Rev 3", "2025-06-01");
const statuses = (c: Comparison) => c.pages.map((p) => `${p.status}:${p.oldPage ?? "-"}>${p.newPage ?? "-"}`);
const labels = ["Rev 3", "Rev 4"];

/** Which old pages the `diff` package calls removed and which new pages added. */
function reference(oldTexts: string[], newTexts: string[]) {
  const a = normalisePages(oldTexts, labels);
  const b = normalisePages(newTexts, labels);
  const removed: number[] = [];
  const added: number[] = [];
  let i = 0;
  let j = 0;
  for (const part of diffArrays(a, b)) {
    const n = part.count ?? part.value.length;
    if (part.added) for (let k = 0; k < n; k++) added.push(++j);
    else if (part.removed) for (let k = 0; k < n; k++) removed.push(++i);
    else {
      i += n;
      j += n;
    }
  }
  return { removed, added };
}

const pagesWith = (c: Comparison, status: string, side: "oldPage" | "newPage") =>
  c.pages.filter((p) => p.status === status).map((p) => p[side]!);

describe("page comparison", () => {
  it("finds nothing when only the labels, dates and page furniture change", () => {
    const newRev = render(bodies, "Rev 4", "2026-03-15");
    const result = comparePages(oldRev, newRev, { labels });
    expect(result.summary).toEqual({ unchanged: 60, changed: 0, moved: 0, added: 0, removed: 0 });
    expect(reference(oldRev, newRev)).toEqual({ removed: [], added: [] });
  });

  it("ignores whitespace and case", () => {
    const newRev = oldRev.map((t) => t.replace(/ /g, "   ").toUpperCase());
    expect(comparePages(oldRev, newRev, { labels }).summary.unchanged).toBe(60);
  });

  it("finds the one edited page, paired with its old page", () => {
    const edited = [...bodies];
    edited[20] = edited[20]!.replace(/torque/g, "TORQUE VALUE CHANGED") + " New limit 120 to 150 in-lb.";
    const result = comparePages(oldRev, render(edited, "Rev 4", "2026-03-15"), { labels });
    expect(result.summary).toMatchObject({ unchanged: 59, changed: 1, added: 0, removed: 0 });
    const changed = result.pages.find((p) => p.status === "changed")!;
    expect(changed).toMatchObject({ oldPage: 21, newPage: 21 });
    expect(changed.similarity).toBeGreaterThan(0.8);
    expect(changed.similarity).toBeLessThan(1);
  });

  it("calls pages inserted in the middle added, and the pages after them moved", () => {
    const inserted = [
      ...bodies.slice(0, 10),
      "Brake fluid servicing. Fill the reservoir with the approved fluid only.",
      "Bleed the brakes from the bottom up.",
      ...bodies.slice(10),
    ];
    const newRev = render(inserted, "Rev 4", "2026-03-15");
    const result = comparePages(oldRev, newRev, { labels });
    expect(pagesWith(result, "added", "newPage")).toEqual([11, 12]);
    expect(result.summary).toMatchObject({ unchanged: 10, moved: 50, changed: 0, removed: 0 });
    expect(result.pages.find((p) => p.oldPage === 11)).toMatchObject({ status: "moved", newPage: 13, similarity: 1 });
    // The outside reference agrees on what was inserted and deleted.
    const ref = reference(oldRev, newRev);
    expect(ref.added).toEqual(pagesWith(result, "added", "newPage"));
    expect(ref.removed).toEqual(pagesWith(result, "removed", "oldPage"));
  });

  it("calls a deleted page removed, in its place in the list", () => {
    const deleted = [...bodies.slice(0, 30), ...bodies.slice(31)];
    const newRev = render(deleted, "Rev 4", "2026-03-15");
    const result = comparePages(oldRev, newRev, { labels });
    expect(pagesWith(result, "removed", "oldPage")).toEqual([31]);
    expect(result.summary).toMatchObject({ unchanged: 30, moved: 29, removed: 1, added: 0, changed: 0 });
    expect(statuses(result)[30]).toBe("removed:31>-");
    const ref = reference(oldRev, newRev);
    expect(ref.removed).toEqual([31]);
    expect(ref.added).toEqual([]);
  });

  it("follows a chapter moved elsewhere: the same text at new page numbers is moved, not changed", () => {
    const chapter = bodies.slice(40, 50);
    const moved = [...bodies.slice(0, 10), ...chapter, ...bodies.slice(10, 40), ...bodies.slice(50)];
    const result = comparePages(oldRev, render(moved, "Rev 4", "2026-03-15"), { labels });
    expect(result.summary.added).toBe(0);
    expect(result.summary.removed).toBe(0);
    expect(result.summary.changed).toBe(0);
    for (let k = 0; k < 10; k++) expect(result.pages.find((p) => p.oldPage === 41 + k)).toMatchObject({ status: "moved", newPage: 11 + k });
  });

  it("pairs a changed page near its place even when pages around it were inserted", () => {
    const both = [...bodies.slice(0, 5), "A new page about fuel sump drains.", ...bodies.slice(5)];
    both[30] = both[30]! + " Added sentence about the cotter pin.";
    const result = comparePages(oldRev, render(both, "Rev 4", "2026-03-15"), { labels });
    expect(result.pages.find((p) => p.status === "changed")).toMatchObject({ oldPage: 30, newPage: 31 });
    expect(pagesWith(result, "added", "newPage")).toEqual([6]);
  });

  it("suggests the moved page, the changed page, or the best match for a removed one", () => {
    // Page 31 is withdrawn and its text folded into page 30; page 12 moves down one.
    const next = [
      ...bodies.slice(0, 10),
      "Inserted page about oil filters and gaskets only.",
      ...bodies.slice(10, 29),
      `${bodies[29]} ${bodies[30]}`,
      ...bodies.slice(31),
    ];
    const newRev = render(next, "Rev 4", "2026-03-15");
    const result = comparePages(oldRev, newRev, { labels });
    expect(suggestPage(result, 12)).toEqual({ page: 13, similarity: 1, status: "moved" });
    // The merged page is a change of one of the two old pages; the other one went, and its
    // suggestion is the page its text went into.
    const merged = result.pages.find((p) => p.newPage === 31)!;
    expect(merged.status).toBe("changed");
    const other = merged.oldPage === 30 ? 31 : 30;
    const removed = suggestPage(result, other, { oldTexts: oldRev, newTexts: newRev, labels });
    expect(removed).toMatchObject({ status: "removed", page: 31 });
    expect(removed.similarity).toBeGreaterThan(0.5);
    // A page whose text went nowhere gets no suggestion.
    const gone = [...bodies.slice(0, 40), ...bodies.slice(41)];
    const lost = render(gone, "Rev 4", "2026-03-15");
    expect(suggestPage(comparePages(oldRev, lost, { labels }), 41, { oldTexts: oldRev, newTexts: lost, labels })).toMatchObject({
      status: "removed",
      page: null,
    });
  });

  it("does not pair pages that share only a template's fixed sentences", () => {
    const template =
      "Record each step, the value measured where there is one, and your initials. Check the measuring tool and its calibration date.";
    const old = [...bodies.slice(0, 20).map((b) => `${template} ${b}`), `${template} propeller track pointer blade tip`];
    const renewed = [
      ...bodies.slice(0, 5).map((b) => `${template} ${b}`),
      `${template} brake fluid reservoir bleed`,
      ...bodies.slice(5, 20).map((b) => `${template} ${b}`),
    ];
    const result = comparePages(render(old, "Rev 3", "2025-06-01"), render(renewed, "Rev 4", "2026-03-15"), { labels });
    expect(result.summary).toMatchObject({ changed: 0, added: 1, removed: 1 });
  });

  // Its speed is measured by `npm run bench:compare`, not asserted here.
  it("compares two 2,000-page revisions with inserts, deletes and an edit", () => {
    const big = Array.from({ length: 2000 }, (_, k) => body(k));
    const oldBig = render(big, "Rev 3", "2025-06-01");
    const changed = [...big.slice(0, 500), "inserted page one", "inserted page two", ...big.slice(500, 1500), ...big.slice(1510)];
    changed[1200] = changed[1200] + " changed words here";
    const result = comparePages(oldBig, render(changed, "Rev 4", "2026-03-15"), { labels });
    expect(result.summary).toMatchObject({ added: 2, removed: 10, changed: 1 });
  });
});

// A manual's contents, the way a maintenance manual is organised: chapter, section, subject, from
// the first line of each page when the document numbers its subjects ATA-style ("32-10-00 MAIN
// GEAR - PROCEDURE"), else from the page headings as they change. Pure: the reader uses the PDF's
// own outline instead when the file has one.

export interface OutlineSubject {
  /** "32-10-00", or "" when the heading carries no code. */
  code: string;
  title: string;
  firstPage: number;
  lastPage: number;
}

export interface OutlineChapter {
  /** "32", or "" for headings without codes. */
  code: string;
  title: string;
  firstPage: number;
  subjects: OutlineSubject[];
}

const coded = /^\s*(\d{2})-(\d{2})-(\d{2})\b\s*(.*)$/;
/** The part of a heading after the subject's title: " - PROCEDURE", " (continued)". */
const partSuffix = /\s+(?:-|–|—)\s+[^-–—]*$|\s*\((?:cont(?:inued|'d)?\.?)\)\s*$/i;

const small = new Set(["and", "or", "of", "the", "for", "to", "in", "on", "with", "a", "an", "at", "by"]);
/** "WHEELS AND BRAKES" → "Wheels and Brakes"; a heading already in mixed case is kept as written. */
const titleCase = (s: string) =>
  s === s.toUpperCase()
    ? s
        .toLowerCase()
        .split(/(\s+)/)
        .map((w, i) => (i > 0 && small.has(w) ? w : w.replace(/(^|[/(-])(\p{L})/gu, (_, a: string, b: string) => a + b.toUpperCase())))
        .join("")
    : s;

/** Chapter names where the standard numbering is common practice (ATA iSpec 2200 chapter titles, from memory). */
const chapterNames: Record<string, string> = {
  "05": "Time limits and maintenance checks",
  "06": "Dimensions and areas",
  "07": "Lifting and shoring",
  "08": "Levelling and weighing",
  "09": "Towing and taxiing",
  "10": "Parking, mooring, storage",
  "11": "Placards and markings",
  "12": "Servicing",
  "20": "Standard practices, airframe",
  "21": "Air conditioning",
  "24": "Electrical power",
  "25": "Equipment and furnishings",
  "27": "Flight controls",
  "28": "Fuel",
  "29": "Hydraulic power",
  "30": "Ice and rain protection",
  "32": "Landing gear",
  "33": "Lights",
  "34": "Navigation",
  "51": "Standard practices and structures",
  "52": "Doors",
  "53": "Fuselage",
  "55": "Stabilizers",
  "57": "Wings",
  "61": "Propellers",
  "71": "Power plant",
  "72": "Engine",
  "73": "Engine fuel and control",
  "74": "Ignition",
  "76": "Engine controls",
  "77": "Engine indicating",
  "79": "Oil",
  "80": "Starting",
};

export function outlineFromHeadings(pages: readonly { page: number; heading: string }[]): OutlineChapter[] {
  const sorted = [...pages].sort((a, b) => a.page - b.page);
  const withCode = sorted.filter((p) => coded.test(p.heading));
  // A document that numbers its subjects is outlined by the numbers; pages between keep the subject before them.
  if (withCode.length >= Math.max(2, sorted.length * 0.3)) {
    const chapters: OutlineChapter[] = [];
    for (const p of sorted) {
      const m = coded.exec(p.heading);
      const last = chapters.at(-1)?.subjects.at(-1);
      if (!m) {
        if (last) last.lastPage = p.page;
        continue;
      }
      const [, ch, sec, sub, rest] = m;
      const code = `${ch}-${sec}-${sub}`;
      if (last?.code === code) {
        last.lastPage = p.page;
        continue;
      }
      let chapter = chapters.at(-1);
      if (!chapter || chapter.code !== ch) {
        chapter = { code: ch!, title: chapterNames[ch!] ?? `Chapter ${ch}`, firstPage: p.page, subjects: [] };
        chapters.push(chapter);
      }
      chapter.subjects.push({ code, title: titleCase(rest!.replace(partSuffix, "").trim()) || code, firstPage: p.page, lastPage: p.page });
    }
    return chapters;
  }
  // No numbering: one entry each time the heading changes (a running title repeated on every page is one entry).
  const subjects: OutlineSubject[] = [];
  for (const p of sorted) {
    const title = p.heading.replace(partSuffix, "").trim();
    const last = subjects.at(-1);
    if (last && (title === last.title || !title)) last.lastPage = p.page;
    else if (title) subjects.push({ code: "", title: titleCase(title), firstPage: p.page, lastPage: p.page });
  }
  if (subjects.length < 2) return [];
  return [{ code: "", title: "Contents", firstPage: subjects[0]!.firstPage, subjects }];
}

/** The subject a page belongs to, for marking where the reader is. */
export function subjectAt(outline: readonly OutlineChapter[], page: number): OutlineSubject | null {
  for (const c of outline) for (const s of c.subjects) if (page >= s.firstPage && page <= s.lastPage) return s;
  return null;
}

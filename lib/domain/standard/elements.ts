// The mechanic certification standard as data (pure): element codes as the standard writes them
// (AM.I.A.K1: Aviation Mechanic, section I, area of operation A, knowledge element 1), the school's
// CSV copy read into elements with a reason for every row refused, and a student's coverage.
//
// The section numerals and names (I General, II Airframe, III Powerplant) and the element kinds
// (K knowledge, R risk management, S skill) follow FAA-S-ACS-1 as remembered ("from memory"):
// the school's own CSV of the current standard is what counts.

export const elementKinds = ["knowledge", "risk", "skill"] as const;
export type ElementKind = (typeof elementKinds)[number];
export const sections = { I: "General", II: "Airframe", III: "Powerplant" } as const;
export type SectionNumeral = keyof typeof sections;

const kindLetters: Record<string, ElementKind> = { K: "knowledge", R: "risk", S: "skill" };
export const elementCodePattern = /^AM\.(I|II|III)\.([A-Z])\.(K|R|S)([1-9]\d?)$/;

export interface StandardElement {
  code: string;
  section: (typeof sections)[SectionNumeral];
  areaLetter: string;
  areaTitle: string;
  kind: ElementKind;
  number: number;
  title: string;
}

/** The parts of a code, or null when it is not one ("am.i.a.k1" reads as AM.I.A.K1). */
export function readElementCode(raw: string): Pick<StandardElement, "code" | "section" | "areaLetter" | "kind" | "number"> | null {
  const code = raw.trim().toUpperCase();
  const m = elementCodePattern.exec(code);
  if (!m) return null;
  return { code, section: sections[m[1] as SectionNumeral], areaLetter: m[2]!, kind: kindLetters[m[3]!]!, number: Number(m[4]) };
}

/** RFC 4180 CSV: quoted fields with doubled quotes, CRLF or LF line ends. Each row with the line it started on. */
export function parseCsv(text: string): { line: number; cells: string[] }[] {
  const rows: { line: number; cells: string[] }[] = [];
  let cells: string[] = [];
  let cell = "";
  let quoted = false;
  let line = 1;
  let rowLine = 1;
  const body = text.replace(/^\uFEFF/, "");
  for (let i = 0; i < body.length; i++) {
    const ch = body[i]!;
    if (quoted) {
      if (ch === '"' && body[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else {
        if (ch === "\n") line++;
        cell += ch;
      }
      continue;
    }
    if (ch === '"' && cell === "") quoted = true;
    else if (ch === ",") {
      cells.push(cell);
      cell = "";
    } else if (ch === "\n" || ch === "\r") {
      if (ch === "\r" && body[i + 1] === "\n") i++;
      cells.push(cell);
      rows.push({ line: rowLine, cells });
      cells = [];
      cell = "";
      rowLine = ++line;
    } else cell += ch;
  }
  if (cell !== "" || cells.length) {
    cells.push(cell);
    rows.push({ line: rowLine, cells });
  }
  return rows.filter((r) => r.cells.some((c) => c.trim() !== ""));
}

export const maxStandardRows = 5000;
const headerNames = { code: ["code"], area: ["area", "area of operation", "area_title"], title: ["element", "title", "text"] };

/**
 * Reads the school's CSV: a header naming `code`, `area` (the area of operation's title) and
 * `element` (its words), then one element a row. Every row that cannot be taken is refused with
 * its line and why; the rest are returned, so one bad row does not sink the file.
 */
export function readStandardCsv(text: string): { elements: StandardElement[]; refused: { line: number; reason: string }[] } {
  const rows = parseCsv(text);
  const refused: { line: number; reason: string }[] = [];
  const header = rows.shift();
  if (!header)
    return { elements: [], refused: [{ line: 1, reason: "The file is empty: the first line names the columns code, area, element." }] };
  const names = header.cells.map((c) => c.trim().toLowerCase());
  const column = (k: keyof typeof headerNames) => names.findIndex((n) => headerNames[k].includes(n));
  const at = { code: column("code"), area: column("area"), title: column("title") };
  const missing = Object.entries(at)
    .filter(([, i]) => i < 0)
    .map(([k]) => (k === "title" ? "element" : k));
  if (missing.length)
    return {
      elements: [],
      refused: [{ line: header.line, reason: `The first line names the columns code, area, element; missing: ${missing.join(", ")}.` }],
    };
  if (rows.length > maxStandardRows)
    return { elements: [], refused: [{ line: rows[maxStandardRows]!.line, reason: `At most ${maxStandardRows} elements in one file.` }] };
  const seen = new Map<string, number>();
  const elements: StandardElement[] = [];
  for (const row of rows) {
    const refuse = (reason: string) => refused.push({ line: row.line, reason });
    const raw = row.cells[at.code] ?? "";
    const parts = readElementCode(raw);
    const title = (row.cells[at.title] ?? "").trim().replace(/\s+/g, " ");
    const areaTitle = (row.cells[at.area] ?? "").trim().replace(/\s+/g, " ");
    if (row.cells.some((c) => c.includes("\u0000"))) refuse("A NUL character cannot be stored.");
    else if (!parts) refuse(raw.trim() ? `"${raw.trim().slice(0, 40)}" is not an element code such as AM.I.A.K1.` : "The code is empty.");
    else if (seen.has(parts.code)) refuse(`${parts.code} is already on line ${seen.get(parts.code)}.`);
    else if (!title) refuse(`${parts.code} has no element words.`);
    else if (title.length > 1000) refuse(`${parts.code}: the element words are over 1000 characters.`);
    else if (!areaTitle) refuse(`${parts.code} has no area of operation.`);
    else if (areaTitle.length > 200) refuse(`${parts.code}: the area of operation is over 200 characters.`);
    else {
      seen.set(parts.code, row.line);
      elements.push({ ...parts, areaTitle, title });
    }
  }
  return { elements, refused };
}

export type CoverageStatus = "demonstrated" | "practised" | "missing";

export interface RunForCoverage {
  runId: string;
  signedOff: boolean;
  /** Started, or handed in, or signed off: a run not started practised nothing. */
  started: boolean;
  /** The element codes its card version's steps are mapped to. */
  codes: readonly string[];
  signedAt: string | null;
}

/**
 * Each element's status for one student: demonstrated in a signed-off run (the earliest such run
 * named), practised in a run started but not signed off, missing otherwise.
 */
export function coverageOf(
  elements: readonly { code: string }[],
  runs: readonly RunForCoverage[],
): { code: string; status: CoverageStatus; runId: string | null }[] {
  const signed = [...runs].filter((r) => r.signedOff).sort((a, b) => (a.signedAt ?? "").localeCompare(b.signedAt ?? ""));
  return elements.map(({ code }) => {
    const shown = signed.find((r) => r.codes.includes(code));
    if (shown) return { code, status: "demonstrated" as const, runId: shown.runId };
    const tried = runs.find((r) => !r.signedOff && r.started && r.codes.includes(code));
    return tried ? { code, status: "practised" as const, runId: tried.runId } : { code, status: "missing" as const, runId: null };
  });
}

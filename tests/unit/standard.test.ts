// The certification standard's CSV and coverage rules (lib/domain/standard/elements.ts). The code
// form AM.<section>.<area>.<kind><n> is the one DESIGN.md names (FAA-S-ACS-1, "AM.I.A.K1"); the
// section names and element kinds are from memory, as the module says.
import { describe, expect, it } from "vitest";
import { coverageOf, parseCsv, readElementCode, readStandardCsv } from "@/lib/domain/standard/elements";

describe("element codes", () => {
  it("reads the standard's code form and nothing else", () => {
    expect(readElementCode(" am.ii.a.s12 ")).toEqual({
      code: "AM.II.A.S12",
      section: "Airframe",
      areaLetter: "A",
      kind: "skill",
      number: 12,
    });
    expect(readElementCode("AM.I.A.K1")?.kind).toBe("knowledge");
    expect(readElementCode("AM.III.O.R2")).toMatchObject({ section: "Powerplant", kind: "risk" });
    for (const bad of ["AM.IV.A.K1", "AM.I.A.X1", "AM.I.A.K0", "AM.I.AA.K1", "PA.I.A.K1", "AM.I.A.K100", ""])
      expect(readElementCode(bad)).toBeNull();
  });
});

describe("the school's CSV", () => {
  it("parses quotes, doubled quotes, CRLF and a line break inside a quoted cell, keeping line numbers", () => {
    const rows = parseCsv(
      '\uFEFFcode,area,element\r\nAM.I.A.K1,"Area, one","Say ""why"""\r\n\r\nAM.I.A.K2,Two,"Two\nlines"\nAM.I.A.K3,Three,x',
    );
    expect(rows.map((r) => r.line)).toEqual([1, 2, 4, 6]);
    expect(rows[1]!.cells).toEqual(["AM.I.A.K1", "Area, one", 'Say "why"']);
    expect(rows[2]!.cells[2]).toBe("Two\nlines");
  });

  it("takes the good rows and refuses each bad one with its line and why", () => {
    const csv = [
      "Element,Code,Area",
      "Install solid rivets,AM.II.A.S1,Metallic Structures",
      "Something,AM.II.A.Z9,Metallic Structures",
      "Again,am.ii.a.s1,Metallic Structures",
      ",AM.II.A.S2,Metallic Structures",
      "Words,AM.II.A.S3,",
      "Words,,Metallic Structures",
      "Nul \u0000 here,AM.II.A.S4,Metallic Structures",
      "Check cable tension,AM.II.C.S1,Flight Controls",
    ].join("\n");
    const { elements, refused } = readStandardCsv(csv);
    expect(elements.map((e) => e.code)).toEqual(["AM.II.A.S1", "AM.II.C.S1"]);
    expect(elements[0]).toMatchObject({ section: "Airframe", areaTitle: "Metallic Structures", title: "Install solid rivets" });
    expect(refused).toEqual([
      { line: 3, reason: '"AM.II.A.Z9" is not an element code such as AM.I.A.K1.' },
      { line: 4, reason: "AM.II.A.S1 is already on line 2." },
      { line: 5, reason: "AM.II.A.S2 has no element words." },
      { line: 6, reason: "AM.II.A.S3 has no area of operation." },
      { line: 7, reason: "The code is empty." },
      { line: 8, reason: "A NUL character cannot be stored." },
    ]);
  });

  it("says what the header lacks, and refuses an empty file", () => {
    expect(readStandardCsv("code,words\nAM.I.A.K1,x").refused).toEqual([
      { line: 1, reason: "The first line names the columns code, area, element; missing: area, element." },
    ]);
    expect(readStandardCsv("").refused[0]!.reason).toMatch(/empty/);
  });
});

describe("coverage", () => {
  it("is demonstrated by the earliest signed-off run, practised by a started one, missing otherwise", () => {
    const elements = ["AM.II.A.S1", "AM.II.A.S2", "AM.II.C.S1", "AM.II.E.S1"].map((code) => ({ code }));
    const out = coverageOf(elements, [
      { runId: "late", signedOff: true, started: true, codes: ["AM.II.A.S1"], signedAt: "2026-12-02T10:00:00Z" },
      { runId: "early", signedOff: true, started: true, codes: ["AM.II.A.S1", "AM.II.A.S2"], signedAt: "2026-11-02T10:00:00Z" },
      { runId: "open", signedOff: false, started: true, codes: ["AM.II.C.S1", "AM.II.A.S2"], signedAt: null },
      { runId: "untouched", signedOff: false, started: false, codes: ["AM.II.E.S1"], signedAt: null },
    ]);
    expect(out).toEqual([
      { code: "AM.II.A.S1", status: "demonstrated", runId: "early" },
      { code: "AM.II.A.S2", status: "demonstrated", runId: "early" },
      { code: "AM.II.C.S1", status: "practised", runId: "open" },
      { code: "AM.II.E.S1", status: "missing", runId: null },
    ]);
  });
});

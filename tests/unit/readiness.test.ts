import { describe, expect, it } from "vitest";
import type { CoverageDto } from "@/lib/contracts/standard";
import { readinessCsv, readinessOf } from "@/lib/domain/standard/readiness";

const el = (code: string, kind: "knowledge" | "risk" | "skill", section: string, status: "demonstrated" | "practised" | "missing") => ({
  code,
  kind,
  title: `Title of ${code}`,
  section,
  area: "A. Fundamentals",
  status,
  runId: status === "missing" ? null : "r1",
  run: status === "missing" ? null : { title: "Riveted splice", versionNumber: 2, signedAt: null, instructorName: null, revisions: [] },
});

const coverage = (elements: CoverageDto["elements"]): CoverageDto => ({
  student: { id: "s1", name: "=Sam" },
  excerpt: true,
  elements,
  totals: {},
});

describe("readiness before the practical test", () => {
  it("lists what is not demonstrated per section, with where it was practised", () => {
    const r = readinessOf(
      coverage([
        el("AM.I.A.K1", "knowledge", "General", "demonstrated"),
        el("AM.I.A.S1", "skill", "General", "practised"),
        el("AM.II.C.S2", "skill", "Airframe", "missing"),
      ]),
      { General: 150 },
      { General: 400 },
    );
    expect(r.remaining).toBe(2);
    expect(r.ready).toBe(false);
    const general = r.sections.find((s) => s.section === "General")!;
    expect(general.counts.skill).toEqual({ demonstrated: 0, total: 1 });
    expect(general.counts.knowledge).toEqual({ demonstrated: 1, total: 1 });
    expect(general.attendedMinutes).toBe(150);
    expect(general.plannedHours).toBe(400);
    expect(general.remaining).toEqual([expect.objectContaining({ code: "AM.I.A.S1", practisedIn: "Riveted splice (version 2)" })]);
    // Powerplant: nothing in the standard here and no plan, so it is not shown.
    expect(r.sections.map((s) => s.section)).toEqual(["General", "Airframe"]);
  });

  it("is ready only with every skill element demonstrated and every planned hour attended", () => {
    const all = coverage([el("AM.I.A.S1", "skill", "General", "demonstrated"), el("AM.I.A.K1", "knowledge", "General", "missing")]);
    expect(readinessOf(all, { General: 400 * 60 }, { General: 400 }).ready).toBe(true);
    expect(readinessOf(all, { General: 400 * 60 - 1 }, { General: 400 }).ready).toBe(false);
    expect(readinessOf(all, {}, {}).ready).toBe(true);
    // No standard at all is not "ready".
    expect(readinessOf(coverage([]), {}, {}).ready).toBe(false);
  });

  it("writes one CSV line per element left, names kept as text", () => {
    const csv = readinessCsv(readinessOf(coverage([el("AM.II.C.S2", "skill", "Airframe", "missing")]), {}, {}));
    const lines = csv.trimEnd().split("\r\n");
    expect(lines[0]).toBe("Student,Section,Code,Kind,Area of operation,Element,Status,Practised in");
    expect(lines[1]).toBe("'=Sam,Airframe,AM.II.C.S2,Skill,A. Fundamentals,Title of AM.II.C.S2,Not yet,");
    expect(lines).toHaveLength(2);
  });
});

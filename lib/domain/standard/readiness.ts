// What remains before the oral and practical test (pure): per section of the standard, the elements
// not yet demonstrated in a signed-off run, and the hours attended against the school's plan. The
// CSV and the PDF both read this one shape.
import type { CoverageDto } from "@/lib/contracts/standard";
import type { CoverageStatus, ElementKind } from "@/lib/domain/standard/elements";
import { sections } from "@/lib/domain/standard/elements";
import { toCsv } from "@/lib/domain/runs/csv";

export const coverageWords: Record<CoverageStatus, string> = {
  demonstrated: "Demonstrated",
  practised: "Practised, not signed off",
  missing: "Not yet",
};
export const kindWords: Record<ElementKind, string> = { knowledge: "Knowledge", risk: "Risk management", skill: "Skill" };

export interface ReadinessSection {
  section: string;
  /** Elements of each kind demonstrated, of those the standard has in this section. */
  counts: Record<ElementKind, { demonstrated: number; total: number }>;
  attendedMinutes: number;
  /** The school's planned hours for the section; null when it has no plan. */
  plannedHours: number | null;
  remaining: {
    code: string;
    kind: ElementKind;
    title: string;
    area: string;
    status: Exclude<CoverageStatus, "demonstrated">;
    practisedIn: string | null;
  }[];
}

export interface Readiness {
  student: { id: string; name: string };
  excerpt: boolean;
  sections: ReadinessSection[];
  remaining: number;
  /** Every skill element demonstrated (what the practical test asks to see) and every planned hour attended. */
  ready: boolean;
}

export function readinessOf(
  coverage: CoverageDto,
  minutesBySection: Partial<Record<string, number>>,
  plannedHours: Partial<Record<string, number>>,
): Readiness {
  const out: ReadinessSection[] = Object.values(sections).map((section) => ({
    section,
    counts: { knowledge: { demonstrated: 0, total: 0 }, risk: { demonstrated: 0, total: 0 }, skill: { demonstrated: 0, total: 0 } },
    attendedMinutes: minutesBySection[section] ?? 0,
    plannedHours: plannedHours[section] ?? null,
    remaining: [],
  }));
  for (const e of coverage.elements) {
    const s = out.find((x) => x.section === e.section);
    if (!s) continue;
    s.counts[e.kind].total++;
    if (e.status === "demonstrated") s.counts[e.kind].demonstrated++;
    else
      s.remaining.push({
        code: e.code,
        kind: e.kind,
        title: e.title,
        area: e.area,
        status: e.status,
        practisedIn: e.status === "practised" && e.run ? `${e.run.title} (version ${e.run.versionNumber})` : null,
      });
  }
  // A section the standard has nothing of here and the school plans no hours for says nothing.
  const shown = out.filter((s) => s.counts.skill.total + s.counts.knowledge.total + s.counts.risk.total > 0 || s.plannedHours !== null);
  const remaining = shown.reduce((n, s) => n + s.remaining.length, 0);
  const ready =
    coverage.elements.length > 0 &&
    shown.every(
      (s) => s.counts.skill.demonstrated === s.counts.skill.total && (s.plannedHours === null || s.attendedMinutes >= s.plannedHours * 60),
    );
  return { student: coverage.student, excerpt: coverage.excerpt, sections: shown, remaining, ready };
}

export const hoursText = (minutes: number) => (minutes / 60).toFixed(1);

export const readinessCsvHeader = ["Student", "Section", "Code", "Kind", "Area of operation", "Element", "Status", "Practised in"] as const;

/** One line per element still to demonstrate; a student with nothing left has the header alone. */
export function readinessCsv(r: Readiness): string {
  return toCsv(
    readinessCsvHeader,
    r.sections.flatMap((s) =>
      s.remaining.map((e) => [
        r.student.name,
        s.section,
        e.code,
        kindWords[e.kind],
        e.area,
        e.title,
        coverageWords[e.status],
        e.practisedIn ?? "",
      ]),
    ),
  );
}

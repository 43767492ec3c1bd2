import Link from "next/link";
import { BarFigure } from "@/components/bar-figure";
import type { ClassCoverageDto } from "@/lib/contracts/standard";
import { sections, type CoverageStatus } from "@/lib/domain/standard/elements";

// Words and marks together, so a cell reads the same without its colour (and in print).
const cellWords: Record<CoverageStatus, { mark: string; words: string; className: string }> = {
  demonstrated: { mark: "✓", words: "Shown", className: "bg-ok-pale font-bold text-ok" },
  practised: { mark: "◐", words: "Practised", className: "bg-amber-pale font-semibold" },
  missing: { mark: "—", words: "Not yet", className: "text-ink-soft" },
};

/**
 * The class against the standard's skill elements: a chart of each student's count, the gaps (no
 * student has shown the element), then the grid itself, one table per section.
 */
export function ClassCoverageSection({ coverage }: { coverage: ClassCoverageDto }) {
  if (!coverage.elements.length || !coverage.students.length) return null;
  const gaps = new Set(coverage.gaps);
  const total = coverage.elements.length;
  return (
    <section aria-labelledby="class-coverage" className="panel flex flex-col gap-4">
      <h2 id="class-coverage">Certification standard: skill elements</h2>
      {coverage.excerpt ? (
        <p className="hint">
          The standard here includes the demo&apos;s excerpt (to be verified against the current FAA-S-ACS-1); it is not the whole standard.
        </p>
      ) : null}
      <BarFigure
        title="Skill elements per student"
        rowHeader="Student"
        summary={`Skill elements per student, of ${total}: ${coverage.students.map((s) => `${s.name} ${s.demonstrated} demonstrated, ${s.practised} practised`).join("; ")}.`}
        stacked
        max={total}
        rows={coverage.students.map((s) => ({
          label: s.name,
          values: { demonstrated: s.demonstrated, practised: s.practised, missing: s.missing },
          note: `${s.demonstrated}/${total}`,
        }))}
        series={[
          { key: "demonstrated", label: "Demonstrated", colour: "#1d6a35" },
          { key: "practised", label: "Practised, not signed off", colour: "#f2b01e" },
          { key: "missing", label: "Not yet", colour: "#ffffff" },
        ]}
      />
      <div className={gaps.size ? "notice-todo" : "notice-ok"}>
        {gaps.size ? (
          <>
            <p className="font-bold">
              Not yet demonstrated by anyone in the class: {gaps.size} of {total}
            </p>
            <ul className="flex flex-col gap-1">
              {coverage.elements
                .filter((e) => gaps.has(e.code))
                .map((e) => (
                  <li key={e.code}>
                    <span className="font-mono font-semibold">{e.code}</span> {e.title}
                  </li>
                ))}
            </ul>
          </>
        ) : (
          "Every skill element here has been demonstrated by at least one student."
        )}
      </div>
      {Object.values(sections).map((section) => {
        const elements = coverage.elements.filter((e) => e.section === section);
        if (!elements.length) return null;
        return (
          <div key={section} className="overflow-x-auto">
            <table className="data-table">
              <caption className="text-left text-lg font-bold">{section}</caption>
              <thead>
                <tr>
                  <th scope="col">Student</th>
                  {elements.map((e) => (
                    <th key={e.code} scope="col" title={e.title} className={gaps.has(e.code) ? "bg-danger-pale" : ""}>
                      <span className="font-mono whitespace-nowrap">{e.code}</span>
                      {gaps.has(e.code) ? <span className="block text-sm font-bold text-danger">gap</span> : null}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {coverage.students.map((s) => (
                  <tr key={s.id}>
                    <th scope="row">
                      <Link href={`/records/students/${s.id}`} className="inline-flex min-h-11 items-center font-semibold">
                        {s.name}
                      </Link>
                    </th>
                    {elements.map((e) => {
                      const c = cellWords[s.statuses[e.code] ?? "missing"];
                      return (
                        <td key={e.code} className={`text-center whitespace-nowrap ${c.className}`}>
                          <span aria-hidden="true">{c.mark} </span>
                          {c.words}
                        </td>
                      );
                    })}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        );
      })}
    </section>
  );
}

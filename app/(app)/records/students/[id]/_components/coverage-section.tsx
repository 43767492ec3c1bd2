import { BarFigure } from "@/components/bar-figure";
import { Table } from "@/components/table";
import type { Readiness } from "@/lib/domain/standard/readiness";
import type { CoverageDto } from "@/lib/contracts/standard";
import { dateTimeIn } from "@/lib/domain/time";

const statusWords = { demonstrated: "Demonstrated", practised: "Practised, not signed off", missing: "Not yet" } as const;
const kindWords = { knowledge: "Knowledge", risk: "Risk management", skill: "Skill" } as const;

/** The standard's elements against the student's runs: totals per section, then each element. */
export function CoverageSection({ coverage, readiness, zone }: { coverage: CoverageDto; readiness: Readiness; zone: string }) {
  if (!coverage.elements.length) return null;
  const bySection = Object.entries(coverage.totals);
  return (
    <section aria-labelledby="coverage" className="panel flex flex-col gap-3">
      <h2 id="coverage">Certification standard: coverage</h2>
      {coverage.excerpt ? (
        <p className="hint">
          The standard here includes the demo&apos;s excerpt (to be verified against the current FAA-S-ACS-1); it is not the whole standard.
        </p>
      ) : null}
      <div className={readiness.ready ? "notice-ok" : "notice-todo"}>
        <p>
          {readiness.ready
            ? "Every skill element is demonstrated and every planned hour attended."
            : `Before the oral and practical test: ${readiness.remaining} element${readiness.remaining === 1 ? "" : "s"} still to demonstrate.`}
        </p>
        <div className="mt-2 flex flex-wrap gap-3">
          <a
            className="btn btn-secondary"
            href={`/api/records/students/${coverage.student.id}/readiness?format=pdf`}
            target="_blank"
            rel="noreferrer"
          >
            Readiness report (PDF)
          </a>
          <a className="btn btn-secondary" href={`/api/records/students/${coverage.student.id}/readiness?format=csv`}>
            Readiness report (CSV)
          </a>
        </div>
      </div>
      <BarFigure
        title="Skill elements per section"
        rowHeader="Section"
        summary={`Skill elements per section: ${bySection.map(([s, t]) => `${s} ${t.skill.demonstrated} demonstrated, ${t.skill.practised} practised, ${t.skill.missing} not yet`).join("; ")}.`}
        stacked
        rows={bySection.map(([section, t]) => ({
          label: section,
          values: { demonstrated: t.skill.demonstrated, practised: t.skill.practised, missing: t.skill.missing },
          note: `${t.skill.demonstrated}/${t.skill.demonstrated + t.skill.practised + t.skill.missing}`,
        }))}
        series={[
          { key: "demonstrated", label: "Demonstrated", colour: "#1d6a35" },
          { key: "practised", label: "Practised, not signed off", colour: "#f2b01e" },
          { key: "missing", label: "Not yet", colour: "#ffffff" },
        ]}
      />
      <Table
        rows={bySection}
        rowKey={([section]) => section}
        columns={[
          { header: "Section", cell: ([section]) => section },
          ...(["skill", "knowledge", "risk"] as const).map((kind) => ({
            header: kindWords[kind],
            key: kind,
            cell: ([, t]: [string, CoverageDto["totals"][string]]) => {
              const c = t[kind];
              const all = c.demonstrated + c.practised + c.missing;
              return all ? `${c.demonstrated} of ${all} demonstrated${c.practised ? `, ${c.practised} practised` : ""}` : "—";
            },
          })),
        ]}
      />
      <Table
        rows={coverage.elements}
        rowKey={(e) => e.code}
        columns={[
          { header: "Code", cell: (e) => <span className="font-mono font-semibold">{e.code}</span> },
          { header: "Element", cell: (e) => `${e.title} (${kindWords[e.kind].toLowerCase()}; ${e.area})` },
          {
            header: "Status",
            cell: (e) => statusWords[e.status],
            className: (e) => (e.status === "missing" ? "font-bold text-danger" : e.status === "demonstrated" ? "font-bold text-ok" : ""),
          },
          {
            header: "Shown in",
            cell: (e) =>
              e.run
                ? `${e.run.title} (version ${e.run.versionNumber})${e.run.signedAt ? `, signed off by ${e.run.instructorName} ${dateTimeIn(zone, e.run.signedAt)}` : ", in work"}${e.run.revisions.length ? `; ${e.run.revisions.join("; ")}` : ""}`
                : "—",
          },
        ]}
      />
    </section>
  );
}

import { Table } from "@/components/table";
import type { CoverageDto } from "@/lib/contracts/standard";
import { dateTimeIn } from "@/lib/domain/time";

const statusWords = { demonstrated: "Demonstrated", practised: "Practised, not signed off", missing: "Not yet" } as const;
const kindWords = { knowledge: "Knowledge", risk: "Risk management", skill: "Skill" } as const;

/** The standard's elements against the student's runs: totals per section, then each element. */
export function CoverageSection({ coverage, zone }: { coverage: CoverageDto; zone: string }) {
  if (!coverage.elements.length) return null;
  return (
    <section aria-labelledby="coverage" className="panel flex flex-col gap-3">
      <h2 id="coverage">Certification standard: coverage</h2>
      {coverage.excerpt ? (
        <p className="hint">
          The standard here includes the demo&apos;s excerpt (to be verified against the current FAA-S-ACS-1); it is not the whole standard.
        </p>
      ) : null}
      <Table
        rows={Object.entries(coverage.totals)}
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

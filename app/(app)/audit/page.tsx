import type { Metadata } from "next";
import { Table } from "@/components/table";
import { listAuditEvents } from "@/lib/server/audit";
import { requirePageUser } from "@/app/_adapters/session";
import { auditQuerySchema, type AuditKind } from "@/lib/domain/validation/audit";

export const metadata: Metadata = { title: "Audit log" };

const kindLabels: Record<AuditKind, string> = {
  accounts: "Accounts",
  classes: "Classes",
  library: "Uploads and revisions",
  cards: "Task cards and publications",
  assignments: "Assignments",
  runs: "Buy-offs, returns and sign-offs",
  tools: "Tool room: loans, holds, calibrations",
  attendance: "Attendance and the standard",
};

export default async function AuditPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  await requirePageUser("audit:view", "/audit");
  const filter = auditQuerySchema.parse(await searchParams);
  const events = await listAuditEvents(filter);
  return (
    <div className="flex flex-col gap-6">
      <h1>Audit log</h1>
      <form method="get" className="panel grid gap-3 sm:grid-cols-5 sm:items-end" aria-label="Filter the audit log">
        <div className="field">
          <label htmlFor="audit-kind" className="label">
            What
          </label>
          <select id="audit-kind" name="kind" className="input" defaultValue={filter.kind ?? ""}>
            <option value="">Everything</option>
            {Object.entries(kindLabels).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        </div>
        <div className="field">
          <label htmlFor="audit-actor" className="label">
            Who (name or e-mail)
          </label>
          <input id="audit-actor" name="actor" className="input" defaultValue={filter.actor ?? ""} />
        </div>
        <div className="field">
          <label htmlFor="audit-from" className="label">
            From
          </label>
          <input id="audit-from" name="from" type="date" className="input" defaultValue={filter.from ?? ""} />
        </div>
        <div className="field">
          <label htmlFor="audit-to" className="label">
            To
          </label>
          <input id="audit-to" name="to" type="date" className="input" defaultValue={filter.to ?? ""} />
        </div>
        <button type="submit" className="btn btn-primary">
          Show
        </button>
      </form>
      <p className="text-ink-soft">The latest {filter.limit} entries that match, newest first. Entries cannot be edited.</p>
      <div className="panel overflow-x-auto">
        <Table
          rows={events}
          rowKey={(e) => e.id}
          empty="Nothing recorded that matches."
          columns={[
            {
              header: "When",
              className: "whitespace-nowrap",
              cell: (e) => `${e.createdAt.toISOString().replace("T", " ").slice(0, 19)} UTC`,
            },
            {
              header: "What happened",
              cell: (e) => (
                <>
                  <p>{e.summary}</p>
                  {e.detailLines.length ? (
                    <details className="text-sm">
                      <summary className="cursor-pointer text-ink-soft">Details</summary>
                      <dl className="mt-1 grid grid-cols-[max-content_1fr] gap-x-3 gap-y-1">
                        {e.detailLines.map((line, i) => (
                          <div key={i} className="contents">
                            <dt className="font-semibold">{line.label}</dt>
                            <dd className="whitespace-pre-wrap">{line.value}</dd>
                          </div>
                        ))}
                      </dl>
                    </details>
                  ) : null}
                </>
              ),
            },
          ]}
        />
      </div>
    </div>
  );
}

import type { Metadata } from "next";
import { Table } from "@/components/table";
import { requirePageUser } from "@/app/_adapters/session";
import { dateTimeIn } from "@/lib/domain/time";
import { listKits, listTools } from "@/lib/server/tools/catalogue";
import { lendingChoices, listCheckouts, listHolds } from "@/lib/server/tools/lending";
import { schoolTimeZone } from "@/lib/server/settings";
import { OutNow } from "./_components/out-now";
import { LendForm } from "./_components/lend-form";
import { ToolNav } from "./_components/tool-nav";

export const metadata: Metadata = { title: "Tool room" };

export default async function ToolRoomPage() {
  const user = await requirePageUser("tools:lend", "/tools");
  const [kits, tools, borrowers, out, holds, zone] = await Promise.all([
    listKits(),
    listTools(),
    lendingChoices(),
    listCheckouts({ actor: user, status: "open" }),
    listHolds({ actor: user }),
    schoolTimeZone(),
  ]);
  const overdue = out.filter((c) => c.overdue);
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-3">
        <h1>Tool room</h1>
        <ToolNav current="/tools" />
      </div>
      <LendForm kits={kits} tools={tools} borrowers={borrowers} />
      <section aria-labelledby="out-now" className="panel flex flex-col gap-3">
        <h2 id="out-now">
          Out now: {out.length}
          {overdue.length ? <span className="text-danger"> · {overdue.length} past due</span> : null}
        </h2>
        <p className="hint">Past-due loans are mailed once to the student and their instructors.</p>
        <OutNow out={out} dueText={Object.fromEntries(out.map((c) => [c.id, dateTimeIn(zone, c.dueAt)]))} />
      </section>
      <section aria-labelledby="holds" className="panel flex flex-col gap-3">
        <h2 id="holds">Missing tools: {holds.length} open</h2>
        <p className="hint">
          A student&apos;s run cannot be handed in while a tool lent to them is missing. Their instructor clears the hold from Home.
        </p>
        <Table
          rows={holds}
          rowKey={(h) => h.id}
          empty="No tool is missing."
          columns={[
            {
              header: "Tool",
              cell: (h) => (
                <span>
                  <strong className="font-mono">{h.tool.number}</strong> {h.tool.description}
                </span>
              ),
            },
            { header: "Lent to", cell: (h) => h.userName },
            { header: "Run held", cell: (h) => h.runTitle ?? "Every open run of theirs (lent for the day)" },
            { header: "Found missing", cell: (h) => `${dateTimeIn(zone, h.openedAt)} by ${h.openedByName}` },
          ]}
        />
      </section>
    </div>
  );
}

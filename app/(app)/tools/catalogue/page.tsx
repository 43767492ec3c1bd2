import type { Metadata } from "next";
import Link from "next/link";
import { Table } from "@/components/table";
import { requirePageUser } from "@/app/_adapters/session";
import { calibrationWords } from "@/lib/domain/tools/tool-room";
import { listKits, listTools } from "@/lib/server/tools/catalogue";
import { AddKitForm, AddToolForm } from "../_components/catalogue-forms";
import { ToolNav } from "../_components/tool-nav";

export const metadata: Metadata = { title: "Tools and kits" };

/** A PDF from the API, opened in a tab of its own (not a page of the app). */
const labelSheet = "/api/tools/labels";

export default async function CataloguePage() {
  await requirePageUser("tools:lend", "/tools/catalogue");
  const [kits, tools] = await Promise.all([listKits(), listTools()]);
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-3">
        <h1>Tools and kits</h1>
        <ToolNav current="/tools/catalogue" />
      </div>
      <section aria-labelledby="labels" className="panel flex flex-wrap items-center gap-4">
        <h2 id="labels" className="mr-auto">
          Labels
        </h2>
        <p className="w-full text-ink-soft">
          Each label has the number as a QR code and in large type; the desk scans either with a USB scanner or a typed number.
        </p>
        <a href={labelSheet} className="btn btn-primary" target="_blank" rel="noreferrer">
          Label sheet, every kit and tool (PDF)
        </a>
      </section>
      <section aria-labelledby="kit-list" className="panel flex flex-col gap-3">
        <h2 id="kit-list">Kits: {kits.length}</h2>
        <Table
          rows={kits}
          rowKey={(k) => k.id}
          empty="No kit yet. Add the first one below."
          columns={[
            { header: "Kit", cell: (k) => <strong className="font-mono">{k.number}</strong> },
            { header: "Name", cell: (k) => k.name },
            { header: "Kept at", cell: (k) => k.location || "—" },
            { header: "Contents", cell: (k) => k.tools.map((t) => t.number).join(", ") || "empty" },
            { header: "Out", cell: (k) => (k.out ? `to ${k.out.userName}` : "In the tool room") },
            {
              header: "Labels",
              cell: (k) => (
                <a href={`/api/tools/labels?kit=${k.id}`} className="inline-flex min-h-11 items-center font-semibold">
                  Print {k.number}&apos;s labels
                </a>
              ),
            },
          ]}
        />
      </section>
      <section aria-labelledby="tool-list" className="panel flex flex-col gap-3">
        <h2 id="tool-list">Tools: {tools.length}</h2>
        <Table
          rows={tools}
          rowKey={(t) => t.id}
          empty="No tool yet. Add the first one below."
          columns={[
            {
              header: "Tool",
              cell: (t) => (
                <Link href={`/tools/${t.id}`} className="inline-flex min-h-11 items-center font-mono font-semibold">
                  {t.number}
                </Link>
              ),
            },
            { header: "What it is", cell: (t) => t.description },
            { header: "Kit", cell: (t) => t.kitNumber ?? "—" },
            {
              header: "Calibration",
              cell: (t) => calibrationWords(t.calibration, t.calibrationDueOn),
              className: (t) => (t.calibration === "past" || t.calibration === "no_date" ? "font-bold text-danger" : ""),
            },
            {
              header: "Status",
              cell: (t) =>
                t.status === "out_of_service"
                  ? `Out of service: ${t.outOfServiceReason}`
                  : t.out
                    ? `Out to ${t.out.userName}`
                    : "In the tool room",
              className: (t) => (t.status === "out_of_service" ? "font-bold text-danger" : ""),
            },
          ]}
        />
      </section>
      <AddKitForm />
      <AddToolForm kits={kits.map((k) => ({ id: k.id, number: k.number, name: k.name }))} />
    </div>
  );
}

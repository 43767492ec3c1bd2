import type { Metadata } from "next";
import Link from "next/link";
import { Table } from "@/components/table";
import { requirePageUser } from "@/app/_adapters/session";
import { calibrationSoonDays, calibrationWords } from "@/lib/domain/tools/tool-room";
import { listTools } from "@/lib/server/tools/catalogue";
import { ToolNav } from "../_components/tool-nav";

export const metadata: Metadata = { title: "Calibration" };

export default async function CalibrationPage() {
  await requirePageUser("tools:lend", "/tools/calibration");
  const due = await listTools({ dueWithin: calibrationSoonDays });
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-3">
        <h1>Calibration</h1>
        <ToolNav current="/tools/calibration" />
      </div>
      <section aria-labelledby="due-list" className="panel flex flex-col gap-3">
        <h2 id="due-list">
          Due within {calibrationSoonDays} days or past due: {due.length}
        </h2>
        <p className="hint">
          A reading taken with a tool past its calibration date is refused on the cart and by the server. Open a tool to record its
          calibration.
        </p>
        <Table
          rows={due}
          rowKey={(t) => t.id}
          empty={`No precision tool is due within ${calibrationSoonDays} days.`}
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
            {
              header: "Calibration",
              cell: (t) => calibrationWords(t.calibration, t.calibrationDueOn),
              className: (t) => (t.calibration === "past" || t.calibration === "no_date" ? "font-bold text-danger" : ""),
            },
            {
              header: "Where",
              cell: (t) => (t.out ? `Out to ${t.out.userName}` : t.kitNumber ? `In kit ${t.kitNumber}` : "In the tool room"),
            },
          ]}
        />
      </section>
    </div>
  );
}

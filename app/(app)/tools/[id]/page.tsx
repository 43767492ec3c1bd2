import type { Metadata } from "next";
import Link from "next/link";
import { Table } from "@/components/table";
import { requirePageUser } from "@/app/_adapters/session";
import { notFoundOnMissing } from "@/app/_adapters/not-found";
import { idParam } from "@/lib/contracts/endpoint";
import { calibrationWords } from "@/lib/domain/tools/tool-room";
import { getTool } from "@/lib/server/tools/catalogue";
import { CalibrationForm } from "../_components/catalogue-forms";
import { ServiceForm } from "../_components/service-form";

export const metadata: Metadata = { title: "Tool" };

export default async function ToolPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageUser("tools:lend", `/tools/${id}`);
  const tool = await Promise.resolve()
    .then(() => getTool(idParam(id, "That tool")))
    .catch(notFoundOnMissing);
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-1">
        <Link href="/tools/catalogue" className="inline-flex min-h-11 items-center font-semibold">
          ← Tools and kits
        </Link>
        <h1>
          <span className="font-mono">{tool.number}</span> {tool.description}
        </h1>
        <p className="text-lg">
          {tool.status === "out_of_service" ? (
            <strong className="text-danger">Out of service: {tool.outOfServiceReason}</strong>
          ) : tool.out ? (
            `Out to ${tool.out.userName}`
          ) : (
            "In the tool room"
          )}
          {tool.kitNumber ? ` · kept in kit ${tool.kitNumber}` : ""}
        </p>
        {tool.calibrated ? (
          <p className={`text-lg ${tool.calibration === "past" || tool.calibration === "no_date" ? "font-bold text-danger" : ""}`}>
            Calibration: {calibrationWords(tool.calibration, tool.calibrationDueOn)}
            {tool.calibrationIntervalDays ? ` · every ${tool.calibrationIntervalDays} days` : ""}
          </p>
        ) : null}
      </div>
      {tool.calibrated ? (
        <>
          <CalibrationForm toolId={tool.id} number={tool.number} intervalDays={tool.calibrationIntervalDays} />
          <section aria-labelledby="history" className="panel flex flex-col gap-3">
            <h2 id="history">Calibration history</h2>
            <p className="hint">Entries are never changed: a mistake is corrected by recording the calibration again.</p>
            <Table
              rows={tool.calibrations}
              rowKey={(c) => c.id}
              empty="No calibration recorded yet."
              columns={[
                { header: "Calibrated on", cell: (c) => c.calibratedOn },
                { header: "By", cell: (c) => c.calibratedBy },
                { header: "Certificate", cell: (c) => c.certificate },
                { header: "Next due", cell: (c) => c.nextDueOn },
                { header: "Recorded by", cell: (c) => c.recordedByName },
              ]}
            />
          </section>
        </>
      ) : null}
      <ServiceForm toolId={tool.id} status={tool.status} />
    </div>
  );
}

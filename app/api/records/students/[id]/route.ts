import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { fileResponse, fileSlug } from "@/lib/server/file-response";
import { studentRecordCsv } from "@/lib/domain/runs/record-csv";
import { studentRecord, studentRecordPdf } from "@/lib/server/runs/records";

/** JSON by default; ?format=csv or ?format=pdf for export. */
export const GET = handle(api.runs.studentRecord, async ({ actor, params: { id }, query: { format } }) => {
  const record = await studentRecord({ actor, studentId: id });
  const base = `record-${fileSlug(record.student.name, "student")}`;
  if (format === "csv")
    return fileResponse(studentRecordCsv(record), { type: "text/csv; charset=utf-8", filename: `${base}.csv`, download: true });
  if (format === "pdf") return fileResponse(await studentRecordPdf(record), { type: "application/pdf", filename: `${base}.pdf` });
  return record;
});

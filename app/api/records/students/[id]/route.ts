import { requireApiUser } from "@/app/_adapters/session";
import { fileResponse, fileSlug } from "@/lib/server/file-response";
import { idParam, route } from "@/lib/server/http";
import { studentRecord, studentRecordCsv, studentRecordPdf } from "@/lib/server/runs/records";

type Context = { params: Promise<{ id: string }> };

/** JSON by default; ?format=csv or ?format=pdf for export. */
export const GET = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("records:view");
  const record = await studentRecord({ actor, studentId: idParam((await params).id, "That record") });
  const format = new URL(request.url).searchParams.get("format");
  const base = `record-${fileSlug(record.student.name, "student")}`;
  if (format === "csv") return fileResponse(studentRecordCsv(record), { type: "text/csv; charset=utf-8", filename: `${base}.csv`, download: true });
  if (format === "pdf") return fileResponse(await studentRecordPdf(record), { type: "application/pdf", filename: `${base}.pdf` });
  return Response.json(record);
});

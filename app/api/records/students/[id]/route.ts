import { requireApiUser } from "@/lib/auth/session";
import { idParam, route } from "@/lib/http";
import { studentRecord, studentRecordCsv, studentRecordPdf } from "@/lib/runs/records";

type Context = { params: Promise<{ id: string }> };

/** JSON by default; ?format=csv or ?format=pdf for export. */
export const GET = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("records:view");
  const record = await studentRecord({ actor, studentId: idParam((await params).id, "That record") });
  const format = new URL(request.url).searchParams.get("format");
  const base = `record-${record.student.name.replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 60) || "student"}`;
  if (format === "csv") {
    return new Response(studentRecordCsv(record), {
      headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="${base}.csv"`, "Cache-Control": "private, no-store" },
    });
  }
  if (format === "pdf") {
    return new Response(Buffer.from(await studentRecordPdf(record)), {
      headers: { "Content-Type": "application/pdf", "Content-Disposition": `inline; filename="${base}.pdf"`, "Cache-Control": "private, no-store" },
    });
  }
  return Response.json(record);
});

import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { readinessCsv } from "@/lib/domain/standard/readiness";
import { fileResponse, fileSlug } from "@/lib/server/file-response";
import { readinessPdf, studentReadiness } from "@/lib/server/readiness";

/** JSON by default; ?format=csv or ?format=pdf for the report. */
export const GET = handle(api.standard.readiness, async ({ actor, params: { id }, query: { format } }) => {
  const readiness = await studentReadiness({ actor, studentId: id });
  const base = `readiness-${fileSlug(readiness.student.name, "student")}`;
  if (format === "csv")
    return fileResponse(readinessCsv(readiness), { type: "text/csv; charset=utf-8", filename: `${base}.csv`, download: true });
  if (format === "pdf") return fileResponse(await readinessPdf(readiness), { type: "application/pdf", filename: `${base}.pdf` });
  return readiness;
});

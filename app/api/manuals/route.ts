import { can } from "@/lib/domain/access/permissions";
import { requireApiUser } from "@/app/_adapters/session";
import { getEnv } from "@/lib/server/env";
import { parseWith, route } from "@/lib/server/http";
import { createManualWithRevision, listManuals } from "@/lib/server/library/manuals";
import { withUploadedPdf } from "@/lib/server/library/upload";
import { getStore } from "@/lib/server/storage";
import { manualUploadSchema } from "@/lib/domain/validation/library";

export const GET = route(async () => {
  const actor = await requireApiUser("library:view");
  // A manual with no ready revision yet is the library staff's business only.
  const rows = (await listManuals()).filter((m) => m.currentRevisionId || can(actor, "library:manage"));
  return Response.json({ manuals: rows });
});

/** A new manual with its first revision: multipart, the PDF streamed to storage. */
export const POST = route(async (request) => {
  const actor = await requireApiUser("library:manage");
  const created = await withUploadedPdf(request, { store: getStore(), limitBytes: getEnv().HL_UPLOAD_LIMIT_BYTES }, ({ revisionId, fields, file }) => {
    const input = parseWith(manualUploadSchema, fields);
    return createManualWithRevision({
      actor,
      revisionId,
      manual: { title: input.title, documentType: input.documentType, applicability: input.applicability, ataChapters: input.ataChapters },
      revision: { revisionLabel: input.revisionLabel, revisionDate: input.revisionDate },
      file,
    });
  });
  return Response.json(created, { status: 202 });
});

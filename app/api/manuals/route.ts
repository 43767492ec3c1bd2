import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { can } from "@/lib/domain/access/permissions";
import { manualUploadSchema } from "@/lib/domain/validation/library";
import { getEnv } from "@/lib/server/env";
import { parseWith } from "@/lib/server/http";
import { createManualWithRevision, listManuals } from "@/lib/server/library/manuals";
import { withUploadedPdf } from "@/lib/server/library/upload";
import { getStore } from "@/lib/server/storage";

export const GET = handle(api.library.listManuals, async ({ actor }) => {
  // A manual with no ready revision yet is the library staff's business only.
  const rows = (await listManuals()).filter((m) => m.currentRevisionId || can(actor, "library:manage"));
  return { manuals: rows };
});

/** A new manual with its first revision: multipart, the PDF streamed to storage. */
export const POST = handle(api.library.createManual, async ({ request, actor }) =>
  withUploadedPdf(request, { store: getStore(), limitBytes: getEnv().HL_UPLOAD_LIMIT_BYTES }, ({ revisionId, fields, file }) => {
    const input = parseWith(manualUploadSchema, fields);
    return createManualWithRevision({
      actor,
      revisionId,
      manual: { title: input.title, documentType: input.documentType, applicability: input.applicability, ataChapters: input.ataChapters },
      revision: { revisionLabel: input.revisionLabel, revisionDate: input.revisionDate },
      file,
    });
  }),
);

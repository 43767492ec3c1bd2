import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { revisionFieldsSchema } from "@/lib/domain/validation/library";
import { getEnv } from "@/lib/server/env";
import { parseWith } from "@/lib/server/http";
import { addRevision, assertManualExists } from "@/lib/server/library/manuals";
import { withUploadedPdf } from "@/lib/server/library/upload";
import { getStore } from "@/lib/server/storage";

/** A new revision of a manual: multipart with file, revisionLabel, revisionDate. */
export const POST = handle(api.library.addRevision, async ({ request, actor, params: { id: manualId } }) => {
  await assertManualExists({ id: manualId }); // before reading a large body
  return withUploadedPdf(request, { store: getStore(), limitBytes: getEnv().HL_UPLOAD_LIMIT_BYTES }, ({ revisionId, fields, file }) =>
    addRevision({ actor, manualId, revisionId, revision: parseWith(revisionFieldsSchema, fields), file }),
  );
});

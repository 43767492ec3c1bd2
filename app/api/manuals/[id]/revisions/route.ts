import { requireApiUser } from "@/app/_adapters/session";
import { getEnv } from "@/lib/server/env";
import { idParam, parseWith, route } from "@/lib/server/http";
import { addRevision, assertManualExists } from "@/lib/server/library/manuals";
import { withUploadedPdf } from "@/lib/server/library/upload";
import { getStore } from "@/lib/server/storage";
import { revisionFieldsSchema } from "@/lib/domain/validation/library";

type Context = { params: Promise<{ id: string }> };

/** A new revision of a manual: multipart with file, revisionLabel, revisionDate. */
export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("library:manage");
  const manualId = idParam((await params).id, "That manual");
  await assertManualExists({ id: manualId }); // before reading a large body
  const created = await withUploadedPdf(request, { store: getStore(), limitBytes: getEnv().HL_UPLOAD_LIMIT_BYTES }, ({ revisionId, fields, file }) =>
    addRevision({ actor, manualId, revisionId, revision: parseWith(revisionFieldsSchema, fields), file }),
  );
  return Response.json(created, { status: 202 });
});

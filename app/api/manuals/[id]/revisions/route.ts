import { requireApiUser } from "@/lib/auth/session";
import { getEnv } from "@/lib/env";
import { idParam, parseWith, route } from "@/lib/http";
import { addRevision, assertManualExists } from "@/lib/library/manuals";
import { withUploadedPdf } from "@/lib/library/upload";
import { getStore } from "@/lib/storage";
import { revisionFieldsSchema } from "@/lib/validation/library";

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

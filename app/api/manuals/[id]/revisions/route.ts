import { randomUUID } from "node:crypto";
import { requireApiUser } from "@/lib/auth/session";
import { getEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { idParam, parseWith, route } from "@/lib/http";
import { addRevision, assertManualExists } from "@/lib/library/manuals";
import { receivePdfUpload } from "@/lib/library/upload";
import { getStore, storageKeys } from "@/lib/storage";
import { revisionFieldsSchema } from "@/lib/validation/library";

type Context = { params: Promise<{ id: string }> };

/** A new revision of a manual: multipart with file, revisionLabel, revisionDate. */
export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("library:manage");
  const manualId = idParam((await params).id, "That manual");
  await assertManualExists({ id: manualId }); // before reading a large body
  const revisionId = randomUUID();
  const key = storageKeys.revisionFile(revisionId);
  const store = getStore();
  const { fields, file } = await receivePdfUpload(request, { store, key, limitBytes: getEnv().HL_UPLOAD_LIMIT_BYTES });
  try {
    if (!file) throw new AppError("invalid", "Choose a PDF file to upload.", { fields: { file: "Choose a PDF file." } });
    const revision = parseWith(revisionFieldsSchema, fields);
    const created = await addRevision({ actor, manualId, revisionId, revision, file: { key, ...file } });
    return Response.json(created, { status: 202 });
  } catch (error) {
    await store.delete(key).catch(() => undefined);
    throw error;
  }
});

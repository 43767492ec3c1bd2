import "server-only";
import { Readable } from "node:stream";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db";
import { runPhotos } from "@/db/schema";
import type { Actor } from "@/lib/domain/access/permissions";
import { AppError } from "@/lib/domain/errors";
import { getStore, storageKeys } from "@/lib/server/storage";
import { maxPhotoBytes, sniffImage } from "@/lib/domain/validation/runs";
import { loadRun } from "@/lib/server/runs/queries";

/** Reads at most `limit` bytes of a request body; one byte more is a 413, not a silent cut. */
async function readLimited(request: Request, limit: number): Promise<Uint8Array> {
  const declared = Number(request.headers.get("content-length") ?? 0);
  const tooLarge = () =>
    new AppError("payload_too_large", `A photo may be at most ${limit / 1024 / 1024} MB. Take it again at a lower resolution.`);
  if (declared > limit) throw tooLarge();
  if (!request.body) throw new AppError("invalid", "Send the photo as the request body.", { fields: { file: "No photo." } });
  const chunks: Uint8Array[] = [];
  let size = 0;
  const reader = request.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

/**
 * Stores a photo of the run's work under the id the cart made. A second upload of the same id is
 * answered with what is stored, so a cart may retry without making copies.
 */
export async function storePhoto({
  actor,
  runId,
  photoId,
  stepId,
  request,
}: {
  actor: Actor;
  runId: string;
  photoId: string;
  stepId: string | null;
  request: Request;
}) {
  const run = await loadRun(getDb(), actor, runId);
  if (run.studentId !== actor.id) throw new AppError("forbidden", "Only the student doing this run adds its photos.");
  if (run.status === "signed_off") throw new AppError("conflict", "This run is signed off. Its record cannot change.");
  const [existing] = await getDb()
    .select()
    .from(runPhotos)
    .where(and(eq(runPhotos.id, photoId), eq(runPhotos.runId, runId)));
  if (existing) return { id: existing.id, contentType: existing.contentType, bytes: existing.bytes, stepId: existing.stepId };
  const bytes = await readLimited(request, maxPhotoBytes);
  if (!bytes.byteLength) throw new AppError("invalid", "The photo is empty.", { fields: { file: "Empty." } });
  const type = sniffImage(bytes.subarray(0, 16));
  if (!type) throw new AppError("unsupported_media_type", "Only JPEG, PNG or WebP pictures can be added to a run.");
  const key = storageKeys.runPhoto(runId, photoId);
  await getStore().put(key, Readable.from(Buffer.from(bytes)), type);
  try {
    const [row] = await getDb()
      .insert(runPhotos)
      .values({ id: photoId, runId, stepId, contentType: type, bytes: bytes.byteLength, uploadedBy: actor.id })
      .returning();
    return { id: row!.id, contentType: row!.contentType, bytes: row!.bytes, stepId: row!.stepId };
  } catch (error) {
    // The same upload sent twice at once (a retry on a flaky link): the other one stored it, and
    // both wrote the same bytes under the same key, so nothing is removed.
    const [stored] = await getDb()
      .select()
      .from(runPhotos)
      .where(and(eq(runPhotos.id, photoId), eq(runPhotos.runId, runId)));
    if (stored) return { id: stored.id, contentType: stored.contentType, bytes: stored.bytes, stepId: stored.stepId };
    await getStore()
      .delete(key)
      .catch(() => undefined); // the id belongs to another run's photo
    throw new AppError("conflict", "That photo id is already used. Take the photo again.", { cause: error });
  }
}

export async function readPhoto({ actor, runId, photoId }: { actor: Actor; runId: string; photoId: string }) {
  await loadRun(getDb(), actor, runId);
  const [row] = await getDb()
    .select()
    .from(runPhotos)
    .where(and(eq(runPhotos.id, photoId), eq(runPhotos.runId, runId)));
  if (!row) throw new AppError("not_found", "That photo was not found.");
  const { body, size } = await getStore().get(storageKeys.runPhoto(runId, photoId));
  return { body, size, contentType: row.contentType };
}

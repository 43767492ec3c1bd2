import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { fileResponse } from "@/lib/server/file-response";
import { readPhoto, storePhoto } from "@/lib/server/runs/photos";

/** The picture itself is the body (image/jpeg, image/png or image/webp, at most 8 MB); ?step= names the step. */
export const PUT = handle(api.runs.putPhoto, async ({ request, actor, params: { id, photoId }, query: { step } }) => ({
  photo: await storePhoto({ actor, runId: id, photoId, stepId: step, request }),
}));

export const GET = handle(api.runs.getPhoto, async ({ actor, params: { id, photoId } }) => {
  const { body, size, contentType } = await readPhoto({ actor, runId: id, photoId });
  return fileResponse(body, { type: contentType, size });
});

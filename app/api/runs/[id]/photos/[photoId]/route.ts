import { fileResponse } from "@/lib/server/file-response";
import { requireApiUser } from "@/app/_adapters/session";
import { idParam, isUuid, route } from "@/lib/server/http";
import { readPhoto, storePhoto } from "@/lib/server/runs/photos";

type Context = { params: Promise<{ id: string; photoId: string }> };

/** The picture itself is the body (image/jpeg, image/png or image/webp, at most 8 MB); ?step= names the step. */
export const PUT = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser();
  const { id, photoId } = await params;
  const step = new URL(request.url).searchParams.get("step") ?? "";
  const photo = await storePhoto({ actor, runId: idParam(id, "That run"), photoId: idParam(photoId, "That photo"), stepId: isUuid(step) ? step : null, request });
  return Response.json({ photo }, { status: 201 });
});

export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser();
  const { id, photoId } = await params;
  const { body, size, contentType } = await readPhoto({ actor, runId: idParam(id, "That run"), photoId: idParam(photoId, "That photo") });
  return fileResponse(body, { type: contentType, size });
});

import { requireApiUser } from "@/app/_adapters/session";
import { idParam, readJson, route } from "@/lib/server/http";
import { appendEvents } from "@/lib/server/runs/events";
import { eventBatchSchema } from "@/lib/domain/validation/runs";

type Context = { params: Promise<{ id: string }> };

/** A batch from a cart. The same batch twice stores nothing the second time; after sign-off, 409. */
export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser();
  const runId = idParam((await params).id, "That run");
  const { events } = await readJson(request, eventBatchSchema, { maxBytes: 2 * 1024 * 1024 });
  return Response.json(await appendEvents({ actor, runId, events }));
});

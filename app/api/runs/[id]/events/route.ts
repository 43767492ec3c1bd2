import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { appendEvents } from "@/lib/server/runs/events";

/** A batch from a cart. The same batch twice stores nothing the second time; after sign-off, 409. */
export const POST = handle(api.runs.appendEvents, async ({ actor, params: { id }, body: { events } }) =>
  appendEvents({ actor, runId: id, events }),
);

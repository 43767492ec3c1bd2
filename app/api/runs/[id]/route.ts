import { requireApiUser } from "@/app/_adapters/session";
import { idParam, route } from "@/lib/server/http";
import { getRunDetail } from "@/lib/server/runs/queries";

type Context = { params: Promise<{ id: string }> };

/** Everything a cart needs to run the card offline: the pinned version, its events, the packet's pages. */
export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser();
  const { state: _state, ...detail } = await getRunDetail({ actor, runId: idParam((await params).id, "That run") });
  return Response.json(detail, { headers: { "Cache-Control": "private, no-store" } });
});

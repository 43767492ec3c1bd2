import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getRunDetail } from "@/lib/server/runs/queries";

/** Everything a cart needs to run the card offline: the pinned version, its events, the packet's pages. */
export const GET = handle(api.runs.get, async ({ actor, params: { id } }) => {
  const { state: _state, ...detail } = await getRunDetail({ actor, runId: id });
  return detail;
});

import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { nameRunAssets, runAssetsView } from "@/lib/server/fleet/assets";

export const GET = handle(api.fleet.runAssets, async ({ actor, params: { id } }) => runAssetsView({ actor, runId: id }));

export const PUT = handle(api.fleet.setRunAssets, async ({ actor, params: { id }, body }) =>
  nameRunAssets({ actor, runId: id, input: body }),
);

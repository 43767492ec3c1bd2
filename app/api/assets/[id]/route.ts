import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getAsset, updateAsset } from "@/lib/server/fleet/assets";

export const GET = handle(api.fleet.getAsset, async ({ actor, params: { id } }) => ({ asset: await getAsset({ actor, id }) }));

export const PATCH = handle(api.fleet.updateAsset, async ({ actor, params: { id }, body }) => ({
  asset: await updateAsset({ actor, id, input: body }),
}));

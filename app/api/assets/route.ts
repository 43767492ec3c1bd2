import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createAsset, listAssets } from "@/lib/server/fleet/assets";

export const GET = handle(api.fleet.listAssets, async ({ query }) => ({ assets: await listAssets(query) }));

export const POST = handle(api.fleet.createAsset, async ({ actor, body }) => ({ asset: await createAsset({ actor, input: body }) }));

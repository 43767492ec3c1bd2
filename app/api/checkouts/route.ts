import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createCheckout, listCheckouts } from "@/lib/server/tools/lending";

export const GET = handle(api.tools.listCheckouts, async ({ actor, query }) => ({
  checkouts: await listCheckouts({ actor, status: query.status }),
}));
export const POST = handle(api.tools.createCheckout, async ({ actor, body }) => ({
  checkout: await createCheckout({ actor, input: body }),
}));

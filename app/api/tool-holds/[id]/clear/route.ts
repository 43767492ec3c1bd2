import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { clearHold } from "@/lib/server/tools/lending";

export const POST = handle(api.tools.clearHold, async ({ actor, params: { id }, body }) => ({
  hold: await clearHold({ actor, id, input: body }),
}));

import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { returnCheckout } from "@/lib/server/tools/lending";

export const POST = handle(api.tools.returnCheckout, async ({ actor, params: { id }, body }) =>
  returnCheckout({ actor, id, missingToolIds: body.missingToolIds }),
);

import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { listHolds } from "@/lib/server/tools/lending";

export const GET = handle(api.tools.listHolds, async ({ actor, query }) => ({
  holds: await listHolds({ actor, open: query.all !== "1" }),
}));

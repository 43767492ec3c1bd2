import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { decideFinding } from "@/lib/server/fleet/findings";

export const PATCH = handle(api.fleet.decideFinding, async ({ actor, params: { id }, body }) => ({
  finding: await decideFinding({ actor, id, input: body }),
}));

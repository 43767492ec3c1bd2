import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { csvFromRequest, importStandard } from "@/lib/server/standard";

export const POST = handle(api.standard.importStandard, async ({ actor, request }) =>
  importStandard({ actor, csv: await csvFromRequest(request) }),
);

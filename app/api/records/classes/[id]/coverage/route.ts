import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { classCoverage } from "@/lib/server/standard";

export const GET = handle(api.standard.classCoverage, async ({ actor, params: { id }, query: { kind, section } }) =>
  classCoverage({ actor, classId: id, kind, section }),
);

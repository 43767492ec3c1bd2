import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { listMyWork } from "@/lib/server/runs/queries";
import { schoolTimeZone } from "@/lib/server/settings";

export const GET = handle(api.runs.myWork, async ({ actor }) => ({ work: await listMyWork({ actor }), timeZone: await schoolTimeZone() }));

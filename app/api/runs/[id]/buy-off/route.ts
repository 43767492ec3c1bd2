import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { buyOff } from "@/lib/server/runs/review";

export const POST = handle(api.runs.buyOff, async ({ actor, params: { id }, body: { stepId } }) => buyOff({ actor, runId: id, stepId }));

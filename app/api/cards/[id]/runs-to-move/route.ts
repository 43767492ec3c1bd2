import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { listRunsToMove } from "@/lib/server/runs/move";

export const GET = handle(api.runs.runsToMove, async ({ actor, params: { id } }) => listRunsToMove({ actor, cardId: id }));

import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { moveRuns } from "@/lib/server/runs/move";

export const POST = handle(api.runs.moveRuns, async ({ actor, params: { id }, body: { runIds } }) =>
  moveRuns({ actor, cardId: id, runIds }),
);

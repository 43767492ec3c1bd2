import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { returnRun } from "@/lib/server/runs/review";

export const POST = handle(api.runs.returnRun, async ({ actor, params: { id }, body: { comment, reopenStepIds } }) =>
  returnRun({ actor, runId: id, comment, reopenStepIds }),
);

import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { signOffRun } from "@/lib/server/runs/review";

/** Signs off a submitted run, with the instructor's password typed again. There is no route that changes or removes a sign-off. */
export const POST = handle(api.runs.signOff, async ({ actor, params: { id }, body: { comment, password } }) =>
  signOffRun({ actor, runId: id, comment, password }),
);

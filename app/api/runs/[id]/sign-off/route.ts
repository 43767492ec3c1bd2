import { requireApiUser } from "@/app/_adapters/session";
import { idParam, readJson, route } from "@/lib/server/http";
import { signOffRun } from "@/lib/server/runs/review";
import { reviewCommentSchema } from "@/lib/domain/validation/runs";

type Context = { params: Promise<{ id: string }> };

/** Signs off a submitted run. There is no route that changes or removes a sign-off. */
export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("runs:review");
  const runId = idParam((await params).id, "That run");
  const { comment } = await readJson(request, reviewCommentSchema);
  return Response.json(await signOffRun({ actor, runId, comment }));
});

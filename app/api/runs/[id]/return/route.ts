import { requireApiUser } from "@/app/_adapters/session";
import { idParam, readJson, route } from "@/lib/server/http";
import { returnRun } from "@/lib/server/runs/review";
import { returnRunSchema } from "@/lib/domain/validation/runs";

type Context = { params: Promise<{ id: string }> };

export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("runs:review");
  const runId = idParam((await params).id, "That run");
  const { comment } = await readJson(request, returnRunSchema);
  return Response.json(await returnRun({ actor, runId, comment }));
});

import { requireApiUser } from "@/lib/auth/session";
import { idParam, readJson, route } from "@/lib/http";
import { returnRun } from "@/lib/runs/runs";
import { returnRunSchema } from "@/lib/validation/runs";

type Context = { params: Promise<{ id: string }> };

export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("runs:review");
  const runId = idParam((await params).id, "That run");
  const { comment } = await readJson(request, returnRunSchema);
  return Response.json(await returnRun({ actor, runId, comment }));
});

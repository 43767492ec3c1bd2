import { requireApiUser } from "@/app/_adapters/session";
import { idParam, readJson, route } from "@/lib/server/http";
import { buyOff } from "@/lib/server/runs/review";
import { buyOffSchema } from "@/lib/domain/validation/runs";

type Context = { params: Promise<{ id: string }> };

export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("runs:review");
  const runId = idParam((await params).id, "That run");
  const { stepId } = await readJson(request, buyOffSchema);
  return Response.json(await buyOff({ actor, runId, stepId }));
});

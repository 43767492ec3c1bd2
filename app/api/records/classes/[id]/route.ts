import { requireApiUser } from "@/app/_adapters/session";
import { idParam, route } from "@/lib/server/http";
import { classRecord } from "@/lib/server/runs/records";

type Context = { params: Promise<{ id: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("records:view-all");
  return Response.json(await classRecord({ actor, classId: idParam((await params).id, "That class") }));
});

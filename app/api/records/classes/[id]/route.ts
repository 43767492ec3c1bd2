import { requireApiUser } from "@/lib/auth/session";
import { idParam, route } from "@/lib/http";
import { classRecord } from "@/lib/runs/records";

type Context = { params: Promise<{ id: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("records:view-all");
  return Response.json(await classRecord({ actor, classId: idParam((await params).id, "That class") }));
});

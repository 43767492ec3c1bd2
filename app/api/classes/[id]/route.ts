import { requireApiUser } from "@/app/_adapters/session";
import { getClassById, updateClass } from "@/lib/server/classes";
import { idParam, readJson, route } from "@/lib/server/http";
import { updateClassSchema } from "@/lib/domain/validation/classes";

type Context = { params: Promise<{ id: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("classes:view");
  const id = idParam((await params).id, "That class");
  return Response.json({ class: await getClassById({ actor, id }) });
});

export const PATCH = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("classes:manage");
  const id = idParam((await params).id, "That class");
  const changes = await readJson(request, updateClassSchema);
  return Response.json({ class: await updateClass({ actor, id, changes }) });
});

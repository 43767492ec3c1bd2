import { requireApiUser } from "@/app/_adapters/session";
import { createClass, listClasses } from "@/lib/server/classes";
import { readJson, route } from "@/lib/server/http";
import { createClassSchema } from "@/lib/domain/validation/classes";

export const GET = route(async () => {
  const actor = await requireApiUser("classes:view");
  return Response.json({ classes: await listClasses({ actor }) });
});

export const POST = route(async (request) => {
  const actor = await requireApiUser("classes:manage");
  const input = await readJson(request, createClassSchema);
  return Response.json({ class: await createClass({ actor, input }) }, { status: 201 });
});

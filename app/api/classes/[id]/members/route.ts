import { requireApiUser } from "@/app/_adapters/session";
import { addClassMembers } from "@/lib/server/classes";
import { idParam, readJson, route } from "@/lib/server/http";
import { addMembersSchema } from "@/lib/domain/validation/classes";

type Context = { params: Promise<{ id: string }> };

export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("classes:manage");
  const classId = idParam((await params).id, "That class");
  const { userIds } = await readJson(request, addMembersSchema);
  return Response.json(await addClassMembers({ actor, classId, userIds }));
});

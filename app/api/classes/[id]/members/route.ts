import { requireApiUser } from "@/lib/auth/session";
import { addClassMembers } from "@/lib/classes";
import { idParam, readJson, route } from "@/lib/http";
import { addMembersSchema } from "@/lib/validation/classes";

type Context = { params: Promise<{ id: string }> };

export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("classes:manage");
  const classId = idParam((await params).id, "That class");
  const { userIds } = await readJson(request, addMembersSchema);
  return Response.json(await addClassMembers({ actor, classId, userIds }));
});

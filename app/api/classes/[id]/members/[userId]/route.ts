import { requireApiUser } from "@/app/_adapters/session";
import { removeClassMember } from "@/lib/server/classes";
import { idParam, route } from "@/lib/server/http";

type Context = { params: Promise<{ id: string; userId: string }> };

export const DELETE = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("classes:manage");
  const { id, userId } = await params;
  return Response.json(
    await removeClassMember({ actor, classId: idParam(id, "That class"), userId: idParam(userId, "That member") }),
  );
});

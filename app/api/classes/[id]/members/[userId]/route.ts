import { requireApiUser } from "@/lib/auth/session";
import { removeClassMember } from "@/lib/classes";
import { idParam, route } from "@/lib/http";

type Context = { params: Promise<{ id: string; userId: string }> };

export const DELETE = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("classes:manage");
  const { id, userId } = await params;
  return Response.json(
    await removeClassMember({ actor, classId: idParam(id, "That class"), userId: idParam(userId, "That member") }),
  );
});

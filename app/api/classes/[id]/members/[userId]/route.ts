import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { removeClassMember } from "@/lib/server/classes";

export const DELETE = handle(api.classes.removeMember, async ({ actor, params: { id, userId } }) =>
  removeClassMember({ actor, classId: id, userId }),
);

import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { addClassMembers } from "@/lib/server/classes";

export const POST = handle(api.classes.addMembers, async ({ actor, params: { id }, body: { userIds } }) =>
  addClassMembers({ actor, classId: id, userIds }),
);

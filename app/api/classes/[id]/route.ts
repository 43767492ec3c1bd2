import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getClassById, updateClass } from "@/lib/server/classes";

export const GET = handle(api.classes.get, async ({ actor, params: { id } }) => ({ class: await getClassById({ actor, id }) }));

export const PATCH = handle(api.classes.update, async ({ actor, params: { id }, body }) => ({
  class: await updateClass({ actor, id, changes: body }),
}));

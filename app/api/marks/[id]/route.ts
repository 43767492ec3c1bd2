import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { removeMark } from "@/lib/server/library/marks";

export const DELETE = handle(api.library.deleteMark, async ({ actor, params: { id } }) => {
  await removeMark({ actor, id });
  return { removed: true as const };
});

import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { closeSession } from "@/lib/server/attendance";

export const POST = handle(api.attendance.closeSession, async ({ actor, params: { id } }) => ({
  session: await closeSession({ actor, id }),
}));

import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getSession } from "@/lib/server/attendance";

export const GET = handle(api.attendance.getSession, async ({ actor, params: { id } }) => ({ session: await getSession({ actor, id }) }));

import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createSession, listSessions } from "@/lib/server/attendance";

export const GET = handle(api.attendance.listSessions, async ({ actor, query }) => ({
  sessions: await listSessions({ actor, classId: query.classId }),
}));
export const POST = handle(api.attendance.createSession, async ({ actor, body }) => ({
  session: await createSession({ actor, input: body }),
}));

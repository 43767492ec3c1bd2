import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { recordAttendance } from "@/lib/server/attendance";

export const POST = handle(api.attendance.recordAttendance, async ({ actor, params: { id }, body }) => ({
  session: await recordAttendance({ actor, id, input: body }),
}));

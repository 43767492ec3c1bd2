import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { studentAttendance } from "@/lib/server/attendance";

export const GET = handle(api.attendance.studentAttendance, async ({ actor, params: { id } }) =>
  studentAttendance({ actor, studentId: id }),
);

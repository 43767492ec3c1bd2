// Class sessions and attendance (lib/contracts/endpoint.ts says how one is declared).
import { endpoint, json, uuidSegment } from "@/lib/contracts/endpoint";
import type { SessionDetailDto, SessionDto, StudentAttendanceDto } from "@/lib/contracts/attendance";
import { attendanceSchema, createSessionSchema, sessionListQuerySchema } from "@/lib/domain/validation/attendance";

const sessionFields =
  '{ "id", "classId", "className", "startsAt", "minutes", "section", "subject", "closedAt", "counts": { "present", "late", "absent", "excused", "unrecorded" } }';

export const attendanceApi = {
  listSessions: endpoint({
    method: "GET",
    path: "/api/class-sessions",
    access: "attendance:take",
    query: sessionListQuerySchema,
    answer: json<{ sessions: SessionDto[] }>(),
    who: "instructor (classes they are staff of), admin",
    doc: `\`?classId=\` → 200 \`{ "sessions": [ ${sessionFields} ] }\`, newest first`,
  }),
  createSession: endpoint({
    method: "POST",
    path: "/api/class-sessions",
    access: "attendance:take",
    body: { kind: "json", schema: createSessionSchema },
    answer: json<{ session: { id: string } }>(),
    status: 201,
    who: "instructor (classes they are staff of), admin",
    doc: '`{ "classId", "startsAt", "minutes", "section": "General\\|Airframe\\|Powerplant", "subject" }` → 201 `{ "session": { "id" } }`; 422 a class the instructor does not teach',
  }),
  getSession: endpoint({
    method: "GET",
    path: "/api/class-sessions/:id",
    access: "attendance:take",
    params: { id: uuidSegment("That session") },
    answer: json<{ session: SessionDetailDto }>(),
    who: "instructor (classes they are staff of), admin",
    doc: `200 \`{ "session": ${sessionFields.slice(0, -2)}, "roster": [ { "userId", "name", "current", "history": [ { "id", "status", "minutes", "makeup", "makeupRunId", "correctionReason", "recordedByName", "recordedAt" } ] } ] } }\`: every entry kept, newest first; 404 for another class's session`,
  }),
  recordAttendance: endpoint({
    method: "POST",
    path: "/api/class-sessions/:id/attendance",
    access: "attendance:take",
    params: { id: uuidSegment("That session") },
    body: { kind: "json", schema: attendanceSchema },
    answer: json<{ session: SessionDetailDto }>(),
    who: "instructor (classes they are staff of), admin",
    doc: '`{ "entries": [ { "userId", "status": "present\\|late\\|absent\\|excused", "minutes"?, "makeup"?, "makeupRunId"? } ], "reason"? }` → 200 `{ "session" }`: minutes default to the whole session when present, 0 when absent or excused. Entries are never changed: a new one counts. After the register is closed a change needs `reason` (422 without) and is audited as a correction. 422 `entries.N` for a student not of the class, minutes over the session, absent with minutes',
  }),
  closeSession: endpoint({
    method: "POST",
    path: "/api/class-sessions/:id/close",
    access: "attendance:take",
    params: { id: uuidSegment("That session") },
    answer: json<{ session: SessionDetailDto }>(),
    who: "instructor (classes they are staff of), admin",
    doc: '→ 200 `{ "session" }`: the register is closed; later changes are corrections with a reason. 409 already closed',
  }),
  studentAttendance: endpoint({
    method: "GET",
    path: "/api/records/students/:id/attendance",
    access: "records:view",
    params: { id: uuidSegment("That student") },
    answer: json<StudentAttendanceDto>(),
    who: "the student; their instructors; admins",
    doc: '200 `{ "student", "minutesBySection": { "General", "Airframe", "Powerplant" }, "sessions": [ { …session, "entry" } ] }`: the entry that counts in each session of the student\'s classes',
  }),
};

// The runs endpoints (lib/contracts/endpoint.ts says how one is declared).
import { z } from "zod";
import { runStatuses } from "@/lib/domain/vocabulary";
import { endpoint, file, isUuid, json, uuidSegment } from "@/lib/contracts/endpoint";
import { buyOffSchema, createAssignmentSchema, eventBatchSchema, returnRunSchema, signOffSchema } from "@/lib/domain/validation/runs";
import type {
  AssignmentDto,
  BuyOffCallDto,
  ClassRecordDto,
  EventBatchResultDto,
  PhotoDto,
  RunDetailDto,
  StudentRecordDto,
  WorkItemDto,
} from "@/lib/contracts/runs";
import type { RunStatus } from "@/lib/domain/runs/fold";

export const runsApi = {
  listAssignments: endpoint({
    method: "GET",
    path: "/api/assignments",
    access: "assignments:manage",
    query: z.object({
      card: z
        .string()
        .optional()
        .transform((v) => (v && isUuid(v) ? v.toLowerCase() : undefined)),
    }),
    answer: json<{ assignments: AssignmentDto[] }>(),
    who: "instructor (made by them or for their classes), admin",
    doc: `200 \`{ "assignments": [ { "id", "cardId", "title", "versionNumber", "className", "dueOn", "note", "assignedByName", "createdAt", "counts": { status: n } } ] }\``,
  }),
  createAssignment: endpoint({
    method: "POST",
    path: "/api/assignments",
    access: "assignments:manage",
    body: { kind: "json", schema: createAssignmentSchema },
    answer: json<{ assignment: { id: string; runs: number } }>(),
    status: 201,
    who: "instructor, admin",
    doc: `\`{ "cardId", "versionNumber"?, "classId"?, "studentIds"?, "dueOn"?, "note"? }\` → 201 \`{ "assignment": { "id", "runs" } }\`: one run per active student of the class (an instructor's own classes only) and per student named; the newest published version unless \`versionNumber\` names another. 422 naming the field: no class or students, someone who is not an active student, no published version, archived card, bad date`,
  }),
  myWork: endpoint({
    method: "GET",
    path: "/api/my-work",
    access: "runs:do",
    headers: { "Cache-Control": "private, no-store" },
    answer: json<{ work: WorkItemDto[] }>(),
    who: "student",
    doc: `200 \`{ "work": [ { "runId", "cardId", "title", "versionNumber", "newerVersion", "subjectName", "dueOn", "note", "status", "workStatus": "not_started\\|in_progress\\|returned\\|submitted\\|signed_off\\|overdue", "lastEventAt", "estimatedMinutes" } ] }\``,
  }),
  reviewQueue: endpoint({
    method: "GET",
    path: "/api/review",
    access: "runs:review",
    query: z.object({ status: z.enum(runStatuses.filter((s) => s !== "not_started")).catch("submitted") }),
    answer: json<{ runs: WorkItemDto[] }>(),
    who: "instructor, admin",
    doc: `200 \`{ "runs": [ … as above, with "studentName" ] }\` (an instructor's own classes' students and runs they assigned): \`submitted\` (default, oldest first), \`in_progress\`, \`returned\`, \`signed_off\``,
  }),
  buyOffQueue: endpoint({
    method: "GET",
    path: "/api/review/buy-offs",
    access: "runs:review",
    headers: { "Cache-Control": "private, no-store" },
    answer: json<{ points: BuyOffCallDto[] }>(),
    who: "instructor, admin",
    doc: `200 \`{ "points": [ { "runId", "studentName", "title", "versionNumber", "note", "stepId", "stepNumber", "calledAt", "lastEventAt" } ] }\`: inspection points done on a cart and not bought off, in the instructor's scope; the ones the student called for (\`inspection.called\`) first, longest waiting first. A call also mails the instructors of the student's classes`,
  }),
  get: endpoint({
    method: "GET",
    path: "/api/runs/:id",
    access: "signed-in",
    params: { id: uuidSegment("That run") },
    headers: { "Cache-Control": "private, no-store" },
    answer: json<RunDetailDto>(),
    who: "the run's student, an instructor of the student's class or who assigned it, admin (anyone else: 404)",
    doc: `200 \`{ "run", "version", "events": [ { "id", "type", "userId", "userName", "stepId", "payload", "clientTime", "serverTime" } ]\` in the order the fold reads them (late events after the review they arrived behind)\`, "reviewers", "photos", "signOff", "packet": { "url", "pages": [ { "revisionId", "page", "packetPage", "text", … } ] }, "keepOnCarts" }\`: everything the cart stores to run the card offline; the run keeps the version it was assigned`,
  }),
  appendEvents: endpoint({
    method: "POST",
    path: "/api/runs/:id/events",
    access: "signed-in",
    params: { id: uuidSegment("That run") },
    body: { kind: "json", schema: eventBatchSchema, maxBytes: 2 * 1024 * 1024 },
    answer: json<EventBatchResultDto>(),
    who: "the run's student; instructors for `inspection.bought_off`",
    doc: `\`{ "events": [ { "id" (UUID made on the cart), "type", "stepId"?, "payload"?, "clientTime" } ] }\` (1–500, 4,000 characters of payload each, 2 MiB) → 200 \`{ "stored", "duplicates", "status" }\`. Types: \`step.checked\`, \`step.unchecked\`, \`value.recorded\` \`{ value }\`, \`note.added\` \`{ text }\`, \`photo.added\` \`{ key }\`, \`timer.started\` \`{ minutes }\`, \`timer.stopped\`, \`inspection.called\` (at a done inspection point: asks the instructor to come), \`run.submitted\`. Idempotent by id: a re-sent event is counted as a duplicate and changes nothing, also after sign-off; a **new** event on a signed-off run → 409. 403 for an event of the wrong role`,
  }),
  packet: endpoint({
    method: "GET",
    path: "/api/runs/:id/packet",
    access: "signed-in",
    params: { id: uuidSegment("That run") },
    answer: file,
    who: "as `GET /api/runs/{id}`",
    doc: `the offline packet: a PDF of only the pages the run's version cites, in the order cited (made once per page set with pdf-lib and kept in storage)`,
  }),
  putPhoto: endpoint({
    method: "PUT",
    path: "/api/runs/:id/photos/:photoId",
    access: "signed-in",
    params: { id: uuidSegment("That run"), photoId: uuidSegment("That photo") },
    query: z.object({
      step: z
        .string()
        .optional()
        .transform((v) => (v && isUuid(v) ? v.toLowerCase() : null)),
    }),
    body: { kind: "binary" },
    answer: json<{ photo: PhotoDto }>(),
    status: 201,
    who: "the run's student",
    doc: `body: the picture (JPEG, PNG or WebP, recognised from its bytes; 8 MB) → 201 \`{ "photo" }\`; the same id again → 201 with what is stored; 415 for anything else, 413 beyond 8 MB, 409 after sign-off`,
  }),
  getPhoto: endpoint({
    method: "GET",
    path: "/api/runs/:id/photos/:photoId",
    access: "signed-in",
    params: { id: uuidSegment("That run"), photoId: uuidSegment("That photo") },
    answer: file,
    who: "as `GET /api/runs/{id}`",
    doc: `the picture`,
  }),
  buyOff: endpoint({
    method: "POST",
    path: "/api/runs/:id/buy-off",
    access: "runs:review",
    params: { id: uuidSegment("That run") },
    body: { kind: "json", schema: buyOffSchema },
    answer: json<{ status: RunStatus }>(),
    who: "instructor, admin",
    doc: `\`{ "stepId" }\` → 200: an inspection point the student has done; 422 for a step that is not one or not done, 409 when already bought off`,
  }),
  returnRun: endpoint({
    method: "POST",
    path: "/api/runs/:id/return",
    access: "runs:review",
    params: { id: uuidSegment("That run") },
    body: { kind: "json", schema: returnRunSchema },
    answer: json<{ status: RunStatus }>(),
    who: "instructor, admin",
    doc: `\`{ "comment" (required), "reopenStepIds"? }\` → 200: a submitted run goes back to the student with the comment; the steps named are reopened to be done again (bought-off inspection points too), their earlier readings kept in the step's history. 422 for a step not on the card`,
  }),
  signOff: endpoint({
    method: "POST",
    path: "/api/runs/:id/sign-off",
    access: "runs:review",
    params: { id: uuidSegment("That run") },
    body: { kind: "json", schema: signOffSchema },
    answer: json<{ status: RunStatus }>(),
    who: "instructor, admin",
    doc: `\`{ "password", "comment"? }\` (the instructor's own password, typed again) → 200: a submitted run with every step done and every inspection point bought off (422 otherwise) is signed off: instructor, time, version and the revisions cited are recorded and audited. A wrong password → 422 on \`password\` (counted on the account's sign-in throttle: 429 after too many). There is no way to change or remove a sign-off (the database refuses it, SQLSTATE HLF02)`,
  }),
  studentRecord: endpoint({
    method: "GET",
    path: "/api/records/students/:id",
    access: "records:view",
    params: { id: uuidSegment("That record") },
    query: z.object({ format: z.enum(["json", "csv", "pdf"]).optional().catch(undefined) }),
    answer: json<StudentRecordDto>(),
    who: "the student, an instructor of the student's class, admin (anyone else: 404)",
    doc: `200 \`{ "student", "subjects": [ { "subjectName", "signedOff": [ { "runId", "title", "versionNumber", "signedAt", "instructorName", "estimatedMinutes", "actualMinutes", "revisionsCited": [ { "revisionId", "manualTitle", "label", "pages" } ], "measured": [ { "stepId", "stepNumber", "stepText", "label", "limit": { "unit", "nominal", "tolerance", "min", "max", "text" }, "value", "recordedAt", "verdict" } ] } ] } ], "open", "returned", "totals": { "signedOff", "estimatedMinutes", "actualMinutes" } }\`, or the same as CSV or PDF. \`verdict\`: \`within_limits\`, \`out_of_limits\`, \`not_understood\`, \`not_recorded\`, for the reading that counted at sign-off (folded from the run's events). The CSV has one line per measured step of each signed-off card (one line for a card that measures nothing), the card's cells repeated on each: Student, Subject, Task card, Version, Revisions cited, Signed off (UTC), Instructor, Estimated hours, Actual hours, Step, Measured, Value, Limit, Verdict. Actual time counts the gaps between the student's events, each at most 20 minutes, every event counted no earlier than the assignment or 8 hours before the server received it`,
  }),
  classRecord: endpoint({
    method: "GET",
    path: "/api/records/classes/:id",
    access: "records:view-all",
    params: { id: uuidSegment("That class") },
    answer: json<ClassRecordDto>(),
    who: "instructor (own classes), admin",
    doc: `200 \`{ "class", "subjects", "students": [ { "id", "name", "bySubject": { subject: { "signedOff", "assigned" } }, "overdue" } ] }\``,
  }),
};

// Every route handler, every role: the status each gets. A new route must be added here, or the
// coverage test at the bottom fails. Bodies are chosen so an allowed role is stopped by validation
// or a missing record rather than changing data: the table checks who gets in, not what happens.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, classMembers, manuals, runs, taskCardVersions, users } from "@/db/schema";
import type { Role } from "@/lib/domain/access/permissions";
import { call, demo, makeAccount, signIn } from "../support/http";

// "otherInstructor" and "otherStudent" have a class of their own, apart from the demo student's
// day cohort: they must reach nothing of that class's runs and records (lib/server/runs/scope.ts). Unless
// a row says otherwise in `cross`, they get what the instructor and the student get.
type Who = "anonymous" | Role | "otherInstructor" | "otherStudent";
const everyone: Who[] = ["anonymous", "student", "instructor", "librarian", "admin", "otherInstructor", "otherStudent"];

interface Row {
  method: string;
  route: string; // as in app/api, e.g. /api/users/[id]
  path: (ids: Ids) => string;
  json?: unknown;
  expect: Record<Role | "anonymous", number>;
  cross?: Partial<Record<"otherInstructor" | "otherStudent", number>>;
  /** Signs in anew for this row (a sign-out would end the shared session). */
  freshSession?: boolean;
}

function expected(row: Row, who: Who): number {
  if (who === "otherInstructor") return row.cross?.otherInstructor ?? row.expect.instructor;
  if (who === "otherStudent") return row.cross?.otherStudent ?? row.expect.student;
  return row.expect[who];
}
interface Ids {
  adminId: string;
  dayClassId: string;
  nobody: string;
  manualId: string;
  revisionId: string;
  cardId: string;
  studentId: string;
  /** A run of the demo student's (tests/../db/demo/seed-runs.ts). */
  runId: string;
  /** That run's assignment, made by the demo instructor for the day class. */
  assignmentId: string;
}

const only = (allowed: Partial<Record<Role | "anonymous", number>>, denied = 403): Record<Role | "anonymous", number> => ({
  anonymous: 401,
  student: denied,
  instructor: denied,
  librarian: denied,
  admin: denied,
  ...allowed,
});
const all = (status: number): Record<Role | "anonymous", number> =>
  Object.fromEntries(["anonymous", "student", "instructor", "librarian", "admin"].map((w) => [w, status])) as Record<
    Role | "anonymous",
    number
  >;

export const accessMatrix: Row[] = [
  { method: "GET", route: "/api/health", path: () => "/api/health", expect: all(200) },
  { method: "GET", route: "/api/session", path: () => "/api/session", expect: { ...all(200), anonymous: 401 } },
  { method: "POST", route: "/api/session", path: () => "/api/session", json: {}, expect: all(422) },
  // Sign-out ends the session on the server: it gets a session of its own, so the others go on.
  { method: "DELETE", route: "/api/session", path: () => "/api/session", expect: all(204), freshSession: true },
  { method: "GET", route: "/api/users", path: () => "/api/users", expect: only({ admin: 200 }) },
  { method: "POST", route: "/api/users", path: () => "/api/users", json: {}, expect: only({ admin: 422 }) },
  { method: "GET", route: "/api/users/[id]", path: (i) => `/api/users/${i.adminId}`, expect: only({ admin: 200 }) },
  { method: "PATCH", route: "/api/users/[id]", path: (i) => `/api/users/${i.nobody}`, json: { name: "X" }, expect: only({ admin: 404 }) },
  { method: "POST", route: "/api/users/[id]/invitation", path: (i) => `/api/users/${i.nobody}/invitation`, expect: only({ admin: 404 }) },
  { method: "POST", route: "/api/password-resets", path: () => "/api/password-resets", json: {}, expect: all(422) },
  { method: "POST", route: "/api/password", path: () => "/api/password", json: {}, expect: all(422) },
  { method: "GET", route: "/api/classes", path: () => "/api/classes", expect: only({ instructor: 200, admin: 200 }) },
  { method: "POST", route: "/api/classes", path: () => "/api/classes", json: {}, expect: only({ admin: 422 }) },
  {
    method: "GET",
    route: "/api/classes/[id]",
    path: (i) => `/api/classes/${i.dayClassId}`,
    expect: only({ instructor: 200, admin: 200 }),
    cross: { otherInstructor: 404 },
  },
  {
    method: "PATCH",
    route: "/api/classes/[id]",
    path: (i) => `/api/classes/${i.dayClassId}`,
    json: { name: "" },
    expect: only({ admin: 422 }),
  },
  {
    method: "POST",
    route: "/api/classes/[id]/members",
    path: (i) => `/api/classes/${i.dayClassId}/members`,
    json: { userIds: [] },
    expect: only({ admin: 422 }),
  },
  {
    method: "DELETE",
    route: "/api/classes/[id]/members/[userId]",
    path: (i) => `/api/classes/${i.dayClassId}/members/${i.nobody}`,
    expect: only({ admin: 404 }),
  },
  { method: "GET", route: "/api/audit", path: () => "/api/audit", expect: only({ admin: 200 }) },
  { method: "GET", route: "/api/manuals", path: () => "/api/manuals", expect: { ...all(200), anonymous: 401 } },
  { method: "GET", route: "/api/search", path: () => "/api/search?q=magneto", expect: { ...all(200), anonymous: 401 } },
  // A JSON body where multipart is needed: the allowed roles get as far as the 415.
  { method: "POST", route: "/api/manuals", path: () => "/api/manuals", json: {}, expect: only({ librarian: 415, admin: 415 }) },
  { method: "GET", route: "/api/manuals/[id]", path: (i) => `/api/manuals/${i.manualId}`, expect: { ...all(200), anonymous: 401 } },
  {
    method: "POST",
    route: "/api/manuals/[id]/revisions",
    path: (i) => `/api/manuals/${i.manualId}/revisions`,
    json: {},
    expect: only({ librarian: 415, admin: 415 }),
  },
  { method: "GET", route: "/api/revisions/[id]", path: (i) => `/api/revisions/${i.revisionId}`, expect: { ...all(200), anonymous: 401 } },
  {
    method: "POST",
    route: "/api/revisions/[id]/retry",
    path: (i) => `/api/revisions/${i.nobody}/retry`,
    expect: only({ librarian: 404, admin: 404 }),
  },
  {
    method: "GET",
    route: "/api/revisions/[id]/file",
    path: (i) => `/api/revisions/${i.revisionId}/file`,
    expect: { ...all(200), anonymous: 401 },
  },
  {
    method: "GET",
    route: "/api/revisions/[id]/pages/[n]",
    path: (i) => `/api/revisions/${i.revisionId}/pages/1`,
    expect: { ...all(200), anonymous: 401 },
  },
  {
    method: "GET",
    route: "/api/revisions/[id]/pages/[n]/thumbnail",
    path: (i) => `/api/revisions/${i.nobody}/pages/1/thumbnail`,
    expect: { ...all(404), anonymous: 401 },
  },
  {
    method: "GET",
    route: "/api/revisions/[id]/changes",
    path: (i) => `/api/revisions/${i.nobody}/changes`,
    expect: { ...all(404), anonymous: 401 },
  },
  {
    method: "GET",
    route: "/api/cards/[id]/rechecks",
    path: (i) => `/api/cards/${i.cardId}/rechecks`,
    expect: only({ instructor: 200, admin: 200 }),
  },
  {
    method: "POST",
    route: "/api/cards/[id]/rechecks",
    path: (i) => `/api/cards/${i.cardId}/rechecks`,
    json: {},
    expect: only({ instructor: 422, admin: 422 }),
  },
  { method: "GET", route: "/api/subjects", path: () => "/api/subjects", expect: { ...all(200), anonymous: 401 } },
  { method: "POST", route: "/api/subjects", path: () => "/api/subjects", json: {}, expect: only({ admin: 422 }) },
  {
    method: "PATCH",
    route: "/api/subjects/[id]",
    path: (i) => `/api/subjects/${i.nobody}`,
    json: { name: "Nobody's subject" },
    expect: only({ admin: 404 }),
  },
  { method: "GET", route: "/api/cards", path: () => "/api/cards", expect: { ...all(200), anonymous: 401 } },
  { method: "POST", route: "/api/cards", path: () => "/api/cards", json: {}, expect: only({ instructor: 422, admin: 422 }) },
  { method: "GET", route: "/api/cards/[id]", path: (i) => `/api/cards/${i.cardId}`, expect: { ...all(200), anonymous: 401 } },
  {
    method: "PUT",
    route: "/api/cards/[id]/draft",
    path: (i) => `/api/cards/${i.cardId}/draft`,
    json: {},
    expect: only({ instructor: 422, admin: 422 }),
  },
  {
    method: "DELETE",
    route: "/api/cards/[id]/draft",
    path: (i) => `/api/cards/${i.nobody}/draft`,
    expect: only({ instructor: 404, admin: 404 }),
  },
  {
    method: "POST",
    route: "/api/cards/[id]/draft/citations",
    path: (i) => `/api/cards/${i.cardId}/draft/citations`,
    json: {},
    expect: only({ instructor: 422, admin: 422 }),
  },
  {
    method: "POST",
    route: "/api/cards/[id]/publish",
    path: (i) => `/api/cards/${i.nobody}/publish`,
    expect: only({ instructor: 404, admin: 404 }),
  },
  {
    method: "POST",
    route: "/api/cards/[id]/duplicate",
    path: (i) => `/api/cards/${i.nobody}/duplicate`,
    expect: only({ instructor: 404, admin: 404 }),
  },
  {
    method: "POST",
    route: "/api/cards/[id]/archive",
    path: (i) => `/api/cards/${i.cardId}/archive`,
    json: {},
    expect: only({ instructor: 422, admin: 422 }),
  },
  {
    method: "GET",
    route: "/api/cards/[id]/versions/[v]",
    path: (i) => `/api/cards/${i.cardId}/versions/1`,
    expect: { ...all(200), anonymous: 401 },
  },
  {
    method: "PATCH",
    route: "/api/cards/[id]/versions/[v]",
    path: (i) => `/api/cards/${i.cardId}/versions/1`,
    json: {},
    expect: only({ instructor: 422, admin: 422 }),
  },
  {
    method: "GET",
    route: "/api/cards/[id]/versions/[v]/pdf",
    path: (i) => `/api/cards/${i.cardId}/versions/1/pdf`,
    expect: { ...all(200), anonymous: 401 },
  },
  { method: "GET", route: "/api/assignments", path: () => "/api/assignments", expect: only({ instructor: 200, admin: 200 }) },
  { method: "POST", route: "/api/assignments", path: () => "/api/assignments", json: {}, expect: only({ instructor: 422, admin: 422 }) },
  {
    method: "GET",
    route: "/api/assignments/[id]",
    path: (i) => `/api/assignments/${i.assignmentId}`,
    expect: only({ instructor: 200, admin: 200 }),
    cross: { otherInstructor: 404 },
  },
  {
    method: "PATCH",
    route: "/api/assignments/[id]",
    path: (i) => `/api/assignments/${i.assignmentId}`,
    json: {},
    expect: only({ instructor: 422, admin: 422 }),
  },
  {
    method: "PATCH",
    route: "/api/assignments/[id]",
    path: (i) => `/api/assignments/${i.nobody}`,
    json: { dueOn: null, note: "" },
    expect: only({ instructor: 404, admin: 404 }),
  },
  {
    method: "POST",
    route: "/api/assignments/[id]/withdraw",
    path: (i) => `/api/assignments/${i.assignmentId}/withdraw`,
    json: {},
    expect: only({ instructor: 422, admin: 422 }),
  },
  { method: "GET", route: "/api/my-work", path: () => "/api/my-work", expect: only({ student: 200 }) },
  { method: "GET", route: "/api/review", path: () => "/api/review", expect: only({ instructor: 200, admin: 200 }) },
  {
    method: "GET",
    route: "/api/cards/[id]/runs-to-move",
    path: (i) => `/api/cards/${i.cardId}/runs-to-move`,
    expect: only({ instructor: 200, admin: 200 }),
  },
  {
    method: "POST",
    route: "/api/cards/[id]/move-runs",
    path: (i) => `/api/cards/${i.cardId}/move-runs`,
    json: {},
    expect: only({ instructor: 422, admin: 422 }),
  },
  { method: "GET", route: "/api/settings", path: () => "/api/settings", expect: { ...all(200), anonymous: 401 } },
  // A body the schema refuses: the row says who gets that far, without changing the school's zone.
  { method: "PUT", route: "/api/settings", path: () => "/api/settings", json: {}, expect: only({ admin: 422 }) },
  { method: "GET", route: "/api/review/buy-offs", path: () => "/api/review/buy-offs", expect: only({ instructor: 200, admin: 200 }) },
  // A run is seen by its student and by reviewers; anyone else is told it does not exist.
  {
    method: "GET",
    route: "/api/runs/[id]",
    path: (i) => `/api/runs/${i.runId}`,
    expect: { anonymous: 401, student: 200, instructor: 200, librarian: 404, admin: 200 },
    cross: { otherInstructor: 404, otherStudent: 404 },
  },
  {
    method: "POST",
    route: "/api/runs/[id]/events",
    path: (i) => `/api/runs/${i.runId}/events`,
    json: {},
    expect: { ...all(422), anonymous: 401 },
  },
  {
    method: "GET",
    route: "/api/runs/[id]/packet",
    path: (i) => `/api/runs/${i.runId}/packet`,
    expect: { anonymous: 401, student: 200, instructor: 200, librarian: 404, admin: 200 },
    cross: { otherInstructor: 404, otherStudent: 404 },
  },
  {
    method: "PUT",
    route: "/api/runs/[id]/photos/[photoId]",
    path: (i) => `/api/runs/${i.nobody}/photos/${i.nobody}`,
    expect: { ...all(404), anonymous: 401 },
  },
  {
    method: "GET",
    route: "/api/runs/[id]/photos/[photoId]",
    path: (i) => `/api/runs/${i.runId}/photos/${i.nobody}`,
    expect: { anonymous: 401, student: 404, instructor: 404, librarian: 404, admin: 404 },
  },
  // A step that is no inspection point: the run's own reviewers get as far as the 422.
  {
    method: "POST",
    route: "/api/runs/[id]/buy-off",
    path: (i) => `/api/runs/${i.runId}/buy-off`,
    json: { stepId: "00000000-0000-4000-8000-00000000abcd" },
    expect: only({ instructor: 422, admin: 422 }),
    cross: { otherInstructor: 404 },
  },
  {
    method: "POST",
    route: "/api/runs/[id]/return",
    path: (i) => `/api/runs/${i.runId}/return`,
    json: {},
    expect: only({ instructor: 422, admin: 422 }),
  },
  {
    method: "POST",
    route: "/api/runs/[id]/sign-off",
    path: (i) => `/api/runs/${i.nobody}/sign-off`,
    json: { password: "not checked before the run is found" },
    expect: only({ instructor: 404, admin: 404 }),
  },
  {
    method: "GET",
    route: "/api/records/students/[id]",
    path: (i) => `/api/records/students/${i.studentId}`,
    expect: only({ student: 200, instructor: 200, admin: 200 }),
    cross: { otherInstructor: 404, otherStudent: 404 },
  },
  {
    method: "GET",
    route: "/api/records/students/[id]/coverage",
    path: (i) => `/api/records/students/${i.studentId}/coverage`,
    expect: only({ student: 200, instructor: 200, admin: 200 }),
    cross: { otherInstructor: 404, otherStudent: 404 },
  },
  {
    method: "GET",
    route: "/api/records/students/[id]/readiness",
    path: (i) => `/api/records/students/${i.studentId}/readiness`,
    expect: only({ student: 200, instructor: 200, admin: 200 }),
    cross: { otherInstructor: 404, otherStudent: 404 },
  },
  {
    method: "GET",
    route: "/api/records/students/[id]/attendance",
    path: (i) => `/api/records/students/${i.studentId}/attendance`,
    expect: only({ student: 200, instructor: 200, admin: 200 }),
    cross: { otherInstructor: 404, otherStudent: 404 },
  },
  { method: "GET", route: "/api/class-sessions", path: () => "/api/class-sessions", expect: only({ instructor: 200, admin: 200 }) },
  {
    method: "POST",
    route: "/api/class-sessions",
    path: () => "/api/class-sessions",
    json: {},
    expect: only({ instructor: 422, admin: 422 }),
  },
  {
    method: "GET",
    route: "/api/class-sessions/[id]",
    path: (i) => `/api/class-sessions/${i.nobody}`,
    expect: only({ instructor: 404, admin: 404 }),
  },
  {
    method: "POST",
    route: "/api/class-sessions/[id]/attendance",
    path: (i) => `/api/class-sessions/${i.nobody}/attendance`,
    json: { entries: [{ userId: "00000000-0000-4000-8000-000000000000", status: "present" }] },
    expect: only({ instructor: 404, admin: 404 }),
  },
  {
    method: "POST",
    route: "/api/class-sessions/[id]/close",
    path: (i) => `/api/class-sessions/${i.nobody}/close`,
    expect: only({ instructor: 404, admin: 404 }),
  },
  { method: "GET", route: "/api/standard/elements", path: () => "/api/standard/elements?q=rivet", expect: { ...all(200), anonymous: 401 } },
  // JSON is not a CSV: the admin is stopped by the type, everyone else by the role.
  { method: "POST", route: "/api/standard/import", path: () => "/api/standard/import", json: {}, expect: only({ admin: 415 }) },
  {
    method: "GET",
    route: "/api/records/classes/[id]",
    path: (i) => `/api/records/classes/${i.dayClassId}`,
    expect: only({ instructor: 200, admin: 200 }),
    cross: { otherInstructor: 404 },
  },
  {
    method: "GET",
    route: "/api/records/classes/[id]/coverage",
    path: (i) => `/api/records/classes/${i.dayClassId}/coverage`,
    expect: only({ instructor: 200, admin: 200 }),
    cross: { otherInstructor: 404 },
  },
  // Only the owner (or an admin) names co-authors; the demo card is the evening instructor's.
  {
    method: "PUT",
    route: "/api/cards/[id]/coauthors",
    path: (i) => `/api/cards/${i.cardId}/coauthors`,
    json: { userIds: [] },
    expect: only({ admin: 200 }),
  },
  {
    method: "PUT",
    route: "/api/manuals/[id]/carts",
    path: (i) => `/api/manuals/${i.manualId}/carts`,
    json: {},
    expect: only({ librarian: 422, admin: 422 }),
  },
  {
    method: "PATCH",
    route: "/api/manuals/[id]",
    path: (i) => `/api/manuals/${i.manualId}`,
    json: {},
    expect: only({ librarian: 422, admin: 422 }),
  },
  {
    method: "GET",
    route: "/api/manuals/[id]/citations",
    path: (i) => `/api/manuals/${i.manualId}/citations`,
    expect: only({ librarian: 200, admin: 200 }),
  },
  {
    method: "POST",
    route: "/api/manuals/[id]/withdraw",
    path: (i) => `/api/manuals/${i.manualId}/withdraw`,
    json: {},
    expect: only({ librarian: 422, admin: 422 }),
  },
  {
    method: "GET",
    route: "/api/manuals/[id]/marks",
    path: (i) => `/api/manuals/${i.manualId}/marks?revision=${i.revisionId}`,
    expect: { ...all(200), anonymous: 401 },
  },
  { method: "POST", route: "/api/marks", path: () => "/api/marks", json: {}, expect: { ...all(422), anonymous: 401 } },
  { method: "DELETE", route: "/api/marks/[id]", path: (i) => `/api/marks/${i.nobody}`, expect: { ...all(404), anonymous: 401 } },
  // The tool room: the librarian keeps it; everyone signed in reads the tools; instructors clear holds.
  { method: "GET", route: "/api/tools", path: () => "/api/tools", expect: { ...all(200), anonymous: 401 } },
  { method: "POST", route: "/api/tools", path: () => "/api/tools", json: {}, expect: only({ librarian: 422, admin: 422 }) },
  { method: "GET", route: "/api/tools/[id]", path: (i) => `/api/tools/${i.nobody}`, expect: { ...all(404), anonymous: 401 } },
  {
    method: "PATCH",
    route: "/api/tools/[id]",
    path: (i) => `/api/tools/${i.nobody}`,
    json: {},
    expect: only({ librarian: 404, admin: 404 }),
  },
  {
    method: "POST",
    route: "/api/tools/[id]/calibrations",
    path: (i) => `/api/tools/${i.nobody}/calibrations`,
    json: {},
    expect: only({ librarian: 422, admin: 422 }),
  },
  { method: "GET", route: "/api/tools/labels", path: () => "/api/tools/labels", expect: only({ librarian: 200, admin: 200 }) },
  { method: "GET", route: "/api/kits", path: () => "/api/kits", expect: { ...all(200), anonymous: 401 } },
  { method: "POST", route: "/api/kits", path: () => "/api/kits", json: {}, expect: only({ librarian: 422, admin: 422 }) },
  { method: "GET", route: "/api/checkouts", path: () => "/api/checkouts", expect: { ...all(200), anonymous: 401 } },
  { method: "POST", route: "/api/checkouts", path: () => "/api/checkouts", json: {}, expect: only({ librarian: 422, admin: 422 }) },
  {
    method: "POST",
    route: "/api/checkouts/[id]/return",
    path: (i) => `/api/checkouts/${i.nobody}/return`,
    json: {},
    expect: only({ librarian: 404, admin: 404 }),
  },
  // The fleet and the hangar plan: read by everyone signed in; kept by admins; booked by instructors.
  { method: "GET", route: "/api/assets", path: () => "/api/assets", expect: { ...all(200), anonymous: 401 } },
  { method: "POST", route: "/api/assets", path: () => "/api/assets", json: {}, expect: only({ admin: 422 }) },
  { method: "GET", route: "/api/assets/[id]", path: (i) => `/api/assets/${i.nobody}`, expect: { ...all(404), anonymous: 401 } },
  { method: "PATCH", route: "/api/assets/[id]", path: (i) => `/api/assets/${i.nobody}`, json: {}, expect: only({ admin: 404 }) },
  { method: "GET", route: "/api/places", path: () => "/api/places", expect: { ...all(200), anonymous: 401 } },
  { method: "POST", route: "/api/places", path: () => "/api/places", json: {}, expect: only({ admin: 422 }) },
  { method: "GET", route: "/api/bookings", path: () => "/api/bookings", expect: { ...all(200), anonymous: 401 } },
  { method: "POST", route: "/api/bookings", path: () => "/api/bookings", json: {}, expect: only({ instructor: 422, admin: 422 }) },
  {
    method: "PATCH",
    route: "/api/bookings/[id]",
    path: (i) => `/api/bookings/${i.nobody}`,
    json: {},
    expect: only({ instructor: 404, admin: 404 }),
  },
  { method: "GET", route: "/api/findings", path: () => "/api/findings", expect: { ...all(200), anonymous: 401 } },
  {
    method: "POST",
    route: "/api/findings",
    path: () => "/api/findings",
    json: {},
    expect: only({ student: 422, instructor: 422, admin: 422 }),
  },
  {
    method: "PATCH",
    route: "/api/findings/[id]",
    path: (i) => `/api/findings/${i.nobody}`,
    json: { decision: "fixed_in_run" },
    expect: only({ instructor: 404, admin: 404 }),
  },
  {
    method: "GET",
    route: "/api/runs/[id]/assets",
    path: (i) => `/api/runs/${i.runId}/assets`,
    expect: { anonymous: 401, student: 200, instructor: 200, librarian: 404, admin: 200 },
    cross: { otherInstructor: 404, otherStudent: 404 },
  },
  {
    method: "PUT",
    route: "/api/runs/[id]/assets",
    path: (i) => `/api/runs/${i.nobody}/assets`,
    json: { assetIds: [] },
    expect: { ...all(404), anonymous: 401 },
  },
  { method: "GET", route: "/api/tool-holds", path: () => "/api/tool-holds", expect: { ...all(200), anonymous: 401 } },
  {
    method: "POST",
    route: "/api/tool-holds/[id]/clear",
    path: (i) => `/api/tool-holds/${i.nobody}/clear`,
    json: { outcome: "found" },
    expect: only({ instructor: 404, admin: 404 }),
  },
  // The demo manual is in the library: nothing to restore.
  {
    method: "POST",
    route: "/api/manuals/[id]/restore",
    path: (i) => `/api/manuals/${i.manualId}/restore`,
    expect: only({ librarian: 409, admin: 409 }),
  },
];

const cookies: Partial<Record<Who, string>> = {};
const credentials: Partial<Record<Who, { email: string; password?: string }>> = {};
let ids: Ids;

beforeAll(async () => {
  for (const role of ["student", "instructor", "librarian", "admin"] as const) {
    cookies[role] = await signIn(demo[role]);
    credentials[role] = { email: demo[role] };
  }
  const otherInstructor = await makeAccount("instructor", "Other class instructor");
  const otherStudent = await makeAccount("student", "Other class student");
  cookies.otherInstructor = await signIn(otherInstructor.email, otherInstructor.password);
  cookies.otherStudent = await signIn(otherStudent.email, otherStudent.password);
  credentials.otherInstructor = otherInstructor;
  credentials.otherStudent = otherStudent;
  const [own] = await getDb()
    .insert(classes)
    .values({ name: `Other class ${otherStudent.id.slice(0, 8)}` })
    .returning({ id: classes.id });
  await getDb()
    .insert(classMembers)
    .values([otherInstructor, otherStudent].map((a) => ({ classId: own!.id, userId: a.id })));
  const [admin] = await getDb().select({ id: users.id }).from(users).where(eq(users.email, demo.admin));
  const [day] = await getDb().select({ id: classes.id }).from(classes).where(eq(classes.name, "AMT Day Cohort 2027"));
  // A demo manual once the worker has read it (the seed queues it just before the tests).
  let manual: { id: string; currentRevisionId: string | null } | undefined;
  for (let i = 0; i < 240 && !manual?.currentRevisionId; i++) {
    [manual] = await getDb()
      .select({ id: manuals.id, currentRevisionId: manuals.currentRevisionId })
      .from(manuals)
      .where(eq(manuals.title, "SM-4 Magneto Overhaul Manual"));
    if (!manual?.currentRevisionId) await new Promise((r) => setTimeout(r, 500));
  }
  const [card] = await getDb()
    .select({ id: taskCardVersions.cardId })
    .from(taskCardVersions)
    .where(and(eq(taskCardVersions.title, "Magneto-to-engine timing check"), eq(taskCardVersions.number, 1)));
  const [student] = await getDb().select({ id: users.id }).from(users).where(eq(users.email, demo.student));
  const [run] = await getDb()
    .select({ id: runs.id, assignmentId: runs.assignmentId })
    .from(runs)
    .where(eq(runs.studentId, student!.id))
    .limit(1);
  ids = {
    studentId: student!.id,
    runId: run!.id,
    assignmentId: run!.assignmentId,
    cardId: card!.id,
    adminId: admin!.id,
    dayClassId: day!.id,
    nobody: "00000000-0000-4000-8000-00000000abcd",
    manualId: manual!.id,
    revisionId: manual!.currentRevisionId!,
  };
}, 150_000);

describe("access matrix", () => {
  for (const row of accessMatrix) {
    for (const who of everyone) {
      it(`${row.method} ${row.route} as ${who} → ${expected(row, who)}`, async () => {
        const login = credentials[who];
        const cookie = row.freshSession && login ? await signIn(login.email, login.password) : cookies[who];
        const response = await call(row.method, row.path(ids), { cookie, json: row.json });
        expect(response.status).toBe(expected(row, who));
        if (response.status >= 400) {
          const body = (await response.json()) as { error?: { code?: string; message?: string } };
          expect(body.error?.code).toBeTypeOf("string");
          expect(body.error?.message).toBeTypeOf("string");
        }
      });
    }
  }
});

describe("the matrix covers every route handler", () => {
  const apiDir = path.resolve(import.meta.dirname, "../../app/api");
  const found: string[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name === "route.ts") {
        const route = `/api/${path.relative(apiDir, dir).split(path.sep).join("/")}`.replace(/\/$/, "");
        const source = readFileSync(full, "utf8");
        for (const match of source.matchAll(/export (?:const|async function) (GET|POST|PUT|PATCH|DELETE)\b/g)) {
          found.push(`${match[1]} ${route}`);
        }
      }
    }
  };
  walk(apiDir);

  it("has a row for each exported method", () => {
    const listed = new Set(accessMatrix.map((r) => `${r.method} ${r.route}`));
    expect(found.filter((f) => !listed.has(f))).toEqual([]);
    expect([...listed].filter((l) => !found.includes(l))).toEqual([]);
  });
});

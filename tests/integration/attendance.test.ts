// Attendance registers against the real server and database: an instructor plans a session and
// takes the register (minutes defaulted, checked against the session), a closed register changes
// only by a correction with its reason (both kept, the audit log says both), entries never change
// in the database, hours add up per section, and nobody outside the class reads or writes it.
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { attendanceEntries, auditEvents, classes, classMembers } from "@/db/schema";
import type { SessionDetailDto, SessionDto, StudentAttendanceDto } from "@/lib/contracts/attendance";
import { call, makeAccount, signIn } from "../support/http";
import { uniqueTitle } from "../support/library";

interface Person {
  id: string;
  name: string;
  cookie: string;
}
const person = async (role: "instructor" | "student"): Promise<Person> => {
  const a = await makeAccount(role, `${role} ${randomUUID().slice(0, 4)}`);
  return { id: a.id, name: a.name, cookie: await signIn(a.email, a.password) };
};
const body = async <T>(response: Response, status: number): Promise<T> => {
  const text = await response.text();
  expect(response.status, text).toBe(status);
  return JSON.parse(text) as T;
};
let teacher: Person;
let amy: Person;
let ben: Person;
let stranger: Person;
let outsider: Person; // a student of another class
let classId: string;

beforeAll(async () => {
  [teacher, amy, ben, stranger, outsider] = [
    await person("instructor"),
    await person("student"),
    await person("student"),
    await person("instructor"),
    await person("student"),
  ];
  const [row] = await getDb()
    .insert(classes)
    .values({ name: uniqueTitle("Attendance class") })
    .returning({ id: classes.id });
  classId = row!.id;
  await getDb()
    .insert(classMembers)
    .values([teacher, amy, ben].map((p) => ({ classId, userId: p.id })));
});

const plan = (json: Record<string, unknown>, cookie = teacher.cookie) =>
  call("POST", "/api/class-sessions", {
    cookie,
    json: {
      classId,
      startsAt: new Date(Date.now() - 3_600_000).toISOString(),
      minutes: 240,
      section: "Airframe",
      subject: "Riveting practice",
      ...json,
    },
  });

describe("attendance", () => {
  it("takes the register, closes it, and corrects it only with a reason, keeping both entries", async () => {
    const { session } = await body<{ session: { id: string } }>(await plan({}), 201);
    const take = (json: unknown, cookie = teacher.cookie) => call("POST", `/api/class-sessions/${session.id}/attendance`, { cookie, json });
    // Checked against the session and the class.
    const bad = await take({
      entries: [
        { userId: amy.id, status: "absent", minutes: 30 },
        { userId: outsider.id, status: "present" },
        { userId: ben.id, status: "present", minutes: 300 },
      ],
    });
    expect(bad.status).toBe(422);
    const fields = ((await bad.json()) as { error: { fields: Record<string, string> } }).error.fields;
    expect(fields).toEqual({
      "entries.0": "Someone absent or excused attended 0 minutes.",
      "entries.1": "That person is not a student of this class.",
      "entries.2": "The session lasts 240 minutes: no one attends more.",
    });
    const taken = await body<{ session: SessionDetailDto }>(
      await take({
        entries: [
          { userId: amy.id, status: "present" },
          { userId: ben.id, status: "late", minutes: 180 },
        ],
      }),
      200,
    );
    expect(taken.session.roster.map((r) => [r.name, r.current?.status, r.current?.minutes])).toEqual(
      [
        [amy.name, "present", 240],
        [ben.name, "late", 180],
      ].sort((a, b) => String(a[0]).localeCompare(String(b[0]))),
    );
    expect(taken.session.counts).toMatchObject({ present: 1, late: 1, unrecorded: 0 });

    await body(await call("POST", `/api/class-sessions/${session.id}/close`, { cookie: teacher.cookie }), 200);
    expect((await call("POST", `/api/class-sessions/${session.id}/close`, { cookie: teacher.cookie })).status).toBe(409);
    // Closed: the same again changes nothing; a change needs its reason.
    await body(await take({ entries: [{ userId: amy.id, status: "present" }] }), 200);
    const noReason = await take({ entries: [{ userId: amy.id, status: "late", minutes: 200 }] });
    expect(noReason.status).toBe(422);
    expect(((await noReason.json()) as { error: { fields: Record<string, string> } }).error.fields.reason).toMatch(/why/);
    const corrected = await body<{ session: SessionDetailDto }>(
      await take({ entries: [{ userId: amy.id, status: "late", minutes: 200 }], reason: "Arrived at 09:40, seen on the gate log" }),
      200,
    );
    const amyRow = corrected.session.roster.find((r) => r.userId === amy.id)!;
    expect(amyRow.current).toMatchObject({
      status: "late",
      minutes: 200,
      correctionReason: "Arrived at 09:40, seen on the gate log",
      recordedByName: teacher.name,
    });
    expect(amyRow.history.map((h) => h.status)).toEqual(["late", "present"]);
    // Never changed in place, from any path.
    await expect(getDb().update(attendanceEntries).set({ minutes: 1 }).where(eq(attendanceEntries.userId, amy.id))).rejects.toMatchObject({
      cause: { code: "HLF02" },
    });
    await expect(getDb().execute(sql`delete from attendance_entries where user_id = ${amy.id}`)).rejects.toMatchObject({
      cause: { code: "HLF02" },
    });
    const audit = await getDb()
      .select({ action: auditEvents.action, details: auditEvents.details })
      .from(auditEvents)
      .where(eq(auditEvents.subjectId, classId));
    expect(audit.map((a) => a.action).sort()).toEqual(["attendance.corrected", "attendance.recorded", "session.closed", "session.created"]);
  });

  it("adds the minutes up per section for the student, who reads their own", async () => {
    const { session } = await body<{ session: { id: string } }>(
      await plan({ section: "Powerplant", minutes: 90, subject: "Magneto timing" }),
      201,
    );
    await body(
      await call("POST", `/api/class-sessions/${session.id}/attendance`, {
        cookie: teacher.cookie,
        json: {
          entries: [
            { userId: amy.id, status: "present" },
            { userId: ben.id, status: "absent", makeup: "Timing card on the trainer, Friday" },
          ],
        },
      }),
      200,
    );
    const mine = await body<StudentAttendanceDto>(
      await call("GET", `/api/records/students/${amy.id}/attendance`, { cookie: amy.cookie }),
      200,
    );
    expect(mine.minutesBySection).toEqual({ General: 0, Airframe: 200, Powerplant: 90 });
    const bens = await body<StudentAttendanceDto>(
      await call("GET", `/api/records/students/${ben.id}/attendance`, { cookie: teacher.cookie }),
      200,
    );
    expect(bens.minutesBySection).toEqual({ General: 0, Airframe: 180, Powerplant: 0 });
    expect(bens.sessions.find((s) => s.id === session.id)!.entry).toMatchObject({
      status: "absent",
      makeup: "Timing card on the trainer, Friday",
    });
    // Another student, another class's instructor: nothing.
    expect((await call("GET", `/api/records/students/${amy.id}/attendance`, { cookie: ben.cookie })).status).toBe(404);
    expect((await call("GET", `/api/records/students/${amy.id}/attendance`, { cookie: stranger.cookie })).status).toBe(404);
  });

  it("keeps another class's instructor and the students out of the register", async () => {
    expect((await plan({}, stranger.cookie)).status).toBe(422);
    expect((await plan({}, amy.cookie)).status).toBe(403);
    const { sessions } = await body<{ sessions: SessionDto[] }>(
      await call("GET", `/api/class-sessions?classId=${classId}`, { cookie: teacher.cookie }),
      200,
    );
    expect(sessions.length).toBe(2);
    const theirs = await body<{ sessions: SessionDto[] }>(
      await call("GET", `/api/class-sessions?classId=${classId}`, { cookie: stranger.cookie }),
      200,
    );
    expect(theirs.sessions).toEqual([]);
    const id = sessions[0]!.id;
    expect((await call("GET", `/api/class-sessions/${id}`, { cookie: stranger.cookie })).status).toBe(404);
    expect(
      (
        await call("POST", `/api/class-sessions/${id}/attendance`, {
          cookie: stranger.cookie,
          json: { entries: [{ userId: amy.id, status: "present" }] },
        })
      ).status,
    ).toBe(404);
    expect(
      (
        await call("POST", `/api/class-sessions/${id}/attendance`, {
          cookie: amy.cookie,
          json: { entries: [{ userId: amy.id, status: "present" }] },
        })
      ).status,
    ).toBe(403);
  });
});

// Assignments after they are made, against the real server and database: the same card twice on
// a student's list is warned about, a due date can be moved (never into the past), and withdrawing
// takes open runs off the students' work and refuses new work on them, while signed-off runs stay.
import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, classMembers, curriculumSubjects, revisions } from "@/db/schema";
import type { CardDto } from "@/lib/contracts/cards";
import type { AssignmentDetailDto, WorkItemDto } from "@/lib/contracts/runs";
import { call, makeAccount, signIn } from "../support/http";
import { uniqueTitle } from "../support/library";

interface Person {
  id: string;
  name: string;
  cookie: string;
  password: string;
}
const person = async (role: "instructor" | "student"): Promise<Person> => {
  const a = await makeAccount(role);
  return { id: a.id, name: a.name, cookie: await signIn(a.email, a.password), password: a.password };
};
let teacher: Person;
let learner: Person;
let other: Person; // a second student of the class
let stranger: Person; // an instructor of another class
let cardId: string;
const stepId = randomUUID();

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
const assign = (json: Record<string, unknown>, cookie = teacher.cookie) =>
  call("POST", "/api/assignments", { cookie, json: { cardId, ...json } });
const myWork = async (p: Person) =>
  ((await (await call("GET", "/api/my-work", { cookie: p.cookie })).json()) as { work: WorkItemDto[] }).work;
const detail = async (id: string, cookie = teacher.cookie) => {
  const answer = await call("GET", `/api/assignments/${id}`, { cookie });
  expect(answer.status).toBe(200);
  return ((await answer.json()) as { assignment: AssignmentDetailDto }).assignment;
};
// A millisecond apart, in the order made, as on a cart.
let tick = 0;
const event = (type: string, over: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  type,
  clientTime: new Date((tick = Math.max(Date.now(), tick + 1))).toISOString(),
  stepId: null,
  payload: {},
  ...over,
});

beforeAll(async () => {
  [teacher, learner, other, stranger] = [
    await person("instructor"),
    await person("student"),
    await person("student"),
    await person("instructor"),
  ];
  const [row] = await getDb()
    .insert(classes)
    .values({ name: uniqueTitle("Assignments class") })
    .returning({ id: classes.id });
  await getDb()
    .insert(classMembers)
    .values([teacher, learner, other].map((p) => ({ classId: row!.id, userId: p.id })));
  const [revision] = await getDb()
    .select({ id: revisions.id })
    .from(revisions)
    .where(and(eq(revisions.status, "ready"), sql`${revisions.pageCount} >= 2`))
    .limit(1);
  const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
  const created = await call("POST", "/api/cards", {
    cookie: teacher.cookie,
    json: {
      content: {
        title: uniqueTitle("Assignment card"),
        ataChapter: "32",
        subjectId: subject!.id,
        steps: [{ id: stepId, text: "Inspect the brake lining.", references: [{ revisionId: revision!.id, page: 1 }] }],
      },
    },
  });
  expect(created.status).toBe(201);
  cardId = ((await created.json()) as { card: CardDto }).card.id;
  expect((await call("POST", `/api/cards/${cardId}/publish`, { cookie: teacher.cookie })).status).toBe(200);
});

describe("assignments", () => {
  it("warns, naming the students, before giving a card to someone who has it open", async () => {
    const first = await assign({ studentIds: [learner.id], note: "Bay 1" });
    expect(first.status).toBe(201);
    const again = await assign({ studentIds: [learner.id, other.id], note: "Bay 2" });
    expect(again.status).toBe(409);
    const body = (await again.json()) as { error: { message: string; fields: Record<string, string> } };
    expect(body.error.message).toContain(`${learner.name} (ready to start, version 1)`);
    // Only the one who has it open is named (the other is new to it).
    expect(body.error.message).toMatch(/^This student already has this card open: /);
    expect(body.error.fields.confirmDuplicates).toBe(body.error.message);
    // Nothing was made by the refused request.
    expect((await myWork(other)).filter((w) => w.cardId === cardId)).toHaveLength(0);
    const confirmed = await assign({ studentIds: [learner.id, other.id], note: "Bay 2", confirmDuplicates: true });
    expect(confirmed.status).toBe(201);
    expect((await myWork(learner)).filter((w) => w.cardId === cardId)).toHaveLength(2);
  });

  it("refuses a due date in the past, at creation and when moved", async () => {
    const past = await assign({ studentIds: [other.id], dueOn: day(-2), confirmDuplicates: true });
    expect(past.status).toBe(422);
    expect(((await past.json()) as { error: { fields: Record<string, string> } }).error.fields.dueOn).toMatch(/past/);
    const made = await assign({ studentIds: [other.id], dueOn: day(3), note: "Stand 4", confirmDuplicates: true });
    const { id } = ((await made.json()) as { assignment: { id: string } }).assignment;
    const back = await call("PATCH", `/api/assignments/${id}`, { cookie: teacher.cookie, json: { dueOn: day(-3), note: "Stand 4" } });
    expect(back.status).toBe(422);
    const extended = await call("PATCH", `/api/assignments/${id}`, { cookie: teacher.cookie, json: { dueOn: day(10), note: "Stand 5" } });
    expect(extended.status).toBe(200);
    const after = ((await extended.json()) as { assignment: AssignmentDetailDto }).assignment;
    expect(after).toMatchObject({ dueOn: day(10), note: "Stand 5" });
    expect(after.students.map((s) => s.name)).toEqual([other.name]);
    expect((await detail(id)).dueOn).toBe(day(10));
    // Another class's instructor learns nothing of it.
    expect((await call("GET", `/api/assignments/${id}`, { cookie: stranger.cookie })).status).toBe(404);
    expect((await call("PATCH", `/api/assignments/${id}`, { cookie: stranger.cookie, json: { dueOn: null, note: "" } })).status).toBe(404);
    expect((await call("POST", `/api/assignments/${id}/withdraw`, { cookie: stranger.cookie, json: { reason: "x" } })).status).toBe(404);
  });

  it("withdraws: open runs leave the student's work and take no new work; a signed-off run stays a record", async () => {
    const made = await assign({ studentIds: [learner.id, other.id], note: "Withdraw me", confirmDuplicates: true });
    const { id } = ((await made.json()) as { assignment: { id: string } }).assignment;
    const runOf = async (p: Person) => (await myWork(p)).find((w) => w.note === "Withdraw me")!.runId;
    const [started, signed] = [await runOf(learner), await runOf(other)];
    const work = [event("step.checked", { stepId })];
    expect((await call("POST", `/api/runs/${started}/events`, { cookie: learner.cookie, json: { events: work } })).status).toBe(200);
    // The second student finishes and is signed off before the withdrawal.
    const done = [event("step.checked", { stepId }), event("run.submitted")];
    expect((await call("POST", `/api/runs/${signed}/events`, { cookie: other.cookie, json: { events: done } })).status).toBe(200);
    const signOff = await call("POST", `/api/runs/${signed}/sign-off`, { cookie: teacher.cookie, json: { password: teacher.password } });
    expect(signOff.status).toBe(200);

    expect((await call("POST", `/api/assignments/${id}/withdraw`, { cookie: teacher.cookie, json: { reason: "" } })).status).toBe(422);
    const withdrawn = await call("POST", `/api/assignments/${id}/withdraw`, {
      cookie: teacher.cookie,
      json: { reason: "The aircraft went back to the flight line." },
    });
    expect(withdrawn.status).toBe(200);
    const a = ((await withdrawn.json()) as { assignment: AssignmentDetailDto }).assignment;
    expect(a.withdrawnAt).toBeTruthy();
    expect(a.withdrawReason).toBe("The aircraft went back to the flight line.");

    expect((await myWork(learner)).some((w) => w.runId === started)).toBe(false);
    expect((await myWork(other)).some((w) => w.runId === signed)).toBe(true);
    const late = await call("POST", `/api/runs/${started}/events`, {
      cookie: learner.cookie,
      json: { events: [event("note.added", { stepId, payload: { text: "Done after all." } })] },
    });
    expect(late.status).toBe(409);
    expect(((await late.json()) as { error: { message: string } }).error.message).toMatch(
      /withdrawn .*flight line\. The work already done is kept\./,
    );
    // The work already sent is still there for the instructor to read.
    expect((await call("GET", `/api/runs/${started}`, { cookie: teacher.cookie })).status).toBe(200);
    expect((await call("POST", `/api/assignments/${id}/withdraw`, { cookie: teacher.cookie, json: { reason: "again" } })).status).toBe(409);
    expect((await call("PATCH", `/api/assignments/${id}`, { cookie: teacher.cookie, json: { dueOn: null, note: "x" } })).status).toBe(409);
    // A withdrawn card no longer counts as open for the duplicate warning.
    expect((await assign({ studentIds: [learner.id], note: "After withdrawal" })).status).toBe(409); // Bay 1 and Bay 2 are still open
  });
});

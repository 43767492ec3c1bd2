// What makes the records trustworthy, tried as an adversary would against the real server: a cart's
// clock set back to slip a change under a review, another class's instructor and student, requests
// from other sites, bodies that never end, and input no database can store.
import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, classMembers, curriculumSubjects, revisions, signOffs } from "@/db/schema";
import type { CardDto } from "@/lib/contracts/cards";
import type { RunDetailDto, WorkItemDto } from "@/lib/contracts/runs";
import { offlineHours } from "@/lib/domain/runs/hours";
import { baseUrl, call, demo, makeAccount, signIn } from "../support/http";
import { uniqueTitle } from "../support/library";

interface Person {
  id: string;
  cookie: string;
  password: string;
}
let teacher: Person; // instructor of class A, owner of the card
let learner: Person; // student of class A
let otherTeacher: Person; // instructor of class B only
let otherLearner: Person; // student of class B only
let coauthor: Person; // an instructor the owner names
let admin: string;
let card: CardDto;
const stepIds = [randomUUID(), randomUUID(), randomUUID()];

const person = async (role: "instructor" | "student") => {
  const a = await makeAccount(role);
  return { id: a.id, cookie: await signIn(a.email, a.password), password: a.password };
};
const event = (type: string, clientTime: string, over: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  type,
  clientTime,
  stepId: null,
  payload: {},
  ...over,
});
const send = (cookie: string, runId: string, events: unknown[]) => call("POST", `/api/runs/${runId}/events`, { cookie, json: { events } });
const ago = (seconds: number) => new Date(Date.now() - seconds * 1000).toISOString();

async function detail(cookie: string, runId: string) {
  const answer = await call("GET", `/api/runs/${runId}`, { cookie });
  expect(answer.status).toBe(200);
  return (await answer.json()) as RunDetailDto & { state?: unknown };
}

async function newRun(student = learner, by = teacher): Promise<string> {
  const note = `trust ${randomUUID().slice(0, 8)}`;
  const made = await call("POST", "/api/assignments", {
    cookie: by.cookie,
    json: { cardId: card.id, studentIds: [student.id], note, confirmDuplicates: true },
  });
  expect(made.status).toBe(201);
  const work = ((await (await call("GET", "/api/my-work", { cookie: student.cookie })).json()) as { work: WorkItemDto[] }).work;
  return work.find((w) => w.note === note)!.runId;
}

beforeAll(async () => {
  [teacher, learner, otherTeacher, otherLearner, coauthor] = [
    await person("instructor"),
    await person("student"),
    await person("instructor"),
    await person("student"),
    await person("instructor"),
  ];
  admin = await signIn(demo.admin);
  const classOf = async (people: Person[]) => {
    const [row] = await getDb()
      .insert(classes)
      .values({ name: uniqueTitle("Trust class") })
      .returning({ id: classes.id });
    await getDb()
      .insert(classMembers)
      .values(people.map((p) => ({ classId: row!.id, userId: p.id })));
  };
  await classOf([teacher, learner]);
  await classOf([otherTeacher, otherLearner]);
  const [revision] = await getDb()
    .select({ id: revisions.id })
    .from(revisions)
    .where(and(eq(revisions.status, "ready"), sql`${revisions.pageCount} >= 3`))
    .limit(1);
  const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
  const content = {
    title: uniqueTitle("Trust card"),
    applicability: ["HT-20"],
    ataChapter: "27",
    subjectId: subject!.id,
    estimatedMinutes: 30,
    steps: [
      {
        id: stepIds[0],
        text: "Measure the cable tension.",
        references: [{ revisionId: revision!.id, page: 2 }],
        measurement: { label: "Tension", unit: "lb", min: 30, max: 40 },
        inspectionPoint: true,
      },
      { id: stepIds[1], text: "Safety the turnbuckle.", references: [] },
      { id: stepIds[2], text: "Tidy the work area.", references: [] },
    ],
  };
  const created = await call("POST", "/api/cards", { cookie: teacher.cookie, json: { content } });
  expect(created.status).toBe(201);
  const id = ((await created.json()) as { card: CardDto }).card.id;
  expect((await call("POST", `/api/cards/${id}/publish`, { cookie: teacher.cookie })).status).toBe(200);
  card = ((await (await call("GET", `/api/cards/${id}`, { cookie: teacher.cookie })).json()) as { card: CardDto }).card;
});

describe("a signed record cannot be bent by a cart's clock", () => {
  it("keeps a bought-off reading when a back-dated change arrives after the buy-off", async () => {
    const runId = await newRun();
    expect(
      (
        await send(learner.cookie, runId, [
          event("value.recorded", ago(60), { stepId: stepIds[0], payload: { value: "35 lb" } }),
          event("step.checked", ago(50), { stepId: stepIds[0] }),
        ])
      ).status,
    ).toBe(200);
    expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: teacher.cookie, json: { stepId: stepIds[0] } })).status).toBe(200);
    // Stamped a second before the buy-off, sent after it: in limits would turn out of limits.
    expect(
      (await send(learner.cookie, runId, [event("value.recorded", ago(1), { stepId: stepIds[0], payload: { value: "55 lb" } })])).status,
    ).toBe(200);
    const shown = await detail(teacher.cookie, runId);
    const sneaked = shown.events.at(-1)!;
    expect(sneaked.payload).toMatchObject({ value: "55 lb" });
    expect(sneaked.serverTime! > shown.events.find((e) => e.type === "inspection.bought_off")!.serverTime!).toBe(true);
    // The page the instructor reviews on: the bought-off value stands, the late one is listed as late.
    const page = await (await call("GET", `/review/${runId}`, { cookie: teacher.cookie })).text();
    expect(page).toContain("arrived after the buy-off");
    expect(page).toContain("not counted: this inspection point is bought off");
  });

  it("keeps a handed-in run as handed in, and signs off what was handed in", async () => {
    const runId = await newRun();
    const work = [
      event("value.recorded", ago(300), { stepId: stepIds[0], payload: { value: "35 lb" } }),
      event("step.checked", ago(290), { stepId: stepIds[0] }),
      event("step.checked", ago(280), { stepId: stepIds[1] }),
      event("step.checked", ago(270), { stepId: stepIds[2] }),
      event("run.submitted", ago(260)),
    ];
    expect((await send(learner.cookie, runId, work)).status).toBe(200);
    // Back-dated before the hand-in, sent after it.
    expect(
      (
        await send(learner.cookie, runId, [
          event("step.unchecked", ago(285), { stepId: stepIds[1] }),
          event("value.recorded", ago(295), { stepId: stepIds[0], payload: { value: "20 lb" } }),
        ])
      ).status,
    ).toBe(200);
    expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: teacher.cookie, json: { stepId: stepIds[0] } })).status).toBe(200);
    // The back-dated uncheck would have made the sign-off refuse "step 2 is not done".
    expect(
      (await call("POST", `/api/runs/${runId}/sign-off`, { cookie: teacher.cookie, json: { comment: "ok", password: teacher.password } }))
        .status,
    ).toBe(200);
    const shown = await detail(learner.cookie, runId);
    expect(shown.run.status).toBe("signed_off");
    const [signed] = await getDb().select().from(signOffs).where(eq(signOffs.runId, runId));
    expect(signed).toBeTruthy();
  });

  it("bounds working time by what the server saw, not by a batch of back-dated stamps", async () => {
    const runId = await newRun();
    // 400 events stamped 20 minutes apart over the past five days, all sent now after a minute of work.
    const backDated = Array.from({ length: 400 }, (_, i) =>
      event("note.added", ago(i * 1200 + 5), { stepId: stepIds[2], payload: { text: `n${i}` } }),
    );
    const honest = [
      event("value.recorded", ago(50), { stepId: stepIds[0], payload: { value: "35 lb" } }),
      event("step.checked", ago(40), { stepId: stepIds[0] }),
      event("step.checked", ago(30), { stepId: stepIds[1] }),
      event("step.checked", ago(20), { stepId: stepIds[2] }),
    ];
    expect((await send(learner.cookie, runId, backDated)).status).toBe(200);
    expect((await send(learner.cookie, runId, [...honest, event("run.submitted", ago(10))])).status).toBe(200);
    expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: teacher.cookie, json: { stepId: stepIds[0] } })).status).toBe(200);
    expect(
      (await call("POST", `/api/runs/${runId}/sign-off`, { cookie: teacher.cookie, json: { password: teacher.password } })).status,
    ).toBe(200);
    const [signed] = await getDb().select({ minutes: signOffs.actualMinutes }).from(signOffs).where(eq(signOffs.runId, runId));
    // The cart's stamps alone add up to 400 × 20 minutes; the run was assigned a moment ago.
    expect(signed!.minutes).toBeLessThanOrEqual(2);
    expect(signed!.minutes).toBeLessThan(offlineHours * 60);
  });

  it("still folds an honest offline session that syncs late", async () => {
    const runId = await newRun();
    // Worked offline over the last half hour (after the assignment, as far as the cart knows), sent in one go.
    const offline = [
      event("value.recorded", ago(40), { stepId: stepIds[0], payload: { value: "36 lb" } }),
      event("step.checked", ago(35), { stepId: stepIds[0] }),
      event("step.checked", ago(30), { stepId: stepIds[1] }),
    ];
    expect((await send(learner.cookie, runId, offline)).status).toBe(200);
    const shown = await detail(teacher.cookie, runId);
    expect(shown.run.status).toBe("in_progress");
    expect(shown.events).toHaveLength(3);
  });
});

describe("instructors act on their own classes; authors own their cards", () => {
  it("answers 404 to another class's instructor for every run route and record, and lists nothing of it", async () => {
    const runId = await newRun();
    expect(
      (await send(learner.cookie, runId, [event("step.checked", ago(5), { stepId: stepIds[0] }), event("run.submitted", ago(4))])).status,
    ).toBe(200);
    const them = otherTeacher.cookie;
    expect((await call("GET", `/api/runs/${runId}`, { cookie: them })).status).toBe(404);
    expect((await call("GET", `/api/runs/${runId}/packet`, { cookie: them })).status).toBe(404);
    expect((await call("GET", `/api/runs/${runId}/photos/${randomUUID()}`, { cookie: them })).status).toBe(404);
    expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: them, json: { stepId: stepIds[0] } })).status).toBe(404);
    expect((await call("POST", `/api/runs/${runId}/return`, { cookie: them, json: { comment: "not mine" } })).status).toBe(404);
    expect((await call("POST", `/api/runs/${runId}/sign-off`, { cookie: them, json: { password: otherTeacher.password } })).status).toBe(
      404,
    );
    for (const format of ["", "?format=csv", "?format=pdf"]) {
      expect((await call("GET", `/api/records/students/${learner.id}${format}`, { cookie: them })).status).toBe(404);
    }
    expect((await call("GET", `/review/${runId}`, { cookie: them })).status).toBe(404);
    for (const status of ["submitted", "in_progress"]) {
      const queue = ((await (await call("GET", `/api/review?status=${status}`, { cookie: them })).json()) as { runs: WorkItemDto[] }).runs;
      expect(queue.some((r) => r.studentId === learner.id)).toBe(false);
    }
    const assignments = (
      (await (await call("GET", `/api/assignments?card=${card.id}`, { cookie: them })).json()) as { assignments: unknown[] }
    ).assignments;
    expect(assignments).toEqual([]);
    // Assigning another class's student one by one is refused like assigning a stranger.
    const refused = await call("POST", "/api/assignments", { cookie: them, json: { cardId: card.id, studentIds: [learner.id] } });
    expect(refused.status).toBe(422);
    // The class's own instructor and an admin see it all.
    expect((await call("GET", `/api/runs/${runId}`, { cookie: teacher.cookie })).status).toBe(200);
    expect((await call("GET", `/api/records/students/${learner.id}?format=csv`, { cookie: teacher.cookie })).status).toBe(200);
    expect((await call("GET", `/api/runs/${runId}`, { cookie: admin })).status).toBe(200);
    // And the other class's student reaches nothing of it either.
    expect((await call("GET", `/api/runs/${runId}`, { cookie: otherLearner.cookie })).status).toBe(404);
    expect((await call("GET", `/api/records/students/${learner.id}`, { cookie: otherLearner.cookie })).status).toBe(404);
  });

  it("reaches a run through the student's class, not through owning the card", async () => {
    const made = await call("POST", "/api/assignments", { cookie: admin, json: { cardId: card.id, studentIds: [otherLearner.id] } });
    expect(made.status).toBe(201);
    // The card's owner teaches another class and did not assign this: it stays out of reach.
    const work = ((await (await call("GET", "/api/my-work", { cookie: otherLearner.cookie })).json()) as { work: WorkItemDto[] }).work;
    const runId = work.find((w) => w.cardId === card.id)!.runId;
    expect((await call("GET", `/api/runs/${runId}`, { cookie: teacher.cookie })).status).toBe(404);
    expect((await call("GET", `/api/runs/${runId}`, { cookie: otherTeacher.cookie })).status).toBe(200);
  });

  it("lets only the owner, named co-authors and an admin change a card; others may duplicate it", async () => {
    const draft = {
      content: {
        ...card.published!,
        title: `${card.published!.title} (edited)`,
        steps: card.published!.steps.map((s) => ({
          ...s,
          references: s.references.map((r) => ({ revisionId: r.revisionId, page: r.page })),
        })),
      },
    };
    const stranger = otherTeacher.cookie;
    expect((await call("PUT", `/api/cards/${card.id}/draft`, { cookie: stranger, json: draft })).status).toBe(403);
    expect((await call("POST", `/api/cards/${card.id}/archive`, { cookie: stranger, json: { archived: true } })).status).toBe(403);
    expect((await call("POST", `/api/cards/${card.id}/publish`, { cookie: stranger })).status).toBe(403);
    expect((await call("PUT", `/api/cards/${card.id}/coauthors`, { cookie: stranger, json: { userIds: [otherTeacher.id] } })).status).toBe(
      403,
    );
    expect((await call("GET", `/api/cards/${card.id}`, { cookie: stranger })).status).toBe(200);
    expect((await call("POST", `/api/cards/${card.id}/duplicate`, { cookie: stranger })).status).toBe(201);
    // The owner names a co-author, who then may edit; a student cannot be named.
    expect((await call("PUT", `/api/cards/${card.id}/coauthors`, { cookie: teacher.cookie, json: { userIds: [learner.id] } })).status).toBe(
      422,
    );
    const named = await call("PUT", `/api/cards/${card.id}/coauthors`, { cookie: teacher.cookie, json: { userIds: [coauthor.id] } });
    expect(named.status).toBe(200);
    expect(((await named.json()) as { coauthors: { id: string }[] }).coauthors.map((c) => c.id)).toEqual([coauthor.id]);
    expect((await call("PUT", `/api/cards/${card.id}/draft`, { cookie: coauthor.cookie, json: draft })).status).toBe(200);
    const seen = ((await (await call("GET", `/api/cards/${card.id}`, { cookie: coauthor.cookie })).json()) as { card: CardDto }).card;
    expect(seen.canEdit).toBe(true);
    expect((await call("DELETE", `/api/cards/${card.id}/draft`, { cookie: admin })).status).toBe(204);
  });
});

describe("requests that cannot harm", () => {
  it("refuses state-changing requests from another site, with or without a body", async () => {
    const cross = { origin: "https://elsewhere.example", "sec-fetch-site": "cross-site" };
    const refused = await call("POST", "/api/session", { json: { email: demo.student, password: "x" }, headers: cross });
    expect(refused.status).toBe(403);
    expect(((await refused.json()) as { error: { code: string; message: string } }).error).toMatchObject({ code: "forbidden" });
    expect((await call("DELETE", "/api/session", { cookie: learner.cookie, headers: cross })).status).toBe(403);
    expect(
      (await call("POST", `/api/cards/${card.id}/duplicate`, { cookie: teacher.cookie, headers: { origin: "https://elsewhere.example" } }))
        .status,
    ).toBe(403);
    const form = new FormData();
    form.append("title", "x");
    expect(
      (await call("POST", "/api/manuals", { cookie: await signIn(demo.librarian), body: form, headers: { origin: "null" } })).status,
    ).toBe(403);
    // The app's own pages pass; so does a client that is no browser (it sends neither header).
    expect(
      (
        await call("POST", `/api/cards/${card.id}/duplicate`, {
          cookie: teacher.cookie,
          headers: { origin: baseUrl, "sec-fetch-site": "same-origin" },
        })
      ).status,
    ).toBe(201);
    expect((await call("GET", "/api/session", { cookie: learner.cookie, headers: cross })).status).toBe(200);
  });

  it("cuts off a chunked body without a length as soon as it passes the limit", async () => {
    let sent = 0;
    const chunk = new Uint8Array(64 * 1024).fill(0x20);
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent >= 200 * 1024 * 1024) return controller.close();
        sent += chunk.byteLength;
        controller.enqueue(chunk);
      },
    });
    const started = Date.now();
    const answer = await fetch(`${baseUrl}/api/session`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body,
      duplex: "half",
    } as RequestInit).catch(() => null);
    // The server answers 413 once 64 KiB have passed (the client may see the connection closed
    // instead while it is still sending); it never waits for, or keeps, the rest.
    if (answer) expect(answer.status).toBe(413);
    expect(Date.now() - started).toBeLessThan(30_000);
    expect((await call("GET", "/api/health")).status).toBe(200);
  });

  it("answers NUL, broken characters, deep nesting and broken addresses with 4xx in the usual shape", async () => {
    const shape = async (response: Response, status: number) => {
      expect(response.status).toBe(status);
      const body = (await response.json()) as { error: { code: string; message: string } };
      expect(body.error.message).toBeTypeOf("string");
    };
    await shape(await call("POST", "/api/session", { json: { email: "a\u0000@b.test", password: "x" } }), 422);
    await shape(
      await call("POST", "/api/session", {
        body: '{"email":"\\ud800@b.test","password":"x"}',
        headers: { "content-type": "application/json" },
      }),
      422,
    );
    const deep = `{"events":${"[".repeat(5000)}${"]".repeat(5000)}}`;
    const nested = await call("POST", `/api/runs/${randomUUID()}/events`, {
      cookie: learner.cookie,
      body: deep,
      headers: { "content-type": "application/json" },
    });
    expect([400, 422]).toContain(nested.status);
    const deepObject = `{"content":${'{"a":'.repeat(3000)}1${"}".repeat(3000)}}`;
    const cardBody = await call("POST", "/api/cards", {
      cookie: teacher.cookie,
      body: deepObject,
      headers: { "content-type": "application/json" },
    });
    expect([400, 422]).toContain(cardBody.status);
    await shape(await call("GET", "/api/search?q=%00", { cookie: learner.cookie }), 400);
    await shape(await call("GET", "/api/search?q=%E0%A4%A", { cookie: learner.cookie }), 400);
    const brokenId = await call("GET", "/api/manuals/%E0%A4%A", { cookie: learner.cookie });
    expect([400, 404]).toContain(brokenId.status);
    // Pages too: never a 500.
    for (const page of ["/search?q=%00", "/library/%E0%A4%A", "/cards?q=%C0%AF", "/cards/%00"]) {
      const answer = await call("GET", page, { cookie: learner.cookie });
      expect(answer.status, page).toBeGreaterThanOrEqual(400);
      expect(answer.status, page).toBeLessThan(500);
    }
    const multipart = new FormData();
    multipart.append("title", "Bad \u0000 title");
    const upload = await call("POST", "/api/manuals", { cookie: await signIn(demo.librarian), body: multipart });
    expect(upload.status).toBeLessThan(500);
  });
});

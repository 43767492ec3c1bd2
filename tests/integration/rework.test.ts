// The instructor at the aircraft, against the real server: a student calls for a buy-off from the
// cart (a queue and a mail), a run is sent back naming the steps to do again (bought-off ones too),
// an out-of-limit reading needs a note before its step counts, and the review keeps every reading.
import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, classMembers, curriculumSubjects, revisions } from "@/db/schema";
import type { CardDto } from "@/lib/contracts/cards";
import type { BuyOffCallDto, RunDetailDto, WorkItemDto } from "@/lib/contracts/runs";
import { foldRun } from "@/lib/domain/runs/fold";
import { call, makeAccount, signIn, waitForMail } from "../support/http";
import { uniqueTitle } from "../support/library";

interface Person {
  id: string;
  email: string;
  name: string;
  cookie: string;
  password: string;
}
const person = async (role: "instructor" | "student"): Promise<Person> => {
  const a = await makeAccount(role);
  return { id: a.id, email: a.email, name: a.name, cookie: await signIn(a.email, a.password), password: a.password };
};
let teacher: Person;
let learner: Person;
let stranger: Person; // an instructor of another class
let card: CardDto;
const stepIds = [randomUUID(), randomUUID(), randomUUID()];

// Each event a millisecond after the one before (and never before now): events made in one batch
// keep the order they were made in, as on a cart, instead of tying and sorting by their ids.
let tick = 0;
const nextTime = () => new Date((tick = Math.max(Date.now(), tick + 1))).toISOString();
const event = (type: string, over: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  type,
  clientTime: nextTime(),
  stepId: null,
  payload: {},
  ...over,
});
const send = (runId: string, events: unknown[]) => call("POST", `/api/runs/${runId}/events`, { cookie: learner.cookie, json: { events } });

async function detail(runId: string): Promise<RunDetailDto> {
  const answer = await call("GET", `/api/runs/${runId}`, { cookie: teacher.cookie });
  expect(answer.status).toBe(200);
  return (await answer.json()) as RunDetailDto;
}
const stateOf = (d: RunDetailDto) =>
  foldRun(
    d.events,
    d.version.steps.map((s) => ({
      id: s.id,
      inspectionPoint: s.inspectionPoint,
      measurement: s.measurement,
      timerMinutes: s.timerMinutes,
    })),
    new Set(d.reviewers),
  );
const queue = async (cookie: string) =>
  ((await (await call("GET", "/api/review/buy-offs", { cookie })).json()) as { points: BuyOffCallDto[] }).points;

async function newRun(): Promise<string> {
  const note = `Bay ${randomUUID().slice(0, 6)}`;
  const made = await call("POST", "/api/assignments", {
    cookie: teacher.cookie,
    json: { cardId: card.id, studentIds: [learner.id], note, confirmDuplicates: true },
  });
  expect(made.status).toBe(201);
  const work = ((await (await call("GET", "/api/my-work", { cookie: learner.cookie })).json()) as { work: WorkItemDto[] }).work;
  return work.find((w) => w.note === note)!.runId;
}

beforeAll(async () => {
  [teacher, learner, stranger] = [await person("instructor"), await person("student"), await person("instructor")];
  const [row] = await getDb()
    .insert(classes)
    .values({ name: uniqueTitle("Rework class") })
    .returning({ id: classes.id });
  await getDb()
    .insert(classMembers)
    .values([teacher, learner].map((p) => ({ classId: row!.id, userId: p.id })));
  const [revision] = await getDb()
    .select({ id: revisions.id })
    .from(revisions)
    .where(and(eq(revisions.status, "ready"), sql`${revisions.pageCount} >= 3`))
    .limit(1);
  const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
  const content = {
    title: uniqueTitle("Rework card"),
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
      },
      { id: stepIds[1], text: "Instructor checks the safety wire.", references: [], inspectionPoint: true },
      { id: stepIds[2], text: "Tidy the work area.", references: [] },
    ],
  };
  const created = await call("POST", "/api/cards", { cookie: teacher.cookie, json: { content } });
  expect(created.status).toBe(201);
  const id = ((await created.json()) as { card: CardDto }).card.id;
  expect((await call("POST", `/api/cards/${id}/publish`, { cookie: teacher.cookie })).status).toBe(200);
  card = ((await (await call("GET", `/api/cards/${id}`, { cookie: teacher.cookie })).json()) as { card: CardDto }).card;
});

describe("a call for a buy-off", () => {
  it("puts the inspection point in the instructor's queue, first, and mails the class's instructor", async () => {
    const runId = await newRun();
    expect(
      (
        await send(runId, [
          event("value.recorded", { stepId: stepIds[0], payload: { value: "35 lb" } }),
          event("step.checked", { stepId: stepIds[0] }),
          event("step.checked", { stepId: stepIds[1] }),
        ])
      ).status,
    ).toBe(200);
    let point = (await queue(teacher.cookie)).find((p) => p.runId === runId);
    expect(point).toMatchObject({ stepId: stepIds[1], stepNumber: 2, calledAt: null, studentName: learner.name });

    expect((await send(runId, [event("inspection.called", { stepId: stepIds[1] })])).status).toBe(200);
    const points = await queue(teacher.cookie);
    point = points.find((p) => p.runId === runId);
    expect(point?.calledAt).toBeTruthy();
    // Called ones come before the ones only done.
    const firstUncalled = points.findIndex((p) => !p.calledAt);
    expect(points.slice(firstUncalled === -1 ? points.length : firstUncalled).every((p) => !p.calledAt)).toBe(true);
    const mail = await waitForMail(teacher.email, /waiting for a buy-off: step 2/);
    expect(mail.text).toContain(learner.name);
    expect(mail.text).toContain("/review?tab=buy-offs");

    // Another class's instructor does not see it; a student cannot read the queue.
    expect((await queue(stranger.cookie)).some((p) => p.runId === runId)).toBe(false);
    expect((await call("GET", "/api/review/buy-offs", { cookie: learner.cookie })).status).toBe(403);

    // Bought off, it leaves the queue.
    expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: teacher.cookie, json: { stepId: stepIds[1] } })).status).toBe(200);
    expect((await queue(teacher.cookie)).some((p) => p.runId === runId)).toBe(false);
  });
});

describe("rework and readings", () => {
  it("needs a note before an out-of-limit step counts, reopens the named steps, and keeps every reading", async () => {
    const runId = await newRun();
    await send(runId, [
      event("value.recorded", { stepId: stepIds[0], payload: { value: "44 lb" } }),
      event("step.checked", { stepId: stepIds[0] }),
    ]);
    let state = stateOf(await detail(runId));
    expect(state.steps[stepIds[0]!]!.checked).toBe(false);
    expect(state.ignored.at(-1)?.reason).toMatch(/out of limits/);

    await send(runId, [
      event("note.added", { stepId: stepIds[0], payload: { text: "Reads high: turnbuckle was over-tightened. Told the instructor." } }),
      event("step.checked", { stepId: stepIds[0] }),
      event("step.checked", { stepId: stepIds[1] }),
    ]);
    expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: teacher.cookie, json: { stepId: stepIds[1] } })).status).toBe(200);
    await send(runId, [event("step.checked", { stepId: stepIds[2] }), event("run.submitted")]);
    // Out of limits with a note counts as done; the instructor judges it and sends it back.
    const badStep = await call("POST", `/api/runs/${runId}/return`, {
      cookie: teacher.cookie,
      json: { comment: "Adjust and measure again.", reopenStepIds: [randomUUID()] },
    });
    expect(badStep.status).toBe(422);
    const sent = await call("POST", `/api/runs/${runId}/return`, {
      cookie: teacher.cookie,
      json: { comment: "Adjust the tension and measure again; I will check the wire again.", reopenStepIds: [stepIds[0], stepIds[1]] },
    });
    expect(sent.status).toBe(200);
    state = stateOf(await detail(runId));
    expect(state.status).toBe("returned");
    expect(state.steps[stepIds[0]!]).toMatchObject({ checked: false, value: null });
    expect(state.steps[stepIds[1]!]).toMatchObject({ checked: false, boughtOff: null });
    expect(state.steps[stepIds[2]!]!.checked).toBe(true);

    // The second attempt: a reading in limits, the wire again, a new buy-off, signed off with the password.
    await send(runId, [
      event("value.recorded", { stepId: stepIds[0], payload: { value: "36 lb" } }),
      event("step.checked", { stepId: stepIds[0] }),
      event("step.checked", { stepId: stepIds[1] }),
      event("inspection.called", { stepId: stepIds[1] }),
    ]);
    expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: teacher.cookie, json: { stepId: stepIds[1] } })).status).toBe(200);
    await send(runId, [event("run.submitted")]);
    const signed = await call("POST", `/api/runs/${runId}/sign-off`, { cookie: teacher.cookie, json: { password: teacher.password } });
    expect(signed.status).toBe(200);
    state = stateOf(await detail(runId));
    expect(state.steps[stepIds[0]!]!.readings.map((r) => [r.text, r.judgement.status])).toEqual([
      ["44 lb", "out"],
      ["36 lb", "in"],
    ]);

    // The review page shows both readings, the out-of-limit one marked.
    const page = await (await call("GET", `/review/${runId}`, { cookie: teacher.cookie })).text();
    expect(page).toContain("Every reading of this step");
    expect(page).toContain("44 lb");
    expect(page).toContain("OUT OF LIMITS");
  });
});

describe("moving open work to a new card version", () => {
  it("keeps work on unchanged steps, restarts changed ones, and only for the instructor's own students", async () => {
    const ids = [randomUUID(), randomUUID(), randomUUID()];
    const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
    const content = {
      title: uniqueTitle("Move card"),
      applicability: [],
      ataChapter: "32",
      subjectId: subject!.id,
      estimatedMinutes: 20,
      steps: [
        { id: ids[0], text: "Chock the wheels.", references: [] },
        {
          id: ids[1],
          text: "Measure the tyre pressure.",
          references: [],
          measurement: { label: "Pressure", unit: "psi", min: 30, max: 34 },
        },
        { id: ids[2], text: "Fit the valve cap.", references: [] },
      ],
    };
    const made = await call("POST", "/api/cards", { cookie: teacher.cookie, json: { content } });
    const cardId = ((await made.json()) as { card: CardDto }).card.id;
    expect((await call("POST", `/api/cards/${cardId}/publish`, { cookie: teacher.cookie })).status).toBe(200);
    const note = `Move ${randomUUID().slice(0, 6)}`;
    expect(
      (
        await call("POST", "/api/assignments", {
          cookie: teacher.cookie,
          json: { cardId, studentIds: [learner.id], note, confirmDuplicates: true },
        })
      ).status,
    ).toBe(201);
    const work = ((await (await call("GET", "/api/my-work", { cookie: learner.cookie })).json()) as { work: WorkItemDto[] }).work;
    const runId = work.find((w) => w.note === note)!.runId;
    const before = new Date(Date.now() - 60_000).toISOString();
    await send(runId, [
      event("step.checked", { stepId: ids[0] }),
      event("value.recorded", { stepId: ids[1], payload: { value: "32 psi" } }),
      event("step.checked", { stepId: ids[1] }),
    ]);

    // Version 2: the limits of step 2 change and a step is added.
    const v2 = {
      ...content,
      steps: [
        content.steps[0],
        { ...content.steps[1], measurement: { label: "Pressure", unit: "psi", min: 40, max: 44 } },
        content.steps[2],
        { id: randomUUID(), text: "Record the pressure in the log.", references: [] },
      ],
    };
    expect((await call("PUT", `/api/cards/${cardId}/draft`, { cookie: teacher.cookie, json: { content: v2 } })).status).toBe(200);
    expect((await call("POST", `/api/cards/${cardId}/publish`, { cookie: teacher.cookie })).status).toBe(200);

    const listed = (await (await call("GET", `/api/cards/${cardId}/runs-to-move`, { cookie: teacher.cookie })).json()) as {
      target: number;
      runs: { runId: string; restartSteps: number[]; addedSteps: number[]; keptSteps: number }[];
    };
    expect(listed.target).toBe(2);
    expect(listed.runs.find((r) => r.runId === runId)).toMatchObject({ restartSteps: [2], addedSteps: [4], keptSteps: 2 });
    const strangers = (await (await call("GET", `/api/cards/${cardId}/runs-to-move`, { cookie: stranger.cookie })).json()) as {
      runs: unknown[];
    };
    expect(strangers.runs).toHaveLength(0);
    expect((await call("POST", `/api/cards/${cardId}/move-runs`, { cookie: stranger.cookie, json: { runIds: [runId] } })).status).toBe(404);
    expect((await call("POST", `/api/cards/${cardId}/move-runs`, { cookie: learner.cookie, json: { runIds: [runId] } })).status).toBe(403);

    const moved = await call("POST", `/api/cards/${cardId}/move-runs`, { cookie: teacher.cookie, json: { runIds: [runId] } });
    expect(moved.status).toBe(200);
    expect(await moved.json()).toMatchObject({ version: 2, moved: [{ runId, restartSteps: [2] }] });
    expect((await call("POST", `/api/cards/${cardId}/move-runs`, { cookie: teacher.cookie, json: { runIds: [runId] } })).status).toBe(409);

    // Offline work on the old step 2, stamped before the move and sent after it, does not count on the new one.
    await send(runId, [event("step.checked", { stepId: ids[1], clientTime: before })]);
    const d = await detail(runId);
    expect(d.version.number).toBe(2);
    const state = stateOf(d);
    expect(state.steps[ids[0]!]!.checked).toBe(true);
    expect(state.steps[ids[1]!]).toMatchObject({ checked: false, value: null, reopened: { why: "new version" } });
    expect(state.ignored.at(-1)?.reason).toMatch(/earlier card version/);
    expect(d.version.steps).toHaveLength(4);
  });
});

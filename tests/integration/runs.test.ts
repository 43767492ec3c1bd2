// Assignments, runs and sign-off through the API against the real server and database: who sees
// which run, events stored once whatever is re-sent, the review flow (buy-off, return, sign-off),
// a sign-off nothing can change (in the API and in the database), the offline packet, photos and
// the records.
import { randomUUID } from "node:crypto";
import { execFile } from "node:child_process";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { and, eq, sql } from "drizzle-orm";
import { PDFDocument } from "pdf-lib";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { auditEvents, curriculumSubjects, revisions, runEvents, signOffs } from "@/db/schema";
import type { CardDto } from "@/lib/contracts/cards";
import type { RunDetailDto, StudentRecordDto, WorkItemDto } from "@/lib/contracts/runs";
import { call, demo, makeAccount, signIn } from "../support/http";
import { uniqueTitle } from "../support/library";

/** A due date a week ahead, whenever the tests run (a past one is refused). */
const soon = new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);

const exec = promisify(execFile);

let instructor: string;
let instructorPassword: string;
let admin: string;
let librarian: string;
const students: { id: string; cookie: string }[] = [];
let revisionId: string;
let subjectName: string;
let card: CardDto;
const stepIds = [randomUUID(), randomUUID(), randomUUID()];

// Cart clocks: the work happened during the last hour, the fixes after the instructor's return.
const hourAgo = Date.now() - 3_600_000;
const at = (minute: number) => new Date(hourAgo + minute * 60_000).toISOString();
const event = (type: string, over: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  type,
  clientTime: at(0),
  stepId: null,
  payload: {},
  ...over,
});

async function assign(json: Record<string, unknown>, cookie = instructor) {
  return call("POST", "/api/assignments", { cookie, json: { cardId: card.id, confirmDuplicates: true, ...json } });
}

async function myWork(cookie: string) {
  const answer = await call("GET", "/api/my-work", { cookie });
  expect(answer.status).toBe(200);
  return ((await answer.json()) as { work: WorkItemDto[] }).work;
}

async function runOf(cookie: string, runId: string) {
  const answer = await call("GET", `/api/runs/${runId}`, { cookie });
  expect(answer.status).toBe(200);
  return (await answer.json()) as RunDetailDto;
}

const send = (cookie: string, runId: string, events: unknown[]) => call("POST", `/api/runs/${runId}/events`, { cookie, json: { events } });

async function newRun(): Promise<string> {
  const answer = await assign({ studentIds: [students[0]!.id], dueOn: soon, note: "Bay 2, HT-20 trainer" });
  expect(answer.status).toBe(201);
  const work = await myWork(students[0]!.cookie);
  return work.find((w) => w.status === "not_started" && w.note === "Bay 2, HT-20 trainer")!.runId;
}

beforeAll(async () => {
  const account = async (role: "instructor" | "student" | "librarian") => {
    const a = await makeAccount(role);
    return { id: a.id, cookie: await signIn(a.email, a.password), password: a.password };
  };
  const teacher = await account("instructor");
  instructor = teacher.cookie;
  instructorPassword = teacher.password;
  librarian = (await account("librarian")).cookie;
  students.push(await account("student"), await account("student"));
  admin = await signIn(demo.admin);
  // The instructor reviews the students of their own classes only (lib/server/runs/scope.ts).
  const ownClass = await call("POST", "/api/classes", { cookie: admin, json: { name: uniqueTitle("Runs home class") } });
  const ownClassId = ((await ownClass.json()) as { class: { id: string } }).class.id;
  await call("POST", `/api/classes/${ownClassId}/members`, {
    cookie: admin,
    json: { userIds: [teacher.id, ...students.map((s) => s.id)] },
  });
  const [revision] = await getDb()
    .select({ id: revisions.id })
    .from(revisions)
    .where(and(eq(revisions.status, "ready"), sql`${revisions.pageCount} >= 6`))
    .limit(1);
  revisionId = revision!.id;
  const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
  subjectName = subject!.name;
  const content = {
    title: uniqueTitle("Run test card"),
    applicability: ["HT-20"],
    ataChapter: "27",
    subjectId: subject!.id,
    estimatedMinutes: 45,
    steps: [
      {
        id: stepIds[0],
        text: "Measure the cable tension.",
        references: [
          { revisionId, page: 5 },
          { revisionId, page: 2 },
        ],
        measurement: { label: "Tension", unit: "lb", min: 30, max: 40 },
      },
      { id: stepIds[1], text: "Instructor checks the safety wire.", inspectionPoint: true, references: [{ revisionId, page: 5 }] },
      { id: stepIds[2], text: "Let the sealant cure.", timerMinutes: 1 },
    ],
  };
  const created = await call("POST", "/api/cards", { cookie: instructor, json: { content } });
  expect(created.status).toBe(201);
  const id = ((await created.json()) as { card: CardDto }).card.id;
  expect((await call("POST", `/api/cards/${id}/publish`, { cookie: instructor })).status).toBe(200);
  card = ((await (await call("GET", `/api/cards/${id}`, { cookie: instructor })).json()) as { card: CardDto }).card;
});

describe("assigning", () => {
  it("refuses what cannot be assigned, with the field named", async () => {
    const nobody = await assign({});
    expect(nobody.status).toBe(422);
    expect(((await nobody.json()) as { error: { fields: Record<string, string> } }).error.fields.classId).toMatch(
      /class or at least one student/,
    );
    const teacher = await makeAccount("instructor");
    const notStudent = await assign({ studentIds: [teacher.id] });
    expect(notStudent.status).toBe(422);
    expect((await assign({ studentIds: [students[0]!.id], dueOn: "18/12/2026" })).status).toBe(422);
    expect((await assign({ studentIds: [students[0]!.id], versionNumber: 7 })).status).toBe(422);
    expect(
      (await call("POST", "/api/assignments", { cookie: instructor, json: { cardId: randomUUID(), studentIds: [students[0]!.id] } }))
        .status,
    ).toBe(422);
    // An instructor cannot assign to a class they are not in, and learns nothing of it.
    const klass = await call("POST", "/api/classes", {
      cookie: admin,
      json: { name: uniqueTitle("Run class"), startsOn: "2026-09-01", endsOn: "2027-06-30" },
    });
    const classId = ((await klass.json()) as { class: { id: string } }).class.id;
    expect((await assign({ classId })).status).toBe(422);
    expect(
      (await call("POST", "/api/assignments", { cookie: students[0]!.cookie, json: { cardId: card.id, studentIds: [students[0]!.id] } }))
        .status,
    ).toBe(403);
  });

  it("gives a class's students a run each, and shows each student only their own work", async () => {
    const klass = await call("POST", "/api/classes", {
      cookie: admin,
      json: { name: uniqueTitle("Run class"), startsOn: "2026-09-01", endsOn: "2027-06-30" },
    });
    const classId = ((await klass.json()) as { class: { id: string } }).class.id;
    expect(
      (await call("POST", `/api/classes/${classId}/members`, { cookie: admin, json: { userIds: students.map((s) => s.id) } })).status,
    ).toBe(200);
    // A past due date is refused; one that has passed since the assignment makes the run overdue.
    const past = new Date(Date.now() - 3 * 86_400_000).toISOString().slice(0, 10);
    const refused = await assign({ classId, dueOn: past }, admin);
    expect(refused.status).toBe(422);
    expect(((await refused.json()) as { error: { fields: Record<string, string> } }).error.fields.dueOn).toBe(
      "A due date cannot be in the past.",
    );
    const made = await assign({ classId, dueOn: soon }, admin);
    expect(made.status).toBe(201);
    const madeAssignment = ((await made.json()) as { assignment: { id: string; runs: number } }).assignment;
    expect(madeAssignment.runs).toBe(2);
    await getDb().execute(sql`update assignments set due_on = '2026-01-05' where id = ${madeAssignment.id}`);
    const mine = await myWork(students[0]!.cookie);
    const theirs = await myWork(students[1]!.cookie);
    const item = mine.find((w) => w.cardId === card.id && w.dueOn === "2026-01-05")!;
    expect(item.workStatus).toBe("overdue");
    expect(item.versionNumber).toBe(1);
    expect(theirs.some((w) => w.runId === item.runId)).toBe(false);
    // Another student's run is not found, not forbidden: its existence is not shown either.
    expect((await call("GET", `/api/runs/${item.runId}`, { cookie: students[1]!.cookie })).status).toBe(404);
    expect((await call("GET", `/api/runs/${item.runId}`, { cookie: librarian })).status).toBe(404);
    expect((await send(students[1]!.cookie, item.runId, [event("step.checked", { stepId: stepIds[0] })])).status).toBe(404);
    const audit = await getDb()
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.action, "assignment.created"), eq(auditEvents.actorId, await me(admin))));
    expect(audit.length).toBeGreaterThan(0);
  });
});

async function me(cookie: string) {
  const answer = await call("GET", "/api/session", { cookie });
  return ((await answer.json()) as { user: { id: string } }).user.id;
}

describe("events from the cart", () => {
  it("stores a batch once, however often and however concurrently it is sent", async () => {
    const runId = await newRun();
    const cookie = students[0]!.cookie;
    const batch = [
      event("step.checked", { stepId: stepIds[0], clientTime: at(1) }),
      event("value.recorded", { stepId: stepIds[0], clientTime: at(2), payload: { value: "42 lb" } }),
      event("value.recorded", { stepId: stepIds[0], clientTime: at(3), payload: { value: "35" } }),
      event("note.added", { stepId: stepIds[0], clientTime: at(4), payload: { text: "Turnbuckle at station 3 re-safetied" } }),
    ];
    const first = await send(cookie, runId, batch);
    expect(first.status).toBe(200);
    expect(await first.json()).toMatchObject({ stored: 4, duplicates: 0, status: "in_progress" });
    const again = await send(cookie, runId, batch);
    expect(await again.json()).toMatchObject({ stored: 0, duplicates: 4 });
    // Five carts' worth of retries at once: the run's row lock makes exactly one of them store.
    const more = [
      event("step.checked", { stepId: stepIds[1], clientTime: at(5) }),
      event("timer.started", { stepId: stepIds[2], clientTime: at(6), payload: { minutes: 1 } }),
    ];
    const answers = await Promise.all(Array.from({ length: 5 }, () => send(cookie, runId, [...batch, ...more])));
    const stored = await Promise.all(answers.map(async (a) => ((await a.json()) as { stored: number }).stored));
    expect(stored.reduce((a, b) => a + b, 0)).toBe(2);
    const [{ n }] = (await getDb().execute(sql`select count(*)::int as n from run_events where run_id = ${runId}`)).rows as [{ n: number }];
    expect(n).toBe(6);
    const detail = await runOf(cookie, runId);
    expect(detail.events.map((e) => e.type)).toEqual([
      "step.checked",
      "value.recorded",
      "value.recorded",
      "note.added",
      "step.checked",
      "timer.started",
    ]);
    expect(detail.packet!.pages.map((p) => [p.page, p.packetPage])).toEqual([
      [5, 1],
      [2, 2],
    ]);
    expect(detail.version.number).toBe(1);
  });

  it("refuses bad batches with the reason", async () => {
    const runId = await newRun();
    const cookie = students[0]!.cookie;
    const status = async (events: unknown) => (await call("POST", `/api/runs/${runId}/events`, { cookie, json: { events } })).status;
    expect(await status([])).toBe(422);
    expect(await status([event("step.checked", { clientTime: "yesterday" })])).toBe(422);
    expect(await status([event("step.checked", { id: "not-a-uuid" })])).toBe(422);
    expect(await status([event("run.signed_off")])).toBe(422);
    expect(await status([event("launch.missiles")])).toBe(422);
    expect(await status([event("note.added", { payload: { text: "x".repeat(5000) } })])).toBe(422);
    expect(await status(Array.from({ length: 501 }, () => event("step.checked", { stepId: stepIds[0] })))).toBe(422);
    expect(await status("nope")).toBe(422);
    const plain = await call("POST", `/api/runs/${runId}/events`, { cookie, body: "events", headers: { "content-type": "text/plain" } });
    expect(plain.status).toBe(415);
    // Buy-offs come only from the review route, never from a cart (not even an instructor's).
    expect(await status([event("inspection.bought_off", { stepId: stepIds[1] })])).toBe(422);
    expect((await send(instructor, runId, [event("inspection.bought_off", { stepId: stepIds[1] })])).status).toBe(422);
    // A clock far off would sort the run's events around the review; a NUL cannot be stored.
    expect(await status([event("step.checked", { clientTime: "0001-01-01T00:00:00Z" })])).toBe(422);
    expect(await status([event("step.checked", { clientTime: "9999-12-31T23:59:59-14:00" })])).toBe(422);
    expect(await status([event("note.added", { payload: { text: "bad \u0000 byte" } })])).toBe(422);
    // An instructor cannot check a student's steps.
    expect((await send(instructor, runId, [event("step.checked", { stepId: stepIds[0] })])).status).toBe(403);
    const [{ n }] = (await getDb().execute(sql`select count(*)::int as n from run_events where run_id = ${runId}`)).rows as [{ n: number }];
    expect(n).toBe(0);
  });
});

describe("review and sign-off", () => {
  it("returns, takes the fix, buys off, signs off once, and the record shows it", async () => {
    const runId = await newRun();
    const cookie = students[0]!.cookie;
    const work = [
      event("step.checked", { stepId: stepIds[0], clientTime: at(1) }),
      event("value.recorded", { stepId: stepIds[0], clientTime: at(2), payload: { value: "44 lb" } }),
      event("step.checked", { stepId: stepIds[1], clientTime: at(10) }),
      event("step.checked", { stepId: stepIds[2], clientTime: at(15) }),
      event("run.submitted", { clientTime: at(16) }),
    ];
    expect((await send(cookie, runId, work)).status).toBe(200);
    const queue = ((await (await call("GET", "/api/review", { cookie: instructor })).json()) as { runs: WorkItemDto[] }).runs;
    expect(queue.some((r) => r.runId === runId)).toBe(true);
    expect((await call("GET", "/api/review", { cookie })).status).toBe(403);

    const early = await call("POST", `/api/runs/${runId}/sign-off`, { cookie: instructor, json: { password: instructorPassword } });
    expect(early.status).toBe(422);
    expect(((await early.json()) as { error: { message: string } }).error.message).toMatch(/inspection point at step 2/);
    expect((await call("POST", `/api/runs/${runId}/return`, { cookie: instructor, json: { comment: "" } })).status).toBe(422);
    expect((await call("POST", `/api/runs/${runId}/return`, { cookie, json: { comment: "x" } })).status).toBe(403);
    expect(
      (
        await call("POST", `/api/runs/${runId}/return`, {
          cookie: instructor,
          json: { comment: "44 lb is out of limits. Adjust and measure again." },
        })
      ).status,
    ).toBe(200);
    let detail = await runOf(cookie, runId);
    expect(detail.run.status).toBe("returned");
    expect(detail.events.at(-1)).toMatchObject({
      type: "run.returned",
      payload: { comment: "44 lb is out of limits. Adjust and measure again." },
    });

    expect(
      (
        await send(cookie, runId, [
          event("value.recorded", {
            stepId: stepIds[0],
            clientTime: new Date(Date.now() + 1000).toISOString(),
            payload: { value: "36 lb" },
          }),
          event("run.submitted", { clientTime: new Date(Date.now() + 2000).toISOString() }),
        ])
      ).status,
    ).toBe(200);
    expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: instructor, json: { stepId: stepIds[0] } })).status).toBe(422);
    expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: instructor, json: { stepId: stepIds[1] } })).status).toBe(200);
    expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: instructor, json: { stepId: stepIds[1] } })).status).toBe(409);
    // A sign-off is permanent: without the instructor's own password typed again, nothing is signed.
    const noPassword = await call("POST", `/api/runs/${runId}/sign-off`, { cookie: instructor, json: { comment: "Good work." } });
    expect(noPassword.status).toBe(422);
    expect(((await noPassword.json()) as { error: { fields: Record<string, string> } }).error.fields.password).toBeTruthy();
    const wrong = await call("POST", `/api/runs/${runId}/sign-off`, { cookie: instructor, json: { password: "guess", comment: "x" } });
    expect(wrong.status).toBe(422);
    expect((await runOf(cookie, runId)).run.status).toBe("submitted");
    const signed = await call("POST", `/api/runs/${runId}/sign-off`, {
      cookie: instructor,
      json: { comment: "Good work.", password: instructorPassword },
    });
    expect(signed.status).toBe(200);
    expect((await call("POST", `/api/runs/${runId}/sign-off`, { cookie: instructor, json: { password: instructorPassword } })).status).toBe(
      409,
    );
    expect((await call("POST", `/api/runs/${runId}/return`, { cookie: instructor, json: { comment: "again" } })).status).toBe(409);

    // After sign-off: a new event is refused; a re-send of what was stored is answered calmly.
    const late = await send(cookie, runId, [event("note.added", { stepId: stepIds[0], payload: { text: "late" } })]);
    expect(late.status).toBe(409);
    const resend = await send(cookie, runId, work);
    expect(resend.status).toBe(200);
    expect(await resend.json()).toMatchObject({ stored: 0, duplicates: 5, status: "signed_off" });

    detail = await runOf(cookie, runId);
    expect(detail.signOff).toMatchObject({ versionNumber: 1, comment: "Good work.", revisionsCited: [{ revisionId, pages: [2, 5] }] });
    const audit = await getDb()
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.action, "run.signed_off"), eq(auditEvents.subjectId, runId)));
    expect(audit).toHaveLength(1);

    // The database itself keeps the sign-off and the events as they are.
    await expect(getDb().update(signOffs).set({ comment: "changed" }).where(eq(signOffs.runId, runId))).rejects.toMatchObject({
      cause: { code: "HLF02" },
    });
    await expect(getDb().delete(signOffs).where(eq(signOffs.runId, runId))).rejects.toMatchObject({ cause: { code: "HLF02" } });
    await expect(getDb().delete(runEvents).where(eq(runEvents.runId, runId))).rejects.toMatchObject({ cause: { code: "HLF02" } });
    const [someone] = detail.events;
    await expect(
      getDb().insert(runEvents).values({ id: randomUUID(), runId, userId: someone!.userId, type: "note.added", clientTime: new Date() }),
    ).rejects.toMatchObject({ cause: { code: "HLF03" } });

    const record = (await (await call("GET", `/api/records/students/${students[0]!.id}`, { cookie })).json()) as StudentRecordDto;
    const subject = record.subjects.find((s) => s.subjectName === subjectName)!;
    expect(subject.signedOff.some((c) => c.runId === runId && c.versionNumber === 1 && c.estimatedMinutes === 45)).toBe(true);
    expect(record.totals.signedOff).toBeGreaterThanOrEqual(1);
    expect((await call("GET", `/api/records/students/${students[0]!.id}`, { cookie: students[1]!.cookie })).status).toBe(404);
    expect((await call("GET", `/api/records/students/${students[0]!.id}`, { cookie: instructor })).status).toBe(200);
    const csv = await call("GET", `/api/records/students/${students[0]!.id}?format=csv`, { cookie });
    expect(csv.headers.get("content-type")).toMatch(/text\/csv/);
    const text = await csv.text();
    expect(text.split("\r\n")[0]).toBe(
      "Student,Subject,Task card,Version,Revisions cited,Signed off (UTC),Instructor,Estimated hours,Actual hours,Step,Measured,Value,Limit,Verdict,Tool",
    );
    expect(text).toContain(card.published!.title);
    const pdf = await call("GET", `/api/records/students/${students[0]!.id}?format=pdf`, { cookie });
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    expect(await pdfText(new Uint8Array(await pdf.arrayBuffer()))).toContain(card.published!.title);
  });

  it("keeps a run on its pinned version when a newer one is published, and says so", async () => {
    const runId = await newRun();
    const draft = await call("PUT", `/api/cards/${card.id}/draft`, {
      cookie: instructor,
      json: { content: { ...contentOf(card), estimatedMinutes: 50 } },
    });
    expect(draft.status).toBe(200);
    expect((await call("POST", `/api/cards/${card.id}/publish`, { cookie: instructor })).status).toBe(200);
    const item = (await myWork(students[0]!.cookie)).find((w) => w.runId === runId)!;
    expect(item.versionNumber).toBe(1);
    expect(item.newerVersion).toBe(2);
    expect((await runOf(students[0]!.cookie, runId)).version.estimatedMinutes).toBe(45);
  });
});

function contentOf(c: CardDto) {
  const v = c.published!;
  return {
    title: v.title,
    applicability: v.applicability,
    ataChapter: v.ataChapter,
    subjectId: v.subjectId,
    estimatedMinutes: v.estimatedMinutes,
    steps: v.steps.map((s) => ({
      ...s,
      references: s.references.map((r) => ({ revisionId: r.revisionId, page: r.page, quote: r.quote })),
      underRecheck: undefined,
    })),
  };
}

async function pdfText(bytes: Uint8Array): Promise<string> {
  const dir = await mkdtemp(path.join(tmpdir(), "hl-runs-"));
  try {
    const file = path.join(dir, "a.pdf");
    await writeFile(file, bytes);
    return (await exec("pdftotext", ["-layout", file, "-"])).stdout;
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

describe("the offline packet and photos", () => {
  it("holds exactly the cited pages, in the order the steps cite them", async () => {
    const runId = await newRun();
    const answer = await call("GET", `/api/runs/${runId}/packet`, { cookie: students[0]!.cookie });
    expect(answer.status).toBe(200);
    const bytes = new Uint8Array(await answer.arrayBuffer());
    expect((await PDFDocument.load(bytes)).getPageCount()).toBe(2);
    const [page5] = (await getDb().execute(sql`select text from pages where revision_id = ${revisionId} and page_number = 5`)).rows as [
      { text: string },
    ];
    const firstWords = page5.text
      .split(/\s+/)
      .filter((w) => w.length > 5)
      .slice(0, 3);
    const text = (await pdfText(bytes)).split("\f")[0]!;
    for (const w of firstWords) expect(text).toContain(w);
    expect((await call("GET", `/api/runs/${runId}/packet`, { cookie: students[1]!.cookie })).status).toBe(404);
  });

  it("takes pictures only, within the size limit, once per id", async () => {
    const runId = await newRun();
    const cookie = students[0]!.cookie;
    const png = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR4nGNgYGD4DwABBAEAwS2OUAAAAABJRU5ErkJggg==", "base64");
    const photoId = randomUUID();
    const put = (id: string, body: Uint8Array, type = "image/png", who = cookie) =>
      call("PUT", `/api/runs/${runId}/photos/${id}?step=${stepIds[0]}`, {
        cookie: who,
        body: Buffer.from(body),
        headers: { "content-type": type },
      });
    expect((await put(photoId, png)).status).toBe(201);
    expect((await put(photoId, png)).status).toBe(201);
    expect((await put(randomUUID(), Buffer.from("<svg onload=alert(1)>"), "image/png")).status).toBe(415);
    expect((await put(randomUUID(), new Uint8Array(0))).status).toBe(422);
    expect((await put(randomUUID(), new Uint8Array(8 * 1024 * 1024 + 1))).status).toBe(413);
    expect((await put(randomUUID(), png, "image/png", students[1]!.cookie)).status).toBe(404);
    const got = await call("GET", `/api/runs/${runId}/photos/${photoId}`, { cookie: instructor });
    expect(got.headers.get("content-type")).toBe("image/png");
    expect(Buffer.from(await got.arrayBuffer()).equals(png)).toBe(true);
    expect((await runOf(cookie, runId)).photos).toHaveLength(1);
  });
});

describe("keep on carts and the audit log's filters", () => {
  it("lists a kept manual's current file for the cart, and only while it is kept", async () => {
    const runId = await newRun();
    const [row] = await getDb().select({ manualId: revisions.manualId }).from(revisions).where(eq(revisions.id, revisionId));
    expect((await call("PUT", `/api/manuals/${row!.manualId}/carts`, { cookie: librarian, json: { keepOnCarts: "yes" } })).status).toBe(
      422,
    );
    expect((await call("PUT", `/api/manuals/${row!.manualId}/carts`, { cookie: instructor, json: { keepOnCarts: true } })).status).toBe(
      403,
    );
    expect((await call("PUT", `/api/manuals/${row!.manualId}/carts`, { cookie: librarian, json: { keepOnCarts: true } })).status).toBe(200);
    try {
      expect((await runOf(students[0]!.cookie, runId)).keepOnCarts).toEqual([
        expect.objectContaining({ revisionId, url: `/api/revisions/${revisionId}/file` }),
      ]);
    } finally {
      expect((await call("PUT", `/api/manuals/${row!.manualId}/carts`, { cookie: librarian, json: { keepOnCarts: false } })).status).toBe(
        200,
      );
    }
    expect((await runOf(students[0]!.cookie, runId)).keepOnCarts).toEqual([]);
  });

  it("filters the audit log by kind, person and date", async () => {
    const get = async (query: string) =>
      (
        (await (await call("GET", `/api/audit?${query}`, { cookie: admin })).json()) as {
          events: { action: string; actorName: string | null; createdAt: string }[];
        }
      ).events;
    const runsOnly = await get("kind=runs&limit=50");
    expect(runsOnly.length).toBeGreaterThan(0);
    expect(runsOnly.every((e) => e.action.startsWith("run."))).toBe(true);
    const assignmentsOnly = await get("kind=assignments");
    expect(assignmentsOnly.every((e) => e.action === "assignment.created")).toBe(true);
    const byName = await get("actor=Test%20instructor&kind=runs");
    expect(byName.length).toBeGreaterThan(0);
    expect(byName.every((e) => e.actorName === "Test instructor")).toBe(true);
    expect(await get("actor=%25")).toEqual([]); // a typed % is a character, not a wildcard
    expect(await get("from=2000-01-01&to=2000-01-02")).toEqual([]);
    const today = new Date().toISOString().slice(0, 10);
    expect((await get(`from=${today}&to=${today}&kind=runs`)).length).toBeGreaterThan(0);
    // Unreadable filters are ignored, not errors.
    expect((await call("GET", "/api/audit?kind=everything&from=yesterday", { cookie: admin })).status).toBe(200);
  });
});

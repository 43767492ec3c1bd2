// A signed-off run as the records and the audit log tell it, against the real server: the record
// (JSON, CSV and PDF) carries the card's version, the manual revision cited, each measured value with
// its limit and verdict, the instructor and the sign-off time; the audit log says it in plain words.
import { randomUUID } from "node:crypto";
import { execFile } from "node:child_process";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { and, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, classMembers, curriculumSubjects, manuals, revisions, signOffs } from "@/db/schema";
import type { CardDto } from "@/lib/contracts/cards";
import type { StudentRecordDto, WorkItemDto } from "@/lib/contracts/runs";
import { call, demo, makeAccount, signIn } from "../support/http";
import { uniqueTitle } from "../support/library";
import { signedAtText } from "@/lib/domain/runs/record-csv";

const schoolZone = "America/Chicago";

const exec = promisify(execFile);

interface Person {
  id: string;
  email: string;
  name: string;
  cookie: string;
  password: string;
}
const person = async (role: "instructor" | "student", name: string): Promise<Person> => {
  const a = await makeAccount(role, name);
  return { id: a.id, email: a.email, name: a.name, cookie: await signIn(a.email, a.password), password: a.password };
};

let teacher: Person;
let learner: Person;
let admin: string;
let title: string;
let revision: { id: string; label: string; manualTitle: string };
let runId: string;
let signedAt: string;
const stepIds = [randomUUID(), randomUUID(), randomUUID()];

// The cart's clock: the work happened during the last hour, one event a minute.
const hourAgo = Date.now() - 3_600_000;
const event = (minute: number, type: string, over: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  type,
  clientTime: new Date(hourAgo + minute * 60_000).toISOString(),
  stepId: null,
  payload: {},
  ...over,
});

async function pdfText(bytes: Uint8Array): Promise<string> {
  const dir = await mkdtemp(path.join(tmpdir(), "hl-records-"));
  try {
    const file = path.join(dir, "a.pdf");
    await writeFile(file, bytes);
    return (await exec("pdftotext", [file, "-"])).stdout;
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** The words a page shows: scripts (the React payload) and tags dropped, entities read. */
function visibleText(html: string): string {
  return html
    .replace(/<script[\s\S]*?<\/script>/g, " ")
    .replace(/<!--[\s\S]*?-->/g, "")
    .replace(/<[^>]+>/g, " ")
    .replace(/&#x27;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, "&")
    .replace(/\s+/g, " ");
}

beforeAll(async () => {
  const tag = randomUUID().slice(0, 6);
  teacher = await person("instructor", `Instructor ${tag}`);
  learner = await person("student", `Student ${tag}`);
  admin = await signIn(demo.admin);
  const [klass] = await getDb()
    .insert(classes)
    .values({ name: uniqueTitle("Records class") })
    .returning({ id: classes.id });
  await getDb()
    .insert(classMembers)
    .values([teacher, learner].map((p) => ({ classId: klass!.id, userId: p.id })));
  const [found] = await getDb()
    .select({ id: revisions.id, label: revisions.label, manualTitle: manuals.title })
    .from(revisions)
    .innerJoin(manuals, eq(manuals.id, revisions.manualId))
    .where(and(eq(revisions.status, "ready"), sql`${revisions.pageCount} >= 6`))
    .limit(1);
  revision = found!;
  const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
  title = uniqueTitle("Records card");
  const content = {
    title,
    applicability: ["HT-20"],
    ataChapter: "27",
    subjectId: subject!.id,
    estimatedMinutes: 60,
    steps: [
      {
        id: stepIds[0],
        text: "Measure the **cable tension**.",
        references: [
          { revisionId: revision.id, page: 5 },
          { revisionId: revision.id, page: 2 },
        ],
        measurement: { label: "Cable tension", unit: "lb", min: 30, max: 40 },
      },
      { id: stepIds[1], text: "Instructor checks the safety wire.", inspectionPoint: true, references: [] },
      {
        id: stepIds[2],
        text: "Measure the edge distance.",
        references: [],
        measurement: { label: "Edge distance", unit: "in", nominal: 0.375, tolerance: 0.125 },
      },
    ],
  };
  const created = await call("POST", "/api/cards", { cookie: teacher.cookie, json: { content } });
  expect(created.status).toBe(201);
  const cardId = ((await created.json()) as { card: CardDto }).card.id;
  expect((await call("POST", `/api/cards/${cardId}/publish`, { cookie: teacher.cookie })).status).toBe(200);
  const note = `Bay ${tag}`;
  expect(
    (
      await call("POST", "/api/assignments", {
        cookie: teacher.cookie,
        json: { cardId, studentIds: [learner.id], note, confirmDuplicates: true },
      })
    ).status,
  ).toBe(201);
  const work = ((await (await call("GET", "/api/my-work", { cookie: learner.cookie })).json()) as { work: WorkItemDto[] }).work;
  runId = work.find((w) => w.note === note)!.runId;
  const sent = await call("POST", `/api/runs/${runId}/events`, {
    cookie: learner.cookie,
    json: {
      events: [
        event(1, "value.recorded", { stepId: stepIds[0], payload: { value: "44 lb" } }),
        event(2, "value.recorded", { stepId: stepIds[0], payload: { value: "36 lb" } }),
        event(3, "step.checked", { stepId: stepIds[0] }),
        event(4, "step.checked", { stepId: stepIds[1] }),
        // Out of limits, explained by a note, and signed off as it stands.
        event(5, "value.recorded", { stepId: stepIds[2], payload: { value: "0.55 in" } }),
        event(6, "note.added", { stepId: stepIds[2], payload: { text: "Edge distance over; instructor accepts for practice panel" } }),
        event(7, "step.checked", { stepId: stepIds[2] }),
        event(8, "run.submitted"),
      ],
    },
  });
  expect(sent.status).toBe(200);
  expect((await call("POST", `/api/runs/${runId}/buy-off`, { cookie: teacher.cookie, json: { stepId: stepIds[1] } })).status).toBe(200);
  const signed = await call("POST", `/api/runs/${runId}/sign-off`, {
    cookie: teacher.cookie,
    json: { password: teacher.password, comment: "Seen." },
  });
  expect(signed.status).toBe(200);
  const [row] = await getDb().select({ signedAt: signOffs.signedAt }).from(signOffs).where(eq(signOffs.runId, runId));
  signedAt = row!.signedAt.toISOString();
});

describe("a signed-off run in the student's record", () => {
  it("carries the version, the revision cited, each measured value with its limit and verdict, the instructor and the time", async () => {
    for (const cookie of [teacher.cookie, learner.cookie, admin]) {
      const answer = await call("GET", `/api/records/students/${learner.id}`, { cookie });
      expect(answer.status).toBe(200);
      const record = (await answer.json()) as StudentRecordDto;
      const entry = record.subjects.flatMap((s) => s.signedOff).find((c) => c.runId === runId)!;
      expect(entry).toMatchObject({ title, versionNumber: 1, instructorName: teacher.name, signedAt });
      expect(entry.revisionsCited).toEqual([
        { revisionId: revision.id, manualTitle: revision.manualTitle, label: revision.label, pages: [2, 5] },
      ]);
      expect(entry.measured).toEqual([
        {
          stepId: stepIds[0],
          stepNumber: 1,
          stepText: "Measure the cable tension.",
          label: "Cable tension",
          limit: { unit: "lb", nominal: null, tolerance: null, min: 30, max: 40, text: "30 to 40 lb" },
          value: "36 lb",
          recordedAt: new Date(hourAgo + 2 * 60_000).toISOString(),
          toolNumber: null,
          verdict: "within_limits",
        },
        expect.objectContaining({
          stepNumber: 3,
          label: "Edge distance",
          limit: { unit: "in", nominal: 0.375, tolerance: 0.125, min: null, max: null, text: "0.375 ± 0.125 in" },
          value: "0.55 in",
          verdict: "out_of_limits",
        }),
      ]);
    }
  });

  it("says the same in the CSV, one line per measured step", async () => {
    const answer = await call("GET", `/api/records/students/${learner.id}?format=csv`, { cookie: teacher.cookie });
    expect(answer.status).toBe(200);
    expect(answer.headers.get("content-type")).toMatch(/text\/csv/);
    const lines = (await answer.text()).split("\r\n");
    expect(lines[0]).toBe(
      "Student,Subject,Task card,Version,Revisions cited,Signed off (UTC),Instructor,Estimated hours,Actual hours,Step,Measured,Value,Limit,Verdict,Tool",
    );
    const mine = lines.filter((l) => l.includes(title));
    expect(mine).toHaveLength(2);
    const card = `,${title},1,"${revision.manualTitle} ${revision.label}, pages 2, 5",${signedAt.slice(0, 16).replace("T", " ")},${teacher.name},1.0,`;
    expect(mine[0]).toContain(card);
    expect(mine[0]).toMatch(/,1,Cable tension,36 lb,30 to 40 lb,within limits,$/);
    expect(mine[1]).toContain(card);
    expect(mine[1]).toMatch(/,3,Edge distance,0\.55 in,0\.375 ± 0\.125 in,OUT OF LIMITS,$/);
  });

  it("and in the PDF", async () => {
    const answer = await call("GET", `/api/records/students/${learner.id}?format=pdf`, { cookie: teacher.cookie });
    expect(answer.status).toBe(200);
    expect(answer.headers.get("content-type")).toBe("application/pdf");
    const text = (await pdfText(new Uint8Array(await answer.arrayBuffer()))).replace(/\s+/g, " ");
    expect(text).toContain(`${title} (version 1)`);
    // On the school's clock (the demo seed's zone), the zone named.
    expect(text).toContain(`Signed off ${signedAtText(signedAt, schoolZone)} by ${teacher.name}`);
    expect(text).toContain(`Manual revisions cited: ${revision.manualTitle} ${revision.label}, pages 2, 5`);
    expect(text).toContain("Step 1, Cable tension: 36 lb (limits 30 to 40 lb), within limits");
    expect(text).toContain("Step 3, Edge distance: 0.55 in (limits 0.375 ± 0.125 in), OUT OF LIMITS");
  });

  it("shows it on the record's screen to the instructor, and keeps it from strangers", async () => {
    const page = await call("GET", `/records/students/${learner.id}`, { cookie: teacher.cookie });
    expect(page.status).toBe(200);
    const text = visibleText(await page.text());
    expect(text).toContain(`${revision.manualTitle} ${revision.label}, pages 2, 5`);
    expect(text).toContain("Step 1, Cable tension: 36 lb (limits 30 to 40 lb), within limits");
    expect(text).toContain(signedAtText(signedAt, schoolZone));
    const stranger = await person("instructor", "Stranger instructor");
    expect((await call("GET", `/api/records/students/${learner.id}?format=csv`, { cookie: stranger.cookie })).status).toBe(404);
  });
});

describe("the audit log in plain words", () => {
  const signedOffWords = () => `${teacher.name} signed off ${learner.name}'s run of '${title}' (version 1)`;

  it("answers with a summary that names who did what to which record", async () => {
    const answer = await call("GET", `/api/audit?kind=runs&actor=${encodeURIComponent(teacher.email)}`, { cookie: admin });
    expect(answer.status).toBe(200);
    const { events } = (await answer.json()) as {
      events: { action: string; subjectId: string; summary: string; detailLines: { label: string; value: string }[] }[];
    };
    const signed = events.find((e) => e.subjectId === runId && e.action === "run.signed_off")!;
    expect(signed.summary).toBe(signedOffWords());
    expect(signed.detailLines).toEqual([{ label: "Manual revisions cited", value: `${revision.manualTitle} ${revision.label}` }]);
    const boughtOff = events.find((e) => e.subjectId === runId && e.action === "run.bought_off")!;
    expect(boughtOff.summary).toBe(`${teacher.name} bought off step 2 of ${learner.name}'s run of '${title}' (version 1)`);
    expect(events.every((e) => !/\b[a-z_]+\.[a-z_]+\b/.test(e.summary))).toBe(true);
    const cards = await call("GET", `/api/audit?kind=cards&actor=${encodeURIComponent(teacher.email)}`, { cookie: admin });
    const summaries = ((await cards.json()) as { events: { summary: string }[] }).events.map((e) => e.summary);
    expect(summaries).toContain(`${teacher.name} published version 1 of the task card '${title}'`);
    expect(summaries).toContain(`${teacher.name} created the task card '${title}'`);
  });

  it("shows the words on the page, the details behind a disclosure, and no codes or JSON", async () => {
    const page = await call("GET", `/audit?kind=runs&actor=${encodeURIComponent(teacher.email)}`, { cookie: admin });
    expect(page.status).toBe(200);
    const html = await page.text();
    const text = visibleText(html);
    expect(text).toContain(signedOffWords());
    expect(html).toMatch(/<details[^>]*>\s*<summary[^>]*>Details<\/summary>/);
    expect(text).toContain(`Manual revisions cited ${revision.manualTitle} ${revision.label}`);
    expect(text).not.toMatch(/\brun\.(signed_off|bought_off)\b/);
    expect(text).not.toContain('{"');
    expect((await call("GET", "/audit", { cookie: teacher.cookie })).status).toBe(403);
    expect((await call("GET", "/api/audit", { cookie: teacher.cookie })).status).toBe(403);
  });
});

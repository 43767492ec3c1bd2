// The certification standard against the real server and database: the school's CSV imported with
// its bad rows listed, elements found by words, a card mapped to them (publishing refuses a code the
// standard lacks), and a student's coverage after a sign-off, seen only by the student and their
// instructors. Codes use area letters the demo excerpt does not (X, Y) so other tests are untouched.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, classMembers, curriculumSubjects } from "@/db/schema";
import type { CardDto } from "@/lib/contracts/cards";
import type { WorkItemDto } from "@/lib/contracts/runs";
import type { ClassCoverageDto, CoverageDto, ElementDto } from "@/lib/contracts/standard";
import type { Readiness } from "@/lib/domain/standard/readiness";
import { call, demo, makeAccount, signIn } from "../support/http";
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
const body = async <T>(response: Response, status: number): Promise<T> => {
  const text = await response.text();
  expect(response.status, text).toBe(status);
  return JSON.parse(text) as T;
};
let admin: string;
let teacher: Person;
let learner: Person;
let stranger: Person;
let classId: string;
const word = `rivetry${randomUUID().slice(0, 6)}`;
const csv = [
  "code,area,element",
  `AM.II.X.S1,Practice Structures,"Install a ${word} patch, two rows"`,
  `AM.II.X.K1,Practice Structures,Why a ${word} patch needs edge distance`,
  `AM.II.Y.S1,Practice Controls,Rig a practice cable`,
  "AM.II.X.Q1,Practice Structures,Not a kind",
  `AM.II.X.S1,Practice Structures,Twice`,
  "AM.II.Y.S2,,No area",
].join("\r\n");

beforeAll(async () => {
  admin = await signIn(demo.admin);
  [teacher, learner, stranger] = [await person("instructor"), await person("student"), await person("instructor")];
  const [row] = await getDb()
    .insert(classes)
    .values({ name: uniqueTitle("Standard class") })
    .returning({ id: classes.id });
  classId = row!.id;
  await getDb()
    .insert(classMembers)
    .values([teacher, learner].map((p) => ({ classId: row!.id, userId: p.id })));
});

describe("the certification standard", () => {
  it("imports the school's CSV, listing every refused row by line, and updates words on a second import", async () => {
    const first = await body<{ imported: number; updated: number; refused: { line: number; reason: string }[] }>(
      await call("POST", "/api/standard/import", { cookie: admin, body: csv, headers: { "content-type": "text/csv" } }),
      200,
    );
    expect(first.imported + first.updated).toBe(3);
    expect(first.refused).toEqual([
      { line: 5, reason: '"AM.II.X.Q1" is not an element code such as AM.I.A.K1.' },
      { line: 6, reason: "AM.II.X.S1 is already on line 2." },
      { line: 7, reason: "AM.II.Y.S2 has no area of operation." },
    ]);
    // The same as a form's file; the words change, nothing is added.
    const form = new FormData();
    form.append(
      "file",
      new Blob([csv.replace("Rig a practice cable", "Rig and tension a practice cable")], { type: "text/csv" }),
      "acs.csv",
    );
    const second = await body<{ imported: number; updated: number }>(
      await call("POST", "/api/standard/import", { cookie: admin, body: form }),
      200,
    );
    expect(second).toMatchObject({ imported: 0, updated: 3 });
    const { elements } = await body<{ elements: ElementDto[] }>(
      await call("GET", "/api/standard/elements?q=practice%20cable", { cookie: learner.cookie }),
      200,
    );
    expect(elements).toEqual([
      { code: "AM.II.Y.S1", kind: "skill", title: "Rig and tension a practice cable", section: "Airframe", area: "Y. Practice Controls" },
    ]);
    const byWord = await body<{ elements: ElementDto[] }>(
      await call("GET", `/api/standard/elements?q=${word}`, { cookie: learner.cookie }),
      200,
    );
    expect(byWord.elements.map((e) => e.code)).toEqual(["AM.II.X.K1", "AM.II.X.S1"]);
    const byCode = await body<{ elements: ElementDto[] }>(
      await call("GET", "/api/standard/elements?q=am.ii.x", { cookie: learner.cookie }),
      200,
    );
    expect(byCode.elements.map((e) => e.code)).toEqual(["AM.II.X.K1", "AM.II.X.S1"]);
  });

  it("refuses what is not a CSV, too large, or from anyone but an admin", async () => {
    expect((await call("POST", "/api/standard/import", { cookie: admin, json: { csv } })).status).toBe(415);
    expect(
      (await call("POST", "/api/standard/import", { cookie: teacher.cookie, body: csv, headers: { "content-type": "text/csv" } })).status,
    ).toBe(403);
    const huge = `code,area,element\n${"AM.I.A.K1,a,b\n".repeat(200_000)}`;
    expect(
      (await call("POST", "/api/standard/import", { cookie: admin, body: huge, headers: { "content-type": "text/csv" } })).status,
    ).toBe(413);
    const nothing = await body<{ imported: number; refused: unknown[] }>(
      await call("POST", "/api/standard/import", { cookie: admin, body: "", headers: { "content-type": "text/csv" } }),
      200,
    );
    expect(nothing.imported).toBe(0);
    expect(nothing.refused).toHaveLength(1);
  });

  it("counts a signed-off run's mapped steps as demonstrated, a started run's as practised, for the student and their instructors only", async () => {
    const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
    const steps = [
      { id: randomUUID(), text: "Install the patch.", elements: ["am.ii.x.s1", "AM.II.X.K1"] },
      { id: randomUUID(), text: "Instructor checks the rows.", inspectionPoint: true, elements: ["AM.II.NOPE.S1"] },
    ];
    const { card } = await body<{ card: CardDto }>(
      await call("POST", "/api/cards", {
        cookie: teacher.cookie,
        json: { content: { title: uniqueTitle("Standard card"), ataChapter: "51", subjectId: subject!.id, steps } },
      }),
      201,
    );
    // A malformed code is a draft problem; a well-formed one the standard lacks is refused at publishing.
    const refusedPublish = await call("POST", `/api/cards/${card.id}/publish`, { cookie: teacher.cookie });
    expect(refusedPublish.status).toBe(422);
    expect(((await refusedPublish.json()) as { error: { message: string } }).error.message).toMatch(
      /AM\.II\.NOPE\.S1 is not an element code/,
    );
    const fixed = [steps[0], { ...steps[1], elements: ["AM.II.Z.S9"] }];
    await body(
      await call("PUT", `/api/cards/${card.id}/draft`, {
        cookie: teacher.cookie,
        json: { content: { title: uniqueTitle("Standard card"), ataChapter: "51", subjectId: subject!.id, steps: fixed } },
      }),
      200,
    );
    const unknown = await call("POST", `/api/cards/${card.id}/publish`, { cookie: teacher.cookie });
    expect(unknown.status).toBe(422);
    expect(((await unknown.json()) as { error: { message: string } }).error.message).toMatch(/the standard has no element AM\.II\.Z\.S9/);
    const good = [steps[0], { ...steps[1], elements: ["AM.II.Y.S1"] }];
    await body(
      await call("PUT", `/api/cards/${card.id}/draft`, {
        cookie: teacher.cookie,
        json: { content: { title: uniqueTitle("Standard card"), ataChapter: "51", subjectId: subject!.id, steps: good } },
      }),
      200,
    );
    await body(await call("POST", `/api/cards/${card.id}/publish`, { cookie: teacher.cookie }), 200);

    const statusOf = async (cookie: string) => {
      const c = await body<CoverageDto>(await call("GET", `/api/records/students/${learner.id}/coverage`, { cookie }), 200);
      return Object.fromEntries(c.elements.filter((e) => /^AM\.II\.[XY]\./.test(e.code)).map((e) => [e.code, e.status]));
    };
    expect(await statusOf(learner.cookie)).toEqual({ "AM.II.X.K1": "missing", "AM.II.X.S1": "missing", "AM.II.Y.S1": "missing" });

    await body(
      await call("POST", "/api/assignments", { cookie: teacher.cookie, json: { cardId: card.id, studentIds: [learner.id] } }),
      201,
    );
    const { work } = await body<{ work: WorkItemDto[] }>(await call("GET", "/api/my-work", { cookie: learner.cookie }), 200);
    const runId = work.find((w) => w.cardId === card.id)!.runId;
    const at = (ms: number) => new Date(Date.now() + ms).toISOString();
    const send = (events: unknown[]) => call("POST", `/api/runs/${runId}/events`, { cookie: learner.cookie, json: { events } });
    expect((await send([{ id: randomUUID(), type: "step.checked", stepId: steps[0]!.id, clientTime: at(0) }])).status).toBe(200);
    expect(await statusOf(teacher.cookie)).toEqual({ "AM.II.X.K1": "practised", "AM.II.X.S1": "practised", "AM.II.Y.S1": "practised" });

    expect((await send([{ id: randomUUID(), type: "step.checked", stepId: steps[1]!.id, clientTime: at(1) }])).status).toBe(200);
    await body(await call("POST", `/api/runs/${runId}/buy-off`, { cookie: teacher.cookie, json: { stepId: steps[1]!.id } }), 200);
    expect((await send([{ id: randomUUID(), type: "run.submitted", clientTime: at(2) }])).status).toBe(200);
    await body(await call("POST", `/api/runs/${runId}/sign-off`, { cookie: teacher.cookie, json: { password: teacher.password } }), 200);
    const coverage = await body<CoverageDto>(
      await call("GET", `/api/records/students/${learner.id}/coverage`, { cookie: learner.cookie }),
      200,
    );
    const shown = coverage.elements.find((e) => e.code === "AM.II.Y.S1")!;
    expect(shown).toMatchObject({ status: "demonstrated", runId, run: { versionNumber: 1, instructorName: teacher.name } });
    expect(coverage.totals.Airframe!.skill.demonstrated).toBeGreaterThanOrEqual(2);

    // Another class's instructor, and another student, learn nothing.
    expect((await call("GET", `/api/records/students/${learner.id}/coverage`, { cookie: stranger.cookie })).status).toBe(404);
    const otherStudent = await person("student");
    expect((await call("GET", `/api/records/students/${learner.id}/coverage`, { cookie: otherStudent.cookie })).status).toBe(404);
  });

  it("puts the class in a grid with its gaps, and a readiness report per student as JSON, CSV and PDF", async () => {
    // After the sign-off above, the learner has demonstrated AM.II.Y.S1; AM.II.X.S1 is on the signed-off
    // card too. A second, new student of the class has nothing: every element is a gap only if nobody shows it.
    const newcomer = await person("student");
    await getDb().insert(classMembers).values({ classId, userId: newcomer.id });
    const grid = await body<ClassCoverageDto>(
      await call("GET", `/api/records/classes/${classId}/coverage?section=Airframe`, { cookie: teacher.cookie }),
      200,
    );
    expect(grid.kind).toBe("skill");
    expect(grid.elements.every((e) => e.kind === "skill" && e.section === "Airframe")).toBe(true);
    const row = (id: string) => grid.students.find((s) => s.id === id)!;
    expect(row(learner.id).statuses["AM.II.Y.S1"]).toBe("demonstrated");
    expect(row(newcomer.id).statuses["AM.II.Y.S1"]).toBe("missing");
    expect(row(newcomer.id).demonstrated).toBe(0);
    expect(grid.gaps).not.toContain("AM.II.Y.S1");
    expect(grid.gaps).toEqual(grid.elements.filter((e) => row(learner.id).statuses[e.code] !== "demonstrated").map((e) => e.code));
    expect((await call("GET", `/api/records/classes/${classId}/coverage`, { cookie: stranger.cookie })).status).toBe(404);
    expect((await call("GET", `/api/records/classes/${classId}/coverage`, { cookie: learner.cookie })).status).toBe(403);

    const readiness = await body<Readiness>(
      await call("GET", `/api/records/students/${newcomer.id}/readiness`, { cookie: teacher.cookie }),
      200,
    );
    expect(readiness.ready).toBe(false);
    const airframe = readiness.sections.find((s) => s.section === "Airframe")!;
    expect(airframe.remaining.map((e) => e.code)).toContain("AM.II.Y.S1");
    expect(readiness.remaining).toBe(readiness.sections.reduce((n, s) => n + s.remaining.length, 0));
    const mine = await body<Readiness>(await call("GET", `/api/records/students/${learner.id}/readiness`, { cookie: learner.cookie }), 200);
    expect(mine.sections.find((s) => s.section === "Airframe")!.remaining.map((e) => e.code)).not.toContain("AM.II.Y.S1");

    const csvReport = await call("GET", `/api/records/students/${newcomer.id}/readiness?format=csv`, { cookie: teacher.cookie });
    expect(csvReport.status).toBe(200);
    expect(csvReport.headers.get("content-type")).toMatch(/^text\/csv/);
    const lines = (await csvReport.text()).trimEnd().split("\r\n");
    expect(lines[0]).toBe("Student,Section,Code,Kind,Area of operation,Element,Status,Practised in");
    expect(lines).toHaveLength(readiness.remaining + 1);
    expect(lines.find((l) => l.includes(",AM.II.Y.S1,"))).toMatch(/,AM\.II\.Y\.S1,Skill,Y\. [^,]+,[^,]+,Not yet,$/);
    const pdf = await call("GET", `/api/records/students/${newcomer.id}/readiness?format=pdf`, { cookie: newcomer.cookie });
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    expect(new TextDecoder().decode((await pdf.arrayBuffer()).slice(0, 5))).toBe("%PDF-");
    // Another student and another class's instructor: not found.
    expect((await call("GET", `/api/records/students/${newcomer.id}/readiness`, { cookie: learner.cookie })).status).toBe(404);
    expect((await call("GET", `/api/records/students/${newcomer.id}/readiness?format=csv`, { cookie: stranger.cookie })).status).toBe(404);
  });
});

// The tool room against the real server and database: a kit lent for a run, counted in with a tool
// missing, the hand-in held (409) until the student's instructor clears it, a reading refused with
// a wrench past its calibration (422 naming it) and kept with its number when in calibration, the
// record naming the wrench; and lending refused when it would lend one thing twice.
import { execFileSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, classMembers, curriculumSubjects, toolCalibrations, toolCheckouts, tools, users } from "@/db/schema";
import type { CardDto } from "@/lib/contracts/cards";
import type { StudentRecordDto, WorkItemDto } from "@/lib/contracts/runs";
import type { CheckoutDto, KitDto, ToolDto, ToolHoldDto } from "@/lib/contracts/tools";
import { call, demo, makeAccount, signIn, waitForMail } from "../support/http";
import { uniqueTitle } from "../support/library";

interface Person {
  id: string;
  name: string;
  cookie: string;
  password: string;
}
const person = async (role: "instructor" | "student" | "librarian"): Promise<Person> => {
  const a = await makeAccount(role);
  return { id: a.id, name: a.name, cookie: await signIn(a.email, a.password), password: a.password };
};
const body = async <T>(response: Response, status: number): Promise<T> => {
  const text = await response.text();
  expect(response.status, text).toBe(status);
  return JSON.parse(text) as T;
};
const suffix = () => String(Math.floor(Math.random() * 90_000) + 10_000);
const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

let teacher: Person;
let learner: Person;
let stranger: Person; // an instructor of another class
let desk: string; // the tool room (the demo librarian)
let runId: string;
let kit: KitDto;
let goodWrench: string;
let oldWrench: string;
const jackStep = randomUUID();
const torqueStep = randomUUID();

let tick = 0;
const event = (type: string, over: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  type,
  clientTime: new Date((tick = Math.max(Date.now(), tick + 1))).toISOString(),
  stepId: null,
  payload: {},
  ...over,
});
const send = (events: unknown[]) => call("POST", `/api/runs/${runId}/events`, { cookie: learner.cookie, json: { events } });

beforeAll(async () => {
  [teacher, learner, stranger] = [await person("instructor"), await person("student"), await person("instructor")];
  desk = await signIn(demo.librarian);
  const [row] = await getDb()
    .insert(classes)
    .values({ name: uniqueTitle("Tool room class") })
    .returning({ id: classes.id });
  await getDb()
    .insert(classMembers)
    .values([teacher, learner].map((p) => ({ classId: row!.id, userId: p.id })));

  // A kit of two tools, and two wrenches: one in calibration, one past it.
  const n = suffix();
  const { kit: made } = await body<{ kit: { id: string } }>(
    await call("POST", "/api/kits", { cookie: desk, json: { number: `K-${n}`, name: "Brake kit", location: "Shelf C" } }),
    201,
  );
  for (const [number, description] of [
    [`T-${n}1`, "Brake lining gauge"],
    [`T-${n}2`, "Safety wire pliers"],
  ])
    await body(await call("POST", "/api/tools", { cookie: desk, json: { number, description, kitId: made.id } }), 201);
  kit = (await body<{ kits: KitDto[] }>(await call("GET", "/api/kits", { cookie: desk }), 200)).kits.find((k) => k.id === made.id)!;
  const wrench = async (number: string, due: string) =>
    (
      await body<{ tool: { id: string } }>(
        await call("POST", "/api/tools", {
          cookie: desk,
          json: {
            number,
            description: "Torque wrench, 0-250 in-lb",
            calibrated: true,
            calibrationIntervalDays: 365,
            calibrationDueOn: due,
          },
        }),
        201,
      )
    ).tool.id;
  goodWrench = await wrench(`TW-${n}1`, day(60));
  oldWrench = await wrench(`TW-${n}2`, day(-3));

  const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
  const { card } = await body<{ card: CardDto }>(
    await call("POST", "/api/cards", {
      cookie: teacher.cookie,
      json: {
        content: {
          title: uniqueTitle("Brake torque card"),
          ataChapter: "32",
          subjectId: subject!.id,
          tools: [`K-${n} Brake kit`, `TW-${n}1 Torque wrench`, "Shop rags"],
          steps: [
            { id: jackStep, text: "Check the lining wear with the gauge." },
            {
              id: torqueStep,
              text: "Torque the brake bolts.",
              measurement: { label: "Bolt torque", unit: "in-lb", min: 90, max: 110 },
              calibratedTool: true,
            },
          ],
        },
      },
    }),
    201,
  );
  await body(await call("POST", `/api/cards/${card.id}/publish`, { cookie: teacher.cookie }), 200);
  await body(await call("POST", "/api/assignments", { cookie: teacher.cookie, json: { cardId: card.id, studentIds: [learner.id] } }), 201);
  const { work } = await body<{ work: WorkItemDto[] }>(await call("GET", "/api/my-work", { cookie: learner.cookie }), 200);
  runId = work.find((w) => w.cardId === card.id)!.runId;
});

describe("the tool room", () => {
  it("lists tools and kits in the shape the outside checks read", async () => {
    const { tools: list } = await body<{ tools: ToolDto[] }>(await call("GET", "/api/tools", { cookie: learner.cookie }), 200);
    const old = list.find((t) => t.id === oldWrench)!;
    expect(old).toMatchObject({
      number: expect.stringMatching(/^TW-/),
      kitId: null,
      calibrationDueOn: day(-3),
      status: "in_service",
      calibration: "past",
    });
    expect(kit.tools.map((t) => t.description).sort()).toEqual(["Brake lining gauge", "Safety wire pliers"]);
    const due = await body<{ tools: ToolDto[] }>(await call("GET", "/api/tools?dueWithin=30", { cookie: desk }), 200);
    expect(due.tools.map((t) => t.id)).toContain(oldWrench);
    expect(due.tools.map((t) => t.id)).not.toContain(goodWrench);
    // Students read the list but do not lend.
    expect((await call("POST", "/api/checkouts", { cookie: learner.cookie, json: { kitId: kit.id, userId: learner.id } })).status).toBe(
      403,
    );
  });

  it("lends a kit for a run, counts it in a tool short, holds the hand-in until the instructor clears it", async () => {
    const { checkout } = await body<{ checkout: CheckoutDto }>(
      await call("POST", "/api/checkouts", { cookie: desk, json: { kitId: kit.id, userId: learner.id, runId } }),
      201,
    );
    expect(checkout).toMatchObject({ userId: learner.id, runId, returnedAt: null, overdue: false });
    expect(checkout.tools).toHaveLength(2);
    // Nothing is lent twice: the kit, or a tool of it on its own.
    const twice = await call("POST", "/api/checkouts", { cookie: desk, json: { kitId: kit.id, userId: learner.id } });
    expect(twice.status).toBe(409);
    expect(((await twice.json()) as { error: { message: string } }).error.message).toContain(learner.name);
    expect((await call("POST", "/api/checkouts", { cookie: desk, json: { toolId: kit.tools[0]!.id, userId: learner.id } })).status).toBe(
      409,
    );

    // The run's screen says what the student has out against the card's tool lines.
    const detail = await body<{ tools: { lines: { status: string }[]; checkedOut: { id: string }[] } }>(
      await call("GET", `/api/runs/${runId}`, { cookie: learner.cookie }),
      200,
    );
    expect(detail.tools.lines.map((l) => l.status)).toEqual(["have", "missing", "free_text"]);

    const missing = kit.tools.find((t) => t.description === "Safety wire pliers")!;
    // A tool that was not lent on this loan cannot be named missing.
    expect(
      (await call("POST", `/api/checkouts/${checkout.id}/return`, { cookie: desk, json: { missingToolIds: [goodWrench] } })).status,
    ).toBe(422);
    const back = await body<{ checkout: CheckoutDto; holds: ToolHoldDto[] }>(
      await call("POST", `/api/checkouts/${checkout.id}/return`, { cookie: desk, json: { missingToolIds: [missing.id] } }),
      200,
    );
    expect(back.checkout.returnedAt).not.toBeNull();
    expect(back.holds.map((h) => [h.tool.id, h.runId])).toEqual([[missing.id, runId]]);
    expect((await call("POST", `/api/checkouts/${checkout.id}/return`, { cookie: desk, json: {} })).status).toBe(409);

    // Work goes on; the hand-in does not.
    expect((await send([event("step.checked", { stepId: jackStep })])).status).toBe(200);
    const held = await send([event("run.submitted")]);
    expect(held.status).toBe(409);
    expect(((await held.json()) as { error: { message: string } }).error.message).toMatch(
      /Safety wire pliers .* not counted back in .* cannot be handed in/,
    );

    // The student and their instructor see the hold; another class's instructor cannot clear it.
    const mine = await body<{ holds: ToolHoldDto[] }>(await call("GET", "/api/tool-holds", { cookie: learner.cookie }), 200);
    expect(mine.holds.map((h) => h.id)).toEqual([back.holds[0]!.id]);
    const theirs = await body<{ holds: ToolHoldDto[] }>(await call("GET", "/api/tool-holds", { cookie: stranger.cookie }), 200);
    expect(theirs.holds.map((h) => h.id)).not.toContain(back.holds[0]!.id);
    const holdId = back.holds[0]!.id;
    expect((await call("POST", `/api/tool-holds/${holdId}/clear`, { cookie: stranger.cookie, json: { outcome: "found" } })).status).toBe(
      404,
    );
    expect((await call("POST", `/api/tool-holds/${holdId}/clear`, { cookie: learner.cookie, json: { outcome: "found" } })).status).toBe(
      403,
    );
    expect(
      (await call("POST", `/api/tool-holds/${holdId}/clear`, { cookie: teacher.cookie, json: { outcome: "lost", note: "" } })).status,
    ).toBe(422);
    const cleared = await body<{ hold: ToolHoldDto }>(
      await call("POST", `/api/tool-holds/${holdId}/clear`, {
        cookie: teacher.cookie,
        json: { outcome: "lost", note: "Searched the bay and the wheel well" },
      }),
      200,
    );
    expect(cleared.hold).toMatchObject({ outcome: "lost", clearedByName: teacher.name });
    expect((await call("POST", `/api/tool-holds/${holdId}/clear`, { cookie: teacher.cookie, json: { outcome: "found" } })).status).toBe(
      409,
    );
    // A lost tool is out of service: not lent again until found.
    const [pliers] = await getDb().select().from(tools).where(eq(tools.id, missing.id));
    expect(pliers).toMatchObject({ status: "out_of_service", outOfServiceReason: "Lost: Searched the bay and the wheel well" });
    expect((await call("POST", "/api/checkouts", { cookie: desk, json: { toolId: missing.id, userId: learner.id } })).status).toBe(409);
  });

  it("refuses a reading taken with a wrench past its calibration, keeps one taken in calibration, and the record names the wrench", async () => {
    for (const toolId of [goodWrench, oldWrench])
      await body(await call("POST", "/api/checkouts", { cookie: desk, json: { toolId, userId: learner.id, runId } }), 201);
    const noTool = await send([event("value.recorded", { stepId: torqueStep, payload: { value: "100 in-lb" } })]);
    expect(noTool.status).toBe(422);
    expect(((await noTool.json()) as { error: { message: string } }).error.message).toMatch(/Step 2 needs the calibrated tool/);
    const old = await send([event("value.recorded", { stepId: torqueStep, payload: { value: "100 in-lb", toolId: oldWrench } })]);
    expect(old.status).toBe(422);
    expect(((await old.json()) as { error: { message: string } }).error.message).toMatch(
      new RegExp(`TW-\\d+2 was due for calibration on ${day(-3)}: a reading taken with it on .* cannot be recorded`),
    );
    // A cart clock set back a week does not bring it into calibration (the stamp is held within 8 hours of receipt).
    const backdated = await send([
      event("value.recorded", {
        stepId: torqueStep,
        payload: { value: "100 in-lb", toolId: oldWrench },
        clientTime: new Date(Date.now() - 7 * 86_400_000).toISOString(),
      }),
    ]);
    expect(backdated.status).toBe(422);
    // The cart's own number is not trusted: the server writes the tool room's.
    const good = await send([
      event("value.recorded", { stepId: torqueStep, payload: { value: "100 in-lb", toolId: goodWrench, toolNumber: "TW-FAKE" } }),
    ]);
    expect(good.status).toBe(200);
    const [wrench] = await getDb().select({ number: tools.number }).from(tools).where(eq(tools.id, goodWrench));
    const detail = await body<{ events: { type: string; payload: Record<string, unknown> }[] }>(
      await call("GET", `/api/runs/${runId}`, { cookie: teacher.cookie }),
      200,
    );
    expect(detail.events.filter((e) => e.type === "value.recorded").map((e) => e.payload.toolNumber)).toEqual([wrench!.number]);

    // Back in: the hand-in goes, the instructor signs off, the record names the wrench.
    const { checkouts } = await body<{ checkouts: CheckoutDto[] }>(await call("GET", "/api/checkouts", { cookie: learner.cookie }), 200);
    for (const c of checkouts)
      await body(await call("POST", `/api/checkouts/${c.id}/return`, { cookie: desk, json: { missingToolIds: [] } }), 200);
    expect((await send([event("step.checked", { stepId: torqueStep }), event("run.submitted")])).status).toBe(200);
    await body(await call("POST", `/api/runs/${runId}/sign-off`, { cookie: teacher.cookie, json: { password: teacher.password } }), 200);
    const record = await body<StudentRecordDto>(await call("GET", `/api/records/students/${learner.id}`, { cookie: teacher.cookie }), 200);
    const measured = record.subjects.flatMap((s) => s.signedOff).flatMap((c) => c.measured);
    expect(measured.find((m) => m.stepId === torqueStep)).toMatchObject({
      value: "100 in-lb",
      toolNumber: wrench!.number,
      verdict: "within_limits",
    });
    const csv = await (await call("GET", `/api/records/students/${learner.id}?format=csv`, { cookie: teacher.cookie })).text();
    expect(csv).toContain(`,Bolt torque,100 in-lb,90 to 110 in-lb,within limits,${wrench!.number}`);
  });

  it("records a calibration from its certificate, never changes it, and moves the tool's due date", async () => {
    const refused = await call("POST", `/api/tools/${oldWrench}/calibrations`, {
      cookie: desk,
      json: { calibratedOn: day(2), calibratedBy: "Metrology bench", certificate: "C-1" },
    });
    expect(refused.status).toBe(422);
    const { calibration } = await body<{ calibration: { id: string; nextDueOn: string } }>(
      await call("POST", `/api/tools/${oldWrench}/calibrations`, {
        cookie: desk,
        json: { calibratedOn: day(-1), calibratedBy: "Metrology bench", certificate: `C-${suffix()}` },
      }),
      201,
    );
    // Yesterday (UTC), so it is not in the future on the school's clock whatever the hour.
    expect(calibration.nextDueOn).toBe(day(364));
    const { tool } = await body<{ tool: ToolDto & { calibrations: unknown[] } }>(
      await call("GET", `/api/tools/${oldWrench}`, { cookie: desk }),
      200,
    );
    expect(tool).toMatchObject({ calibrationDueOn: day(364), calibration: "in" });
    expect(tool.calibrations).toHaveLength(1);
    await expect(
      getDb().update(toolCalibrations).set({ certificate: "edited" }).where(eq(toolCalibrations.id, calibration.id)),
    ).rejects.toMatchObject({ cause: { code: "HLF02" } });
    await expect(getDb().execute(sql`delete from tool_calibrations where id = ${calibration.id}`)).rejects.toMatchObject({
      cause: { code: "HLF02" },
    });
  });

  it("mails a loan past due once, to the student and their instructor", async () => {
    const { checkout } = await body<{ checkout: CheckoutDto }>(
      await call("POST", "/api/checkouts", { cookie: desk, json: { toolId: goodWrench, userId: learner.id } }),
      201,
    );
    // An hour late (the API refuses a due time in the past, so it is set here).
    await getDb()
      .update(toolCheckouts)
      .set({ dueAt: new Date(Date.now() - 3_600_000) })
      .where(eq(toolCheckouts.id, checkout.id));
    const { checkouts } = await body<{ checkouts: CheckoutDto[] }>(
      await call("GET", "/api/checkouts?status=overdue", { cookie: desk }),
      200,
    );
    expect(checkouts.find((c) => c.id === checkout.id)?.overdue).toBe(true);
    // The worker's sweep runs every 30 s.
    const [learnerRow] = await getDb().select({ email: users.email }).from(users).where(eq(users.id, learner.id));
    const [teacherRow] = await getDb().select({ email: users.email }).from(users).where(eq(users.id, teacher.id));
    const mail = await waitForMail(learnerRow!.email, /Bring back/, 45);
    expect(mail.text).toContain("Torque wrench, 0-250 in-lb");
    await waitForMail(teacherRow!.email, /has not brought back/, 10);
    const [row] = await getDb().select().from(toolCheckouts).where(eq(toolCheckouts.id, checkout.id));
    expect(row!.overdueMailedAt).not.toBeNull();
    await body(await call("POST", `/api/checkouts/${checkout.id}/return`, { cookie: desk, json: {} }), 200);
  });

  it("refuses bad input with the field named, and numbers in use", async () => {
    const bad = await call("POST", "/api/tools", { cookie: desk, json: { number: "wrench\u0000", description: "x" } });
    expect(bad.status).toBe(422);
    const [existing] = await getDb().select({ number: tools.number }).from(tools).where(eq(tools.id, goodWrench));
    const dup = await call("POST", "/api/tools", {
      cookie: desk,
      json: { number: existing!.number.toLowerCase(), description: "Another" },
    });
    expect(dup.status).toBe(409);
    const past = await call("POST", "/api/checkouts", {
      cookie: desk,
      json: { toolId: goodWrench, userId: learner.id, dueAt: new Date(Date.now() - 60_000).toISOString() },
    });
    expect(past.status).toBe(422);
    const notStudent = await call("POST", "/api/checkouts", { cookie: desk, json: { toolId: goodWrench, userId: teacher.id } });
    expect(notStudent.status).toBe(422);
    const outOfService = await call("PATCH", `/api/tools/${goodWrench}`, { cookie: desk, json: { status: "out_of_service" } });
    expect(outOfService.status).toBe(422);
  });

  it("prints a label sheet as a PDF, each label with its number in type", async () => {
    const sheet = await call("GET", `/api/tools/labels?kit=${kit.id}`, { cookie: desk });
    expect(sheet.status).toBe(200);
    expect(sheet.headers.get("content-type")).toBe("application/pdf");
    const bytes = Buffer.from(await sheet.arrayBuffer());
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    const text = execFileSync("pdftotext", ["-", "-"], { input: bytes }).toString();
    expect(text).toContain(kit.number);
    for (const t of kit.tools) expect(text).toContain(t.number);
    expect((await call("GET", "/api/tools/labels", { cookie: learner.cookie })).status).toBe(403);
  });
});

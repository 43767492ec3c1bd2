// The fleet and hangar against the real server and database: the demo fleet with its engine change
// from a signed-off run, what applies to an asset, booking conflicts (also when two desks book at
// once) with the mail to the class's instructors, findings filed offline as run events and synced
// once, decided by the student's instructor only, and an engine change written on the assets by a
// sign-off. Assets and places made here carry random names, so other tests are untouched.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { classes, classMembers, curriculumSubjects } from "@/db/schema";
import type { CardDto } from "@/lib/contracts/cards";
import type { AssetDetailDto, AssetDto, BookingDto, FindingDto, PlaceDto } from "@/lib/contracts/fleet";
import type { WorkItemDto } from "@/lib/contracts/runs";
import { call, demo, makeAccount, signIn, waitForMail } from "../support/http";
import { uniqueTitle } from "../support/library";

interface Person {
  id: string;
  name: string;
  email: string;
  cookie: string;
  password: string;
}
const person = async (role: "instructor" | "student"): Promise<Person> => {
  const a = await makeAccount(role);
  return { ...a, cookie: await signIn(a.email, a.password) };
};
const body = async <T>(response: Response, status: number): Promise<T> => {
  const text = await response.text();
  expect(response.status, text).toBe(status);
  return JSON.parse(text) as T;
};
const tag = () => randomUUID().slice(0, 6).toUpperCase();

let admin: string;
let teacher: Person;
let colleague: Person;
let stranger: Person;
let learner: Person;
let classId: string;

const makeAsset = async (input: Record<string, unknown>) =>
  (await body<{ asset: { id: string } }>(await call("POST", "/api/assets", { cookie: admin, json: input }), 201)).asset.id;
const makePlace = async (input: Record<string, unknown>) =>
  (await body<{ place: { id: string } }>(await call("POST", "/api/places", { cookie: admin, json: input }), 201)).place.id;

/** A published one-step card given to the learner; the run's id. */
async function runForLearner(title: string) {
  const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
  const stepId = randomUUID();
  const content = { title: uniqueTitle(title), ataChapter: "71", subjectId: subject!.id, steps: [{ id: stepId, text: "Do the work." }] };
  const { card } = await body<{ card: CardDto }>(await call("POST", "/api/cards", { cookie: teacher.cookie, json: { content } }), 201);
  await body(await call("POST", `/api/cards/${card.id}/publish`, { cookie: teacher.cookie }), 200);
  await body(await call("POST", "/api/assignments", { cookie: teacher.cookie, json: { cardId: card.id, studentIds: [learner.id] } }), 201);
  const { work } = await body<{ work: WorkItemDto[] }>(await call("GET", "/api/my-work", { cookie: learner.cookie }), 200);
  return { runId: work.find((w) => w.cardId === card.id)!.runId, stepId };
}

beforeAll(async () => {
  admin = await signIn(demo.admin);
  [teacher, colleague, stranger, learner] = [
    await person("instructor"),
    await person("instructor"),
    await person("instructor"),
    await person("student"),
  ];
  const [row] = await getDb()
    .insert(classes)
    .values({ name: uniqueTitle("Fleet class") })
    .returning({ id: classes.id });
  classId = row!.id;
  await getDb()
    .insert(classMembers)
    .values([teacher, colleague, learner].map((p) => ({ classId, userId: p.id })));
});

describe("the demo fleet", () => {
  it("lists assets of every kind, and HL-TR3's engine change from the signed-off run", async () => {
    const { assets } = await body<{ assets: AssetDto[] }>(await call("GET", "/api/assets", { cookie: learner.cookie }), 200);
    const demoAssets = assets.filter((a) => /^(HL-TR|E-|P-|M-)\d/.test(a.identifier));
    expect(demoAssets.length).toBeGreaterThanOrEqual(6);
    expect(new Set(demoAssets.map((a) => a.kind))).toEqual(new Set(["aircraft", "engine", "propeller", "component"]));
    const tr3 = demoAssets.find((a) => a.identifier === "HL-TR3")!;
    const { asset } = await body<{ asset: AssetDetailDto }>(await call("GET", `/api/assets/${tr3.id}`, { cookie: learner.cookie }), 200);
    expect(asset.installed.map((i) => i.identifier)).toEqual(["E-402"]);
    const old = asset.history.find((h) => h.asset.identifier === "E-401")!;
    const fresh = asset.history.find((h) => h.asset.identifier === "E-402")!;
    expect(old.removedRun?.title).toBe("Turbine engine removal and installation on the stand");
    expect(fresh.installedRun?.id).toBe(old.removedRun?.id);
    expect(old.removedByName).toBe("Tomas Reyna");
    const { places } = await body<{ places: PlaceDto[] }>(await call("GET", "/api/places", { cookie: learner.cookie }), 200);
    expect(places.filter((p) => p.kind === "bay").length).toBeGreaterThanOrEqual(3);
    expect(places.some((p) => p.kind === "engine_stand")).toBe(true);
  });

  it("says what applies to an asset by its model: the trainer's manuals, not the turbine's", async () => {
    const { assets } = await body<{ assets: AssetDto[] }>(await call("GET", "/api/assets?q=HL-TR1", { cookie: learner.cookie }), 200);
    const { asset } = await body<{ asset: AssetDetailDto }>(
      await call("GET", `/api/assets/${assets[0]!.id}`, { cookie: learner.cookie }),
      200,
    );
    const manuals = asset.applies.manuals.map((m) => m.title);
    expect(manuals).toContain("HT-20 Trainer Maintenance Manual");
    expect(manuals).not.toContain("TF-400 Engine Removal and Installation");
    expect(asset.applies.cards.map((c) => c.title)).toContain("Aileron control cable tension check");
    expect(asset.applies.cards.map((c) => c.title)).not.toContain("Turbine engine removal and installation on the stand");
    expect(asset.openFindings.some((f) => /aileron hinge bracket/.test(f.text))).toBe(true);
  });
});

describe("bookings", () => {
  let aircraft: string;
  let other: string;
  let wide: string;
  let bay: string;
  let bay2: string;
  const at = (hours: number) => new Date(Date.UTC(2027, 2, 1, 8) + hours * 3_600_000).toISOString();

  beforeAll(async () => {
    const t = tag();
    aircraft = await makeAsset({ identifier: `T-${t}-1`, kind: "aircraft", model: "TX-1", spanMetres: 10 });
    other = await makeAsset({ identifier: `T-${t}-2`, kind: "aircraft", model: "TX-1", spanMetres: 10 });
    wide = await makeAsset({ identifier: `T-${t}-3`, kind: "aircraft", model: "TX-9", spanMetres: 15 });
    bay = await makePlace({ name: `Test bay ${t}`, kind: "bay", takes: ["aircraft"], maxSpanMetres: 12 });
    bay2 = await makePlace({ name: `Test bay ${t} B`, kind: "bay", takes: ["aircraft"], maxSpanMetres: 12 });
  });

  it("refuses two bookings of one asset or one place at once, with the reason; back to back is fine", async () => {
    const book = (json: Record<string, unknown>, cookie = teacher.cookie) => call("POST", "/api/bookings", { cookie, json });
    const first = await body<{ booking: BookingDto }>(
      await book({ assetId: aircraft, placeId: bay, classId, startsAt: at(0), endsAt: at(4) }),
      201,
    );
    expect(first.booking.className).toMatch(/^Fleet class/);

    const sameAsset = await book({ assetId: aircraft, placeId: bay2, startsAt: at(3), endsAt: at(5) });
    expect(sameAsset.status).toBe(409);
    expect(((await sameAsset.json()) as { error: { message: string } }).error.message).toMatch(
      /is already booked in Test bay .* for Fleet class/,
    );
    const samePlace = await book({ assetId: other, placeId: bay, startsAt: at(1), endsAt: at(2) });
    expect(samePlace.status).toBe(409);
    expect(((await samePlace.json()) as { error: { message: string } }).error.message).toMatch(/already holds T-.*-1/);
    await body(await book({ assetId: other, placeId: bay, startsAt: at(4), endsAt: at(6) }), 201);

    const tooWide = await book({ assetId: wide, placeId: bay2, startsAt: at(0), endsAt: at(1) });
    expect(tooWide.status).toBe(422);
    expect(((await tooWide.json()) as { error: { message: string } }).error.message).toMatch(/spans 15 m; Test bay .* takes at most 12 m/);
    expect((await book({ assetId: other, placeId: bay2, startsAt: at(2), endsAt: at(1) })).status).toBe(422);
    // A class one does not teach, and a student: refused.
    expect((await book({ assetId: other, placeId: bay2, classId, startsAt: at(10), endsAt: at(11) }, stranger.cookie)).status).toBe(422);
    expect((await book({ assetId: other, placeId: bay2, startsAt: at(10), endsAt: at(11) }, learner.cookie)).status).toBe(403);

    // Moving the first booking onto the second's time is the same conflict; another class's instructor cannot see it.
    const moved = await call("PATCH", `/api/bookings/${first.booking.id}`, {
      cookie: teacher.cookie,
      json: { startsAt: at(4), endsAt: at(5) },
    });
    expect(moved.status).toBe(409);
    expect(
      (await call("PATCH", `/api/bookings/${first.booking.id}`, { cookie: stranger.cookie, json: { cancel: true, reason: "x" } })).status,
    ).toBe(404);
    expect((await call("PATCH", `/api/bookings/${first.booking.id}`, { cookie: teacher.cookie, json: { cancel: true } })).status).toBe(422);

    // A change is mailed to the class's other instructors.
    await body(await call("PATCH", `/api/bookings/${first.booking.id}`, { cookie: teacher.cookie, json: { placeId: bay2 } }), 200);
    const mail = await waitForMail(colleague.email, /^Booking moved: T-/);
    expect(mail.text).toMatch(new RegExp(`${teacher.name} changed the booking`));
    await body(
      await call("PATCH", `/api/bookings/${first.booking.id}`, {
        cookie: teacher.cookie,
        json: { cancel: true, reason: "Hangar doors under repair" },
      }),
      200,
    );
    const cancelled = await waitForMail(colleague.email, /^Booking cancelled: T-/);
    expect(cancelled.text).toMatch(/Why: Hangar doors under repair/);
    const { bookings } = await body<{ bookings: BookingDto[] }>(
      await call("GET", `/api/bookings?assetId=${aircraft}&from=${at(-24)}&to=${at(24)}`, { cookie: learner.cookie }),
      200,
    );
    expect(bookings).toHaveLength(0);
  });

  it("lets only one of several desks booking the same slot at once succeed", async () => {
    const slot = { assetId: other, placeId: bay2, startsAt: at(30), endsAt: at(32) };
    const answers = await Promise.all(
      Array.from({ length: 6 }, () => call("POST", "/api/bookings", { cookie: teacher.cookie, json: slot })),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([201, 409, 409, 409, 409, 409]);
  });
});

describe("findings", () => {
  it("files a finding sent offline as a run event once, however often the batch is sent, and only the student's instructor decides it", async () => {
    const t = tag();
    const aircraft = await makeAsset({ identifier: `F-${t}`, kind: "aircraft", model: "TX-1" });
    const { runId, stepId } = await runForLearner("Finding card");
    const findingId = randomUUID();
    const batch = {
      events: [
        { id: randomUUID(), type: "asset.named", payload: { assetIds: [aircraft, randomUUID()] }, clientTime: new Date().toISOString() },
        {
          id: findingId,
          type: "finding.filed",
          stepId,
          payload: { assetId: aircraft, text: "Crack at the lower longeron, 4 cm aft of the firewall." },
          // Stamped by a cart whose clock is a day behind: held to the receipt window.
          clientTime: new Date(Date.now() - 86_400_000).toISOString(),
        },
      ],
    };
    const send = () => call("POST", `/api/runs/${runId}/events`, { cookie: learner.cookie, json: batch });
    expect((await body<{ stored: number }>(await send(), 200)).stored).toBe(2);
    expect((await body<{ duplicates: number }>(await send(), 200)).duplicates).toBe(2);
    const again = await body<{ finding: FindingDto }>(
      await call("POST", "/api/findings", { cookie: learner.cookie, json: { id: findingId, assetId: aircraft, text: "Sent again" } }),
      200,
    );
    expect(again.finding.text).toMatch(/^Crack at the lower longeron/);
    const { findings } = await body<{ findings: FindingDto[] }>(
      await call("GET", `/api/findings?assetId=${aircraft}`, { cookie: learner.cookie }),
      200,
    );
    expect(findings).toHaveLength(1);
    expect(findings[0]).toMatchObject({ id: findingId, runId, stepNumber: 1, reportedByName: learner.name, closedAt: null });
    expect(Date.now() - Date.parse(findings[0]!.foundAt)).toBeLessThan(8 * 3_600_000 + 60_000);
    const named = await body<{ assets: { id: string }[] }>(await call("GET", `/api/runs/${runId}/assets`, { cookie: learner.cookie }), 200);
    expect(named.assets.map((a) => a.id)).toEqual([aircraft]);

    // Another student cannot file on this run; another class's instructor cannot decide.
    const other = await person("student");
    expect((await call("POST", "/api/findings", { cookie: other.cookie, json: { assetId: aircraft, runId, text: "Mine" } })).status).toBe(
      404,
    );
    expect(
      (await call("PATCH", `/api/findings/${findingId}`, { cookie: stranger.cookie, json: { decision: "fixed_in_run" } })).status,
    ).toBe(404);
    expect((await call("PATCH", `/api/findings/${findingId}`, { cookie: learner.cookie, json: { decision: "fixed_in_run" } })).status).toBe(
      403,
    );
    expect(
      (await call("PATCH", `/api/findings/${findingId}`, { cookie: teacher.cookie, json: { decision: "out_of_service" } })).status,
    ).toBe(422);
    const closed = await body<{ finding: FindingDto }>(
      await call("PATCH", `/api/findings/${findingId}`, {
        cookie: teacher.cookie,
        json: { decision: "out_of_service", note: "Cracked longeron: grounded until the structures shop repairs it." },
      }),
      200,
    );
    expect(closed.finding).toMatchObject({ decision: "out_of_service", closedByName: teacher.name });
    const { asset } = await body<{ asset: AssetDetailDto }>(await call("GET", `/api/assets/${aircraft}`, { cookie: learner.cookie }), 200);
    expect(asset.status).toBe("out_of_service");
    expect(asset.statusReason).toMatch(/grounded/);
    expect(
      (await call("PATCH", `/api/findings/${findingId}`, { cookie: teacher.cookie, json: { decision: "deferred", note: "x" } })).status,
    ).toBe(409);
  });
});

describe("an engine change from a signed-off run", () => {
  it("is written on the assets by the sign-off, naming the run, and refused when it cannot be", async () => {
    const t = tag();
    const airframe = await makeAsset({ identifier: `A-${t}`, kind: "aircraft", model: "TX-1" });
    const oldEngine = await makeAsset({ identifier: `EO-${t}`, kind: "engine", model: "TXE" });
    const newEngine = await makeAsset({ identifier: `EN-${t}`, kind: "engine", model: "TXE" });
    const { runId, stepId } = await runForLearner("Engine change card");
    const put = (changes: unknown[]) =>
      call("PUT", `/api/runs/${runId}/assets`, { cookie: learner.cookie, json: { assetIds: [airframe], changes } });
    // The old engine is not on the airframe yet: removing it cannot be.
    expect((await put([{ action: "remove", assetId: oldEngine, parentId: airframe }])).status).toBe(422);
    expect((await put([{ action: "install", assetId: airframe, parentId: oldEngine }])).status).toBe(422);
    // First put the old one on (a run of its own, signed off), then the change.
    const install = await runForLearner("Engine install card");
    await body(
      await call("PUT", `/api/runs/${install.runId}/assets`, {
        cookie: learner.cookie,
        json: { assetIds: [airframe], changes: [{ action: "install", assetId: oldEngine, parentId: airframe, position: "Engine" }] },
      }),
      200,
    );
    const finish = async (id: string, step: string) => {
      const at = (ms: number) => new Date(Date.now() + ms).toISOString();
      await body(
        await call("POST", `/api/runs/${id}/events`, {
          cookie: learner.cookie,
          json: {
            events: [
              { id: randomUUID(), type: "step.checked", stepId: step, clientTime: at(0) },
              { id: randomUUID(), type: "run.submitted", clientTime: at(1) },
            ],
          },
        }),
        200,
      );
      return call("POST", `/api/runs/${id}/sign-off`, { cookie: teacher.cookie, json: { password: teacher.password } });
    };
    // Until that run is signed off the old engine is not on the airframe, so the change cannot be named.
    const early = await put([
      { action: "install", assetId: newEngine, parentId: airframe, position: "Engine" },
      { action: "remove", assetId: oldEngine, parentId: airframe },
    ]);
    expect(early.status).toBe(422);
    expect((await finish(install.runId, install.stepId)).status).toBe(200);
    const change = await body<{ changes: { action: string }[] }>(
      await put([
        { action: "install", assetId: newEngine, parentId: airframe, position: "Engine" },
        { action: "remove", assetId: oldEngine, parentId: airframe },
      ]),
      200,
    );
    expect(change.changes.map((c) => c.action)).toEqual(["remove", "install"]);
    expect((await finish(runId, stepId)).status).toBe(200);
    const { asset } = await body<{ asset: AssetDetailDto }>(await call("GET", `/api/assets/${airframe}`, { cookie: teacher.cookie }), 200);
    expect(asset.installed.map((i) => i.id)).toEqual([newEngine]);
    const old = asset.history.find((h) => h.asset.id === oldEngine)!;
    expect(old).toMatchObject({ installedRun: { id: install.runId }, removedRun: { id: runId }, removedByName: teacher.name });
    expect(asset.history.find((h) => h.asset.id === newEngine)).toMatchObject({ installedRun: { id: runId }, removedAt: null });
    expect(asset.work.map((w) => w.runId)).toEqual(expect.arrayContaining([runId, install.runId]));
    // Signed off: what the run worked on is part of the record.
    expect((await put([])).status).toBe(409);
  });
});

describe("an assignment done in a booking", () => {
  it("names the booked asset on each run, and refuses a booking that is cancelled", async () => {
    const t = tag();
    const aircraft = await makeAsset({ identifier: `B-${t}`, kind: "aircraft", model: "TX-1" });
    const place = await makePlace({ name: `Booking bay ${t}`, kind: "bay", takes: ["aircraft"] });
    const start = new Date(Date.UTC(2027, 3, 5, 14)).toISOString();
    const end = new Date(Date.UTC(2027, 3, 5, 18)).toISOString();
    const { booking } = await body<{ booking: BookingDto }>(
      await call("POST", "/api/bookings", {
        cookie: teacher.cookie,
        json: { assetId: aircraft, placeId: place, classId, startsAt: start, endsAt: end },
      }),
      201,
    );
    const [subject] = await getDb().select().from(curriculumSubjects).limit(1);
    const content = {
      title: uniqueTitle("Booked card"),
      ataChapter: "05",
      subjectId: subject!.id,
      steps: [{ id: randomUUID(), text: "Look." }],
    };
    const { card } = await body<{ card: CardDto }>(await call("POST", "/api/cards", { cookie: teacher.cookie, json: { content } }), 201);
    await body(await call("POST", `/api/cards/${card.id}/publish`, { cookie: teacher.cookie }), 200);
    await body(
      await call("POST", "/api/assignments", {
        cookie: teacher.cookie,
        json: { cardId: card.id, studentIds: [learner.id], bookingId: booking.id },
      }),
      201,
    );
    const { work } = await body<{ work: WorkItemDto[] }>(await call("GET", "/api/my-work", { cookie: learner.cookie }), 200);
    const runId = work.find((w) => w.cardId === card.id)!.runId;
    const named = await body<{ assets: { id: string }[] }>(await call("GET", `/api/runs/${runId}/assets`, { cookie: learner.cookie }), 200);
    expect(named.assets.map((a) => a.id)).toEqual([aircraft]);
    await body(
      await call("PATCH", `/api/bookings/${booking.id}`, { cookie: teacher.cookie, json: { cancel: true, reason: "Moved to next week" } }),
      200,
    );
    const refused = await call("POST", "/api/assignments", {
      cookie: teacher.cookie,
      json: { cardId: card.id, studentIds: [learner.id], bookingId: booking.id, confirmDuplicates: true },
    });
    expect(refused.status).toBe(422);
  });
});

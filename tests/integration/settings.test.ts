// The school's time zone: only an admin sets it, a zone the server does not know is refused, and
// the cart's answers carry it so times are told on the school's clock, offline too.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { call, demo, signIn } from "../support/http";

let admin: string;
let student: string;
let before: string;
let plannedBefore: Record<string, number>;

beforeAll(async () => {
  admin = await signIn(demo.admin);
  student = await signIn(demo.student);
  const { settings } = (await (await call("GET", "/api/settings", { cookie: student })).json()) as {
    settings: { timeZone: string; plannedHours: Record<string, number> };
  };
  before = settings.timeZone;
  plannedBefore = settings.plannedHours;
});
afterAll(async () => {
  const plannedHours = Object.fromEntries(["General", "Airframe", "Powerplant"].map((s) => [s, plannedBefore[s] ?? null]));
  await call("PUT", "/api/settings", { cookie: admin, json: { timeZone: before, plannedHours } });
});

describe("the school's time zone", () => {
  it("is set by an admin only, to a zone that exists, and reaches the cart's answers", async () => {
    expect(before).toBe("America/Chicago"); // the demo seed's
    expect((await call("PUT", "/api/settings", { cookie: student, json: { timeZone: "Europe/Oslo" } })).status).toBe(403);
    const bad = await call("PUT", "/api/settings", { cookie: admin, json: { timeZone: "Mars/Olympus" } });
    expect(bad.status).toBe(422);
    expect(((await bad.json()) as { error: { fields: Record<string, string> } }).error.fields.timeZone).toMatch(/time zone/);
    expect((await call("PUT", "/api/settings", { cookie: admin, json: { timeZone: "x\u0000y" } })).status).toBe(422);
    const saved = await call("PUT", "/api/settings", { cookie: admin, json: { timeZone: "Europe/Oslo" } });
    expect(saved.status).toBe(200);
    expect(await saved.json()).toMatchObject({ settings: { timeZone: "Europe/Oslo" } });
    const work = (await (await call("GET", "/api/my-work", { cookie: student })).json()) as { timeZone: string };
    expect(work.timeZone).toBe("Europe/Oslo");
  });

  it("keeps the planned hours per section: a section sent changes, null drops its plan, the others stay", async () => {
    expect(plannedBefore.General).toBeGreaterThan(0); // the demo seed plans every section
    const put = (json: unknown) => call("PUT", "/api/settings", { cookie: admin, json });
    const saved = await put({ plannedHours: { General: 420 } });
    expect(saved.status).toBe(200);
    const { settings } = (await saved.json()) as { settings: { plannedHours: Record<string, number> } };
    expect(settings.plannedHours).toEqual({ ...plannedBefore, General: 420 });
    const dropped = (await (await put({ plannedHours: { Powerplant: null } })).json()) as {
      settings: { plannedHours: Record<string, number> };
    };
    expect(dropped.settings.plannedHours.Powerplant).toBeUndefined();
    expect(dropped.settings.plannedHours.General).toBe(420);
    for (const bad of [
      { plannedHours: { Avionics: 10 } },
      { plannedHours: { General: -1 } },
      { plannedHours: { General: 1.5 } },
      { plannedHours: { General: "400" } },
      { plannedHours: { General: 1e9 } },
      { plannedHours: [] },
      {},
    ]) {
      const refused = await put(bad);
      expect(refused.status, JSON.stringify(bad)).toBe(422);
    }
    expect((await call("PUT", "/api/settings", { cookie: student, json: { plannedHours: { General: 1 } } })).status).toBe(403);
  });
});

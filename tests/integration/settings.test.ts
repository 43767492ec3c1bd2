// The school's time zone: only an admin sets it, a zone the server does not know is refused, and
// the cart's answers carry it so times are told on the school's clock, offline too.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { call, demo, signIn } from "../support/http";

let admin: string;
let student: string;
let before: string;

beforeAll(async () => {
  admin = await signIn(demo.admin);
  student = await signIn(demo.student);
  before = ((await (await call("GET", "/api/settings", { cookie: student })).json()) as { settings: { timeZone: string } }).settings
    .timeZone;
});
afterAll(async () => {
  await call("PUT", "/api/settings", { cookie: admin, json: { timeZone: before } });
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
    expect(await saved.json()).toEqual({ settings: { timeZone: "Europe/Oslo" } });
    const work = (await (await call("GET", "/api/my-work", { cookie: student })).json()) as { timeZone: string };
    expect(work.timeZone).toBe("Europe/Oslo");
  });
});

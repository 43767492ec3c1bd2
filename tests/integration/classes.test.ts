import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { call, demo, makeAccount, signIn } from "../support/http";

let admin: string;
beforeAll(async () => {
  admin = await signIn(demo.admin);
});

async function newClass(name = `Test class ${randomUUID().slice(0, 8)}`) {
  const response = await call("POST", "/api/classes", { cookie: admin, json: { name, startsOn: "2026-09-01", endsOn: "2027-06-30" } });
  expect(response.status).toBe(201);
  return ((await response.json()) as { class: { id: string; name: string } }).class;
}

describe("classes", () => {
  it("refuses a second class of the same name and one that ends before it starts", async () => {
    const made = await newClass();
    expect((await call("POST", "/api/classes", { cookie: admin, json: { name: made.name } })).status).toBe(409);
    const backwards = await call("POST", "/api/classes", {
      cookie: admin,
      json: { name: `${made.name} b`, startsOn: "2027-01-01", endsOn: "2026-01-01" },
    });
    expect(backwards.status).toBe(422);
    expect(((await backwards.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty("endsOn");
    const patch = await call("PATCH", `/api/classes/${made.id}`, { cookie: admin, json: { endsOn: "2020-01-01" } });
    expect(patch.status).toBe(422);
  });

  it("adds and removes members, and shows an instructor only their own classes", async () => {
    const made = await newClass();
    const teacher = await makeAccount("instructor");
    const other = await makeAccount("instructor");
    const learner = await makeAccount("student");
    const added = await call("POST", `/api/classes/${made.id}/members`, {
      cookie: admin,
      json: { userIds: [teacher.id, learner.id, learner.id] },
    });
    expect(added.status).toBe(200);
    expect(await added.json()).toEqual({ added: 2 });
    // Adding again changes nothing.
    expect(
      await (await call("POST", `/api/classes/${made.id}/members`, { cookie: admin, json: { userIds: [learner.id] } })).json(),
    ).toEqual({ added: 0 });

    const teacherCookie = await signIn(teacher.email, teacher.password);
    const list = (await (await call("GET", "/api/classes", { cookie: teacherCookie })).json()) as {
      classes: { id: string; students: number; staff: number }[];
    };
    expect(list.classes.map((c) => c.id)).toEqual([made.id]);
    expect(list.classes[0]).toMatchObject({ students: 1, staff: 1 });
    const detail = (await (await call("GET", `/api/classes/${made.id}`, { cookie: teacherCookie })).json()) as {
      class: { members: { id: string }[] };
    };
    expect(detail.class.members.map((m) => m.id).sort()).toEqual([teacher.id, learner.id].sort());

    const otherCookie = await signIn(other.email, other.password);
    expect((await call("GET", `/api/classes/${made.id}`, { cookie: otherCookie })).status).toBe(404);
    expect(((await (await call("GET", "/api/classes", { cookie: otherCookie })).json()) as { classes: unknown[] }).classes).toEqual([]);

    expect((await call("DELETE", `/api/classes/${made.id}/members/${learner.id}`, { cookie: admin })).status).toBe(200);
    expect((await call("DELETE", `/api/classes/${made.id}/members/${learner.id}`, { cookie: admin })).status).toBe(404);
  });

  it("refuses members that do not exist", async () => {
    const made = await newClass();
    const response = await call("POST", `/api/classes/${made.id}/members`, { cookie: admin, json: { userIds: [randomUUID()] } });
    expect(response.status).toBe(422);
    expect((await call("POST", `/api/classes/${made.id}/members`, { cookie: admin, json: { userIds: ["not-an-id"] } })).status).toBe(422);
  });
});

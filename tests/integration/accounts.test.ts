import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { auditEvents, users } from "@/db/schema";
import { call, demo, fakeAddress, linkIn, signIn, waitForMail } from "../support/http";

let admin: string;
beforeAll(async () => {
  admin = await signIn(demo.admin);
});

const newEmail = () => `invitee-${randomUUID().slice(0, 8)}@test.hangarleaf.test`;

describe("accounts", () => {
  it("invites a person by mail, whose link sets a password once", async () => {
    const email = newEmail();
    const created = await call("POST", "/api/users", { cookie: admin, json: { name: "Casey Marr", email, role: "instructor" } });
    expect(created.status).toBe(201);
    const { user } = (await created.json()) as { user: { id: string; status: string } };
    expect(user.status).toBe("invited");
    expect(user).not.toHaveProperty("passwordHash");

    const mail = await waitForMail(email, /invited/i);
    const link = new URL(linkIn(mail.text));
    const token = link.pathname.split("/").pop()!;

    // The link opens the page that sets the password.
    const page = await call("GET", link.pathname);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("Casey Marr");

    expect((await call("POST", "/api/password", { json: { token, password: "short" } })).status).toBe(422);
    const set = await call("POST", "/api/password", { json: { token, password: "rivet-gun-bucking-bar" } });
    expect(set.status).toBe(200);
    const cookie = await signIn(email, "rivet-gun-bucking-bar");
    const me = (await (await call("GET", "/api/session", { cookie })).json()) as { user: { role: string } };
    expect(me.user.role).toBe("instructor");

    // Once only.
    const again = await call("POST", "/api/password", { json: { token, password: "another-long-password" } });
    expect(again.status).toBe(422);
    expect(((await again.json()) as { error: { message: string } }).error.message).toMatch(/expired or was already used/);

    // Both moments are in the audit log; no order is asked of the rows (they may share a timestamp).
    const audit = await getDb().select().from(auditEvents).where(eq(auditEvents.subjectId, user.id));
    expect(audit.map((row) => row.action)).toEqual(expect.arrayContaining(["account.invited", "account.invitation_accepted"]));
  });

  it("creates an account with a first password, and refuses a second one for the same e-mail", async () => {
    const email = newEmail();
    const first = await call("POST", "/api/users", {
      cookie: admin,
      json: { name: "Lee Ortiz", email, role: "student", password: "first-password-ok" },
    });
    expect(first.status).toBe(201);
    await signIn(email, "first-password-ok");
    const second = await call("POST", "/api/users", {
      cookie: admin,
      json: { name: "Lee Again", email: email.toUpperCase(), role: "admin" },
    });
    expect(second.status).toBe(409);
    const [row] = await getDb().select({ name: users.name, role: users.role }).from(users).where(eq(users.email, email));
    expect(row).toEqual({ name: "Lee Ortiz", role: "student" }); // nothing stored was lost
  });

  it("names the wrong fields", async () => {
    const response = await call("POST", "/api/users", { cookie: admin, json: { name: "", email: "nope", role: "pilot", password: "x" } });
    expect(response.status).toBe(422);
    const { error } = (await response.json()) as { error: { fields: Record<string, string> } };
    expect(Object.keys(error.fields).sort()).toEqual(["email", "name", "password", "role"]);
  });

  it("changes a role and ends that person's session", async () => {
    const email = newEmail();
    const created = (await (
      await call("POST", "/api/users", { cookie: admin, json: { name: "Rae Kim", email, role: "student", password: "a-good-password" } })
    ).json()) as { user: { id: string } };
    const cookie = await signIn(email, "a-good-password");
    const patched = await call("PATCH", `/api/users/${created.user.id}`, { cookie: admin, json: { role: "librarian" } });
    expect(patched.status).toBe(200);
    expect(((await patched.json()) as { user: { role: string } }).user.role).toBe("librarian");
    expect((await call("GET", "/api/session", { cookie })).status).toBe(401);
    const fresh = await signIn(email, "a-good-password");
    expect(((await (await call("GET", "/api/session", { cookie: fresh })).json()) as { user: { role: string } }).user.role).toBe(
      "librarian",
    );
  });

  it("keeps an admin from locking themself out", async () => {
    const me = (await (await call("GET", "/api/session", { cookie: admin })).json()) as { user: { id: string } };
    expect((await call("PATCH", `/api/users/${me.user.id}`, { cookie: admin, json: { status: "deactivated" } })).status).toBe(409);
    expect((await call("PATCH", `/api/users/${me.user.id}`, { cookie: admin, json: { role: "student" } })).status).toBe(409);
    expect((await call("PATCH", `/api/users/${me.user.id}`, { cookie: admin, json: {} })).status).toBe(422);
    expect((await call("PATCH", "/api/users/not-a-uuid", { cookie: admin, json: { name: "x" } })).status).toBe(404);
  });

  it("resends an invitation, and the older link stops working", async () => {
    const email = newEmail();
    const created = (await (
      await call("POST", "/api/users", { cookie: admin, json: { name: "Ash Penn", email, role: "student" } })
    ).json()) as { user: { id: string } };
    const firstToken = new URL(linkIn((await waitForMail(email, /invited/i)).text)).pathname.split("/").pop()!;
    const resent = await call("POST", `/api/users/${created.user.id}/invitation`, { cookie: admin });
    expect(resent.status).toBe(202);
    await expect
      .poll(
        async () => {
          const { messages } = (await (await fetch(`${process.env.HL_OUTBOX_URL}/messages`)).json()) as { messages: { to: string[] }[] };
          return messages.filter((m) => m.to.includes(email)).length;
        },
        { timeout: 20_000 },
      )
      .toBe(2);
    expect((await call("POST", "/api/password", { json: { token: firstToken, password: "first-link-password" } })).status).toBe(422);
  });

  it("mails a reset link to a known address and says the same for an unknown one", async () => {
    const email = newEmail();
    await call("POST", "/api/users", { cookie: admin, json: { name: "Dev Ross", email, role: "student", password: "old-password-here" } });
    const known = await call("POST", "/api/password-resets", { json: { email }, headers: fakeAddress() });
    const unknown = await call("POST", "/api/password-resets", { json: { email: newEmail() }, headers: fakeAddress() });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(await known.json()).toEqual(await unknown.json());

    const token = new URL(linkIn((await waitForMail(email, /reset/i)).text)).pathname.split("/").pop()!;
    expect((await call("POST", "/api/password", { json: { token, password: "new-password-here" } })).status).toBe(200);
    await signIn(email, "new-password-here");
    const old = await call("POST", "/api/session", { json: { email, password: "old-password-here" }, headers: fakeAddress() });
    expect(old.status).toBe(401);
  });
});

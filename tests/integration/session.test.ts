import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { users } from "@/db/schema";
import { throttlePolicy } from "@/lib/auth/throttle";
import { call, demo, fakeAddress, makeAccount, sessionCookie, signIn } from "../support/http";

describe("signing in", () => {
  it("answers 200 with the user and a sealed, httpOnly, SameSite=Lax cookie", async () => {
    const account = await makeAccount("student", "Pat Rivera");
    const response = await call("POST", "/api/session", { json: { email: account.email.toUpperCase(), password: account.password } });
    expect(response.status).toBe(200);
    expect(await response.json()).toEqual({ user: { id: account.id, email: account.email, name: "Pat Rivera", role: "student" } });
    const setCookie = response.headers.getSetCookie().find((c) => c.startsWith("hangarleaf_session="))!;
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    expect(setCookie).not.toContain(account.id); // sealed, not readable

    const me = await call("GET", "/api/session", { cookie: sessionCookie(response) });
    expect(me.status).toBe(200);
    expect(((await me.json()) as { user: { email: string } }).user.email).toBe(account.email);
  });

  it("gives a wrong password and an unknown e-mail the same answer", async () => {
    const account = await makeAccount("student");
    const wrong = await call("POST", "/api/session", { json: { email: account.email, password: "not-the-password" }, headers: fakeAddress() });
    const unknown = await call("POST", "/api/session", { json: { email: "nobody-here@hangarleaf.test", password: "whatever-it-is" }, headers: fakeAddress() });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(await wrong.json()).toEqual(await unknown.json());
  });

  it("slows down an account after repeated failures, even with the right password", async () => {
    const account = await makeAccount("student");
    for (let i = 0; i < throttlePolicy.accountFreeFailures; i++) {
      const r = await call("POST", "/api/session", { json: { email: account.email, password: `wrong-${i}-password` }, headers: fakeAddress() });
      expect(r.status).toBe(401);
    }
    const blocked = await call("POST", "/api/session", { json: { email: account.email, password: account.password }, headers: fakeAddress() });
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(((await blocked.json()) as { error: { code: string } }).error.code).toBe("rate_limited");
  });

  it("slows down one address that tries many accounts", async () => {
    const address = fakeAddress();
    const account = await makeAccount("student");
    for (let i = 0; i < throttlePolicy.addressFreeFailures; i++) {
      await call("POST", "/api/session", { json: { email: `spray-${i}@hangarleaf.test`, password: "guess-guess" }, headers: address });
    }
    const blocked = await call("POST", "/api/session", { json: { email: account.email, password: account.password }, headers: address });
    expect(blocked.status).toBe(429);
    // The same account from another address is not held up by that address.
    expect((await call("POST", "/api/session", { json: { email: account.email, password: account.password }, headers: fakeAddress() })).status).toBe(200);
  });

  it("ends the session of an account that is deactivated", async () => {
    const account = await makeAccount("student");
    const cookie = await signIn(account.email, account.password);
    const admin = await signIn(demo.admin);
    const patch = await call("PATCH", `/api/users/${account.id}`, { cookie: admin, json: { status: "deactivated" } });
    expect(patch.status).toBe(200);
    expect((await call("GET", "/api/session", { cookie })).status).toBe(401);
    expect((await call("POST", "/api/session", { json: { email: account.email, password: account.password }, headers: fakeAddress() })).status).toBe(401);
  });

  it("signs out", async () => {
    const response = await call("DELETE", "/api/session", { cookie: await signIn(demo.student) });
    expect(response.status).toBe(204);
    const cleared = response.headers.getSetCookie().find((c) => c.startsWith("hangarleaf_session="));
    expect(cleared).toMatch(/Max-Age=0|Expires=Thu, 01 Jan 1970/i);
  });

  it("refuses bodies that are not JSON, too large or incomplete", async () => {
    expect((await call("POST", "/api/session", { body: "email=a", headers: { "content-type": "application/x-www-form-urlencoded" } })).status).toBe(415);
    expect((await call("POST", "/api/session", { body: "{not json", headers: { "content-type": "application/json" } })).status).toBe(400);
    expect((await call("POST", "/api/session", { json: { email: "a@b.test", password: "x".repeat(70_000) } })).status).toBe(413);
    const missing = await call("POST", "/api/session", { json: { email: "a@b.test" } });
    expect(missing.status).toBe(422);
    expect(((await missing.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty("password");
  });

  it("records the time of the last sign-in", async () => {
    const account = await makeAccount("librarian");
    await signIn(account.email, account.password);
    const [row] = await getDb().select({ at: users.lastSignInAt }).from(users).where(eq(users.id, account.id));
    expect(row?.at).toBeInstanceOf(Date);
  });
});

describe("health", () => {
  it("answers when the database does", async () => {
    const response = await call("GET", "/api/health");
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ status: "ok", database: "ok" });
  });
});

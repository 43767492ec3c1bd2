import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db";
import { users } from "@/db/schema";
import { throttlePolicy } from "@/lib/domain/access/throttle";
import { call, demo, fakeAddress, makeAccount, sessionCookie, signIn } from "../support/http";
import { sessionCookieName } from "@/lib/server/auth/cookie";

describe("signing in", () => {
  it("answers 200 with the user and a sealed, httpOnly, SameSite=Lax cookie", async () => {
    const account = await makeAccount("student", "Pat Rivera");
    const response = await call("POST", "/api/session", { json: { email: account.email.toUpperCase(), password: account.password } });
    expect(response.status).toBe(200);
    expect(await response.json()).toEqual({ user: { id: account.id, email: account.email, name: "Pat Rivera", role: "student" } });
    const setCookie = response.headers.getSetCookie().find((c) => c.startsWith(`${sessionCookieName}=`))!;
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    expect(setCookie).not.toContain(account.id); // sealed, not readable

    const me = await call("GET", "/api/session", { cookie: sessionCookie(response) });
    expect(me.status).toBe(200);
    expect(((await me.json()) as { user: { email: string } }).user.email).toBe(account.email);
  });

  it("gives a wrong password and an unknown e-mail the same answer", async () => {
    const account = await makeAccount("student");
    const wrong = await call("POST", "/api/session", {
      json: { email: account.email, password: "not-the-password" },
      headers: fakeAddress(),
    });
    const unknown = await call("POST", "/api/session", {
      json: { email: "nobody-here@hangarleaf.test", password: "whatever-it-is" },
      headers: fakeAddress(),
    });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(await wrong.json()).toEqual(await unknown.json());
  });

  it("slows down the one guessing at an account, even with the right password, but not the real person elsewhere", async () => {
    const account = await makeAccount("student");
    const guesser = fakeAddress();
    for (let i = 0; i < throttlePolicy.pair.free; i++) {
      const r = await call("POST", "/api/session", { json: { email: account.email, password: `wrong-${i}-password` }, headers: guesser });
      expect(r.status).toBe(401);
    }
    const blocked = await call("POST", "/api/session", { json: { email: account.email, password: account.password }, headers: guesser });
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(((await blocked.json()) as { error: { code: string } }).error.code).toBe("rate_limited");
    // A stranger's wrong passwords do not lock the account: its owner signs in from their own place.
    expect(
      (await call("POST", "/api/session", { json: { email: account.email, password: account.password }, headers: fakeAddress() })).status,
    ).toBe(200);
  });

  it("lets no more than the free attempts through when many are sent at once", async () => {
    const account = await makeAccount("student");
    const guesser = fakeAddress();
    const answers = await Promise.all(
      Array.from({ length: 30 }, (_, i) =>
        call("POST", "/api/session", { json: { email: account.email, password: `guess-${i}-wrong` }, headers: guesser }),
      ),
    );
    const checked = answers.filter((a) => a.status === 401).length;
    expect(checked).toBeLessThanOrEqual(throttlePolicy.pair.free);
    expect(answers.filter((a) => a.status === 429).length).toBe(30 - checked);
  });

  it("throttles password-reset requests per address and per account", async () => {
    const address = fakeAddress();
    const ask = (email: string, headers = address) => call("POST", "/api/password-resets", { json: { email }, headers });
    for (let i = 0; i < throttlePolicy.resetAccount.free; i++)
      expect((await ask("reset-flood@hangarleaf.test", fakeAddress())).status).toBe(202);
    const tooMany = await ask("reset-flood@hangarleaf.test", fakeAddress());
    expect(tooMany.status).toBe(429);
    expect(Number(tooMany.headers.get("retry-after"))).toBeGreaterThan(0);
    for (let i = 0; i < throttlePolicy.resetAddress.free; i++)
      expect((await ask(`reset-${i}-${Date.now()}@hangarleaf.test`)).status).toBe(202);
    expect((await ask(`reset-last-${Date.now()}@hangarleaf.test`)).status).toBe(429);
  });

  it("slows down one address that tries many accounts", async () => {
    const address = fakeAddress();
    const account = await makeAccount("student");
    for (let i = 0; i < throttlePolicy.address.free; i++) {
      await call("POST", "/api/session", { json: { email: `spray-${i}@hangarleaf.test`, password: "guess-guess" }, headers: address });
    }
    const blocked = await call("POST", "/api/session", { json: { email: account.email, password: account.password }, headers: address });
    expect(blocked.status).toBe(429);
    // The same account from another address is not held up by that address.
    expect(
      (await call("POST", "/api/session", { json: { email: account.email, password: account.password }, headers: fakeAddress() })).status,
    ).toBe(200);
  });

  it("ends the session of an account that is deactivated", async () => {
    const account = await makeAccount("student");
    const cookie = await signIn(account.email, account.password);
    const admin = await signIn(demo.admin);
    const patch = await call("PATCH", `/api/users/${account.id}`, { cookie: admin, json: { status: "deactivated" } });
    expect(patch.status).toBe(200);
    expect((await call("GET", "/api/session", { cookie })).status).toBe(401);
    expect(
      (await call("POST", "/api/session", { json: { email: account.email, password: account.password }, headers: fakeAddress() })).status,
    ).toBe(401);
  });

  it("signs out, and the old cookie replayed afterwards is refused", async () => {
    const cookie = await signIn(demo.student);
    const other = await signIn(demo.student); // the same person on another cart
    expect((await call("GET", "/api/session", { cookie })).status).toBe(200);
    const response = await call("DELETE", "/api/session", { cookie });
    expect(response.status).toBe(204);
    const cleared = response.headers.getSetCookie().find((c) => c.startsWith(`${sessionCookieName}=`));
    expect(cleared).toMatch(/Max-Age=0|Expires=Thu, 01 Jan 1970/i);
    expect((await call("GET", "/api/session", { cookie })).status).toBe(401);
    expect((await call("GET", "/api/my-work", { cookie })).status).toBe(401);
    // Only that session ended.
    expect((await call("GET", "/api/session", { cookie: other })).status).toBe(200);
  });

  it("refuses bodies that are not JSON, too large or incomplete", async () => {
    expect(
      (await call("POST", "/api/session", { body: "email=a", headers: { "content-type": "application/x-www-form-urlencoded" } })).status,
    ).toBe(415);
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

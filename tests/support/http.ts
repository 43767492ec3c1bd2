// Helpers for integration tests: HTTP against the server `npm test` started, and direct writes to
// its database for setting up accounts. Each test makes its own accounts, so tests stay apart.
import { randomUUID } from "node:crypto";
import { getDb } from "@/db";
import { users } from "@/db/schema";
import { hashPassword } from "@/lib/server/auth/password";
import type { Role } from "@/lib/domain/access/permissions";
import { sessionCookieName } from "@/lib/server/auth/cookie";

export const baseUrl = process.env.HL_BASE_URL ?? "http://localhost:3000";
export const outboxUrl = process.env.HL_OUTBOX_URL ?? "http://127.0.0.1:2526";
export const demoPassword = process.env.HL_DEMO_PASSWORD ?? "hangarleaf-demo";

export const demo = {
  admin: "admin@hangarleaf.test",
  instructor: "instructor@hangarleaf.test",
  librarian: "librarian@hangarleaf.test",
  student: "student@hangarleaf.test",
} as const satisfies Record<Role, string>;

export interface CallOptions {
  cookie?: string;
  json?: unknown;
  body?: BodyInit;
  headers?: Record<string, string>;
}

export async function call(method: string, path: string, options: CallOptions = {}): Promise<Response> {
  const headers: Record<string, string> = { ...options.headers };
  if (options.cookie) headers.cookie = options.cookie;
  let body = options.body;
  if (options.json !== undefined) {
    headers["content-type"] ??= "application/json";
    body = JSON.stringify(options.json);
  }
  return fetch(`${baseUrl}${path}`, { method, headers, body, redirect: "manual" });
}

export function sessionCookie(response: Response): string {
  const cookie = response.headers.getSetCookie().find((c) => c.startsWith(`${sessionCookieName}=`));
  if (!cookie) throw new Error(`no session cookie in the answer (status ${response.status})`);
  return cookie.split(";")[0]!;
}

export async function signIn(email: string, password = demoPassword, headers: Record<string, string> = {}): Promise<string> {
  const response = await call("POST", "/api/session", { json: { email, password }, headers });
  if (response.status !== 200) throw new Error(`sign-in of ${email} answered ${response.status}: ${await response.text()}`);
  return sessionCookie(response);
}

/** A fresh active account with a known password, written straight to the database. */
export async function makeAccount(role: Role, name = `Test ${role}`) {
  const email = `${role}-${randomUUID().slice(0, 8)}@test.hangarleaf.test`;
  const password = `pw-${randomUUID()}`;
  const [row] = await getDb()
    .insert(users)
    .values({ email, name, role, status: "active", passwordHash: await hashPassword(password) })
    .returning({ id: users.id });
  return { id: row!.id, email, password, name };
}

interface OutboxMessage {
  id: string;
  to: string[];
  subject: string;
  text: string;
}

/** Waits for a mail to reach the fake SMTP server (it goes there through the job queue). */
export async function waitForMail(to: string, subject: RegExp, seconds = 20): Promise<OutboxMessage> {
  const deadline = Date.now() + seconds * 1000;
  while (Date.now() < deadline) {
    const { messages } = (await (await fetch(`${outboxUrl}/messages`)).json()) as { messages: OutboxMessage[] };
    const found = messages.find((m) => m.to.includes(to) && subject.exec(m.subject) !== null);
    if (found) return found;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`no mail "${subject}" to ${to} within ${seconds} s`);
}

export function linkIn(text: string): string {
  const link = /https?:\/\/\S+\/set-password\/[\w-]+/.exec(text)?.[0];
  if (!link) throw new Error("no set-password link in the mail");
  return link;
}

/** A made-up client address, so throttling tests do not slow down the other tests' address. */
export function fakeAddress(): Record<string, string> {
  const n = () => Math.floor(Math.random() * 250) + 1;
  return { "x-forwarded-for": `198.51.100.${n()}, 203.0.113.${n()}` };
}

import "server-only";
import { and, eq, gt, lt } from "drizzle-orm";
import { getIronSession, unsealData, type SessionOptions } from "iron-session";
import { cookies } from "next/headers";
import { forbidden, redirect } from "next/navigation";
import { getDb } from "@/db";
import { userSessions, users } from "@/db/schema";
import { getEnv } from "@/lib/server/env";
import { assertCan, assertSignedIn, can, type Permission, type Role } from "@/lib/domain/access/permissions";
import { sessionCookieName } from "@/lib/server/auth/cookie";
import { createSealCache } from "@/lib/server/auth/seal-cache";

export interface SessionData {
  userId?: string;
  version?: number;
  /** The `user_sessions` row: deleted at sign-out, so the cookie stops working everywhere at once. */
  sid?: string;
}

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

export { sessionCookieName };

function sessionOptions(): SessionOptions {
  const env = getEnv();
  return {
    password: env.HL_SESSION_SECRET,
    cookieName: sessionCookieName,
    ttl: sessionSeconds,
    cookieOptions: {
      httpOnly: true,
      sameSite: "lax",
      secure: env.APP_URL.startsWith("https://"),
      path: "/",
    },
  };
}

async function getSession() {
  return getIronSession<SessionData>(await cookies(), sessionOptions());
}

const sessionSeconds = 12 * 3600; // one long shop day

const sealed = createSealCache<SessionData>(
  (seal) => {
    const options = sessionOptions();
    return unsealData<SessionData>(seal, { password: options.password, ttl: options.ttl });
  },
  { isEmpty: (data) => !data.userId },
);

/** The session cookie's data, unsealed at most once per cookie value (see seal-cache.ts). */
async function readSession(): Promise<SessionData> {
  const seal = (await cookies()).get(sessionCookieName)?.value;
  return seal ? sealed.unseal(seal) : {};
}

/**
 * The signed-in user, read fresh from the database on every request with the session's own row: a
 * deactivated account, a changed password or a sign-out ends the session at once, which a cookie
 * alone could not do.
 */
export async function getCurrentUser(): Promise<SessionUser | null> {
  const session = await readSession();
  if (!session.userId || !session.sid) return null;
  const [row] = await getDb()
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      status: users.status,
      sessionVersion: users.sessionVersion,
    })
    .from(userSessions)
    .innerJoin(users, eq(users.id, userSessions.userId))
    .where(and(eq(userSessions.id, session.sid), eq(userSessions.userId, session.userId), gt(userSessions.expiresAt, new Date())))
    .limit(1);
  if (!row || row.status !== "active" || row.sessionVersion !== session.version) return null;
  return { id: row.id, email: row.email, name: row.name, role: row.role };
}

export async function startSession(user: { id: string; sessionVersion: number }): Promise<void> {
  const db = getDb();
  await db.delete(userSessions).where(and(eq(userSessions.userId, user.id), lt(userSessions.expiresAt, new Date())));
  const [row] = await db
    .insert(userSessions)
    .values({ userId: user.id, expiresAt: new Date(Date.now() + sessionSeconds * 1000) })
    .returning({ id: userSessions.id });
  const session = await getSession();
  session.userId = user.id;
  session.version = user.sessionVersion;
  session.sid = row!.id;
  await session.save();
}

/** Ends this session on the server (its row goes) and clears the cookie. */
export async function endSession(): Promise<void> {
  const data = await readSession();
  if (data.sid) await getDb().delete(userSessions).where(eq(userSessions.id, data.sid));
  const session = await getSession();
  session.destroy();
}

/** For route handlers: 401 when nobody is signed in, 403 without the permission. */
export async function requireApiUser(permission?: Permission): Promise<SessionUser> {
  const user = await getCurrentUser();
  assertSignedIn(user);
  if (permission) assertCan(user, permission);
  return user;
}

/** For pages: to sign-in when nobody is signed in, the 403 page without the permission. */
export async function requirePageUser(permission?: Permission, from = "/"): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) redirect(`/sign-in?next=${encodeURIComponent(from)}`);
  if (permission && !can(user, permission)) forbidden();
  return user;
}

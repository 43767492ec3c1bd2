import "server-only";
import { eq } from "drizzle-orm";
import { getIronSession, unsealData, type SessionOptions } from "iron-session";
import { cookies } from "next/headers";
import { forbidden, redirect } from "next/navigation";
import { getDb } from "@/db";
import { users } from "@/db/schema";
import { getEnv } from "../env";
import { assertCan, assertSignedIn, can, type Permission, type Role } from "./permissions";
import { createSealCache } from "./seal-cache";

export interface SessionData {
  userId?: string;
  version?: number;
}

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

export const sessionCookieName = "hangarleaf_session";

function sessionOptions(): SessionOptions {
  const env = getEnv();
  return {
    password: env.HL_SESSION_SECRET,
    cookieName: sessionCookieName,
    ttl: 12 * 3600, // one long shop day
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
 * The signed-in user, read fresh from the database on every request: a deactivated account or a
 * changed password ends its sessions at once, which a cookie alone could not do.
 */
export async function getCurrentUser(): Promise<SessionUser | null> {
  const session = await readSession();
  if (!session.userId) return null;
  const [row] = await getDb()
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      status: users.status,
      sessionVersion: users.sessionVersion,
    })
    .from(users)
    .where(eq(users.id, session.userId))
    .limit(1);
  if (!row || row.status !== "active" || row.sessionVersion !== session.version) return null;
  return { id: row.id, email: row.email, name: row.name, role: row.role };
}

export async function startSession(user: { id: string; sessionVersion: number }): Promise<void> {
  const session = await getSession();
  session.userId = user.id;
  session.version = user.sessionVersion;
  await session.save();
}

export async function endSession(): Promise<void> {
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

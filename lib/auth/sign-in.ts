import "server-only";
import { eq, inArray, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { signInThrottles, users } from "@/db/schema";
import { AppError } from "../errors";
import { getDummyHash, verifyPassword } from "./password";
import { delayAfterFailures, failuresAfter, resetThrottleKeys, throttleKeys, throttlePolicy, type ThrottleRule } from "./throttle";

const wrongCredentials = "That e-mail and password do not match an active account.";

async function secondsBlocked(keys: string[], now: Date): Promise<number> {
  const rows = await getDb()
    .select({ blockedUntil: signInThrottles.blockedUntil })
    .from(signInThrottles)
    .where(inArray(signInThrottles.key, keys));
  const until = Math.max(0, ...rows.map((r) => r.blockedUntil?.getTime() ?? 0));
  return until > now.getTime() ? Math.ceil((until - now.getTime()) / 1000) : 0;
}

async function recordFailure(key: string, rule: ThrottleRule, now: Date): Promise<void> {
  const db = getDb();
  await db.transaction(async (tx) => {
    // Lock the row so two simultaneous failures both count.
    const [row] = await tx
      .select()
      .from(signInThrottles)
      .where(eq(signInThrottles.key, key))
      .for("update");
    const failures = failuresAfter(row?.failures ?? 0, row?.lastFailureAt ?? null, now);
    const delay = delayAfterFailures(failures, rule);
    const blockedUntil = delay > 0 ? new Date(now.getTime() + delay * 1000) : null;
    await tx
      .insert(signInThrottles)
      .values({ key, failures, lastFailureAt: now, blockedUntil })
      .onConflictDoUpdate({ target: signInThrottles.key, set: { failures, lastFailureAt: now, blockedUntil } });
  });
}

/**
 * Checks an e-mail and password. Unknown e-mail, wrong password, an invitation not yet taken up
 * and a deactivated account all get the same answer, so the form tells nobody which accounts exist.
 */
export async function verifySignIn({ email, password, address }: { email: string; password: string; address: string }) {
  const now = new Date();
  const keys = throttleKeys(email, address);
  const wait = await secondsBlocked([keys.pair, keys.account, keys.address], now);
  if (wait > 0) {
    throw new AppError("rate_limited", `Too many failed sign-ins. Wait ${wait} seconds, then try again.`, {
      retryAfterSeconds: wait,
    });
  }

  const [user] = await getDb()
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      status: users.status,
      passwordHash: users.passwordHash,
      sessionVersion: users.sessionVersion,
    })
    .from(users)
    .where(eq(users.email, email))
    .limit(1);

  const matches = await verifyPassword(user?.passwordHash ?? (await getDummyHash()), password);
  if (!user || !matches || user.status !== "active") {
    await recordFailure(keys.pair, throttlePolicy.pair, now);
    await recordFailure(keys.account, throttlePolicy.account, now);
    await recordFailure(keys.address, throttlePolicy.address, now);
    throw new AppError("unauthorized", wrongCredentials);
  }

  await getDb().delete(signInThrottles).where(inArray(signInThrottles.key, [keys.pair, keys.account]));
  await getDb().update(users).set({ lastSignInAt: sql`now()` }).where(eq(users.id, user.id));
  return { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
}

/**
 * Counts a password-reset request per address and per e-mail asked for (whether or not it has an
 * account, so the answer says nothing of which exist); 429 once either has asked too often.
 */
export async function throttleResetRequest({ email, address }: { email: string; address: string }): Promise<void> {
  const now = new Date();
  const keys = resetThrottleKeys(email, address);
  const wait = await secondsBlocked([keys.account, keys.address], now);
  if (wait > 0) {
    throw new AppError("rate_limited", `Too many password-reset requests. Wait ${wait} seconds, then try again.`, { retryAfterSeconds: wait });
  }
  await recordFailure(keys.account, throttlePolicy.resetAccount, now);
  await recordFailure(keys.address, throttlePolicy.resetAddress, now);
}

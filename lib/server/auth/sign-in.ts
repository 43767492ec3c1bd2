import "server-only";
import { and, eq, inArray, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { signInThrottles, users } from "@/db/schema";
import { AppError } from "@/lib/domain/errors";
import { getDummyHash, verifyPassword } from "@/lib/server/auth/password";
import {
  delayAfterFailures,
  failuresAfter,
  resetThrottleKeys,
  throttleKeys,
  throttlePolicy,
  type ThrottleRule,
} from "@/lib/domain/access/throttle";

const wrongCredentials = "That e-mail and password do not match an active account.";

/**
 * Counts one attempt on `key` before the password is checked, unless the key is blocked now, in
 * one transaction holding the key's row: of many attempts sent at once, only the free ones get
 * through to the check. Returns the seconds to wait (0 when this attempt was counted and may go on).
 */
async function reserveAttempt(key: string, rule: ThrottleRule, now: Date): Promise<number> {
  return getDb().transaction(async (tx) => {
    await tx.insert(signInThrottles).values({ key, failures: 0, lastFailureAt: now, blockedUntil: null }).onConflictDoNothing();
    const [row] = await tx.select().from(signInThrottles).where(eq(signInThrottles.key, key)).for("update");
    const blockedUntil = row?.blockedUntil?.getTime() ?? 0;
    if (blockedUntil > now.getTime()) return Math.ceil((blockedUntil - now.getTime()) / 1000);
    const failures = row && row.failures > 0 ? failuresAfter(row.failures, row.lastFailureAt, now) : 1;
    const delay = delayAfterFailures(failures, rule);
    await tx
      .update(signInThrottles)
      .set({ failures, lastFailureAt: now, blockedUntil: delay > 0 ? new Date(now.getTime() + delay * 1000) : null })
      .where(eq(signInThrottles.key, key));
    return 0;
  });
}

/**
 * Reserves the attempt on each key in turn and stops at the first one that is blocked (429 with its
 * wait); the keys before it have counted this attempt, the blocked one and those after it have not.
 */
async function reserveAll(keys: [string, ThrottleRule][], now: Date, what: string): Promise<void> {
  for (const [key, rule] of keys) {
    const wait = await reserveAttempt(key, rule, now);
    if (wait > 0)
      throw new AppError("rate_limited", `Too many ${what}. Wait ${wait} seconds, then try again.`, { retryAfterSeconds: wait });
  }
}

/**
 * Checks an e-mail and password. Unknown e-mail, wrong password, an invitation not yet taken up
 * and a deactivated account all get the same answer, so the form tells nobody which accounts exist.
 */
export async function verifySignIn({ email, password, address }: { email: string; password: string; address: string }) {
  const now = new Date();
  const keys = throttleKeys(email, address);
  // Counted as a failure before the check, so attempts sent all at once cannot slip past a block;
  // a right password takes its count back below.
  await reserveAll(
    [
      [keys.pair, throttlePolicy.pair],
      [keys.account, throttlePolicy.account],
      [keys.address, throttlePolicy.address],
    ],
    now,
    "failed sign-ins",
  );

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
    throw new AppError("unauthorized", wrongCredentials);
  }

  // The right password: this person's counts start again, and the address gets its attempt back
  // (a classroom behind one address signs in many times).
  await getDb()
    .delete(signInThrottles)
    .where(inArray(signInThrottles.key, [keys.pair, keys.account]));
  await getDb()
    .update(signInThrottles)
    .set({ failures: sql`greatest(${signInThrottles.failures} - 1, 0)`, blockedUntil: null })
    .where(and(eq(signInThrottles.key, keys.address), sql`${signInThrottles.failures} < ${throttlePolicy.address.free}`));
  await getDb()
    .update(users)
    .set({ lastSignInAt: sql`now()` })
    .where(eq(users.id, user.id));
  return { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
}

/**
 * Counts a password-reset request per address and per e-mail asked for (whether or not it has an
 * account, so the answer says nothing of which exist); 429 once either has asked too often.
 */
export async function throttleResetRequest({ email, address }: { email: string; address: string }): Promise<void> {
  const keys = resetThrottleKeys(email, address);
  await reserveAll(
    [
      [keys.address, throttlePolicy.resetAddress],
      [keys.account, throttlePolicy.resetAccount],
    ],
    new Date(),
    "password-reset requests",
  );
}

/**
 * Asks a signed-in person for their password again before a permanent act (a sign-off): the
 * session alone says someone is at the keyboard, the password says it is the instructor. Wrong
 * answers count on the account's sign-in throttle, so a borrowed session cannot guess it.
 */
export async function confirmOwnPassword({ userId, password }: { userId: string; password: string }): Promise<void> {
  const [user] = await getDb().select({ email: users.email, passwordHash: users.passwordHash }).from(users).where(eq(users.id, userId));
  if (!user) throw new AppError("unauthorized", "Sign in again.");
  const key = throttleKeys(user.email, "").account;
  await reserveAll([[key, throttlePolicy.account]], new Date(), "wrong passwords");
  if (!(await verifyPassword(user.passwordHash ?? (await getDummyHash()), password)))
    throw new AppError("invalid", "That is not your password. Type the password you sign in with.", {
      fields: { password: "Not your password." },
    });
  await getDb().delete(signInThrottles).where(eq(signInThrottles.key, key));
}

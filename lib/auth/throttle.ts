// How failed sign-ins slow down further attempts. Pure policy; lib/auth/sign-in.ts stores the
// counts in PostgreSQL so every web instance sees the same ones.

export const throttlePolicy = {
  /** Failures per account before each further attempt has to wait. */
  accountFreeFailures: 5,
  /** Failures from one address (across accounts) before it has to wait. */
  addressFreeFailures: 20,
  /** A failure older than this no longer counts. */
  windowSeconds: 15 * 60,
  baseDelaySeconds: 2,
  maxDelaySeconds: 15 * 60,
} as const;

/** Seconds to wait after `failures` failures, doubling past the free ones, capped. */
export function delayAfterFailures(failures: number, freeFailures: number): number {
  if (failures < freeFailures) return 0;
  const doublings = Math.min(failures - freeFailures, 20);
  return Math.min(throttlePolicy.baseDelaySeconds * 2 ** doublings, throttlePolicy.maxDelaySeconds);
}

/** Failures that still count: a quiet spell longer than the window starts the count again. */
export function failuresAfter(previous: number, lastFailureAt: Date | null, now: Date): number {
  if (!lastFailureAt) return 1;
  const age = (now.getTime() - lastFailureAt.getTime()) / 1000;
  return age > throttlePolicy.windowSeconds ? 1 : previous + 1;
}

export function throttleKeys(email: string, address: string) {
  return { account: `account:${email}`, address: `address:${address}` };
}

// How failed sign-ins (and password-reset requests) slow down further attempts. Pure policy;
// lib/server/auth/sign-in.ts stores the counts in PostgreSQL so every web instance sees the same ones.
//
// Failures count per account *and* address together, so the one guessing at an account from one
// place waits long, while a stranger's wrong passwords from elsewhere cannot keep the real person
// out: the account's own count (across addresses) only ever delays by a minute at most.

export interface ThrottleRule {
  /** Attempts before each further one has to wait. */
  free: number;
  /** The longest wait this count can impose, in seconds. */
  maxDelaySeconds: number;
}

export const throttlePolicy = {
  /** One account from one address: the guesser. */
  pair: { free: 5, maxDelaySeconds: 15 * 60 },
  /** One address across accounts: someone trying many accounts. */
  address: { free: 20, maxDelaySeconds: 15 * 60 },
  /** One account from everywhere: slows a spread-out guesser, never a lock-out. */
  account: { free: 30, maxDelaySeconds: 60 },
  /** Password-reset requests per address and per e-mail address asked for. */
  resetAddress: { free: 10, maxDelaySeconds: 15 * 60 },
  resetAccount: { free: 3, maxDelaySeconds: 15 * 60 },
  /** A failure older than this no longer counts. */
  windowSeconds: 15 * 60,
  baseDelaySeconds: 2,
} as const satisfies Record<string, ThrottleRule | number>;

/** Seconds to wait after `failures` failures, doubling past the free ones, capped by the rule. */
export function delayAfterFailures(failures: number, rule: ThrottleRule): number {
  if (failures < rule.free) return 0;
  const doublings = Math.min(failures - rule.free, 20);
  return Math.min(throttlePolicy.baseDelaySeconds * 2 ** doublings, rule.maxDelaySeconds);
}

/** Failures that still count: a quiet spell longer than the window starts the count again. */
export function failuresAfter(previous: number, lastFailureAt: Date | null, now: Date): number {
  if (!lastFailureAt) return 1;
  const age = (now.getTime() - lastFailureAt.getTime()) / 1000;
  return age > throttlePolicy.windowSeconds ? 1 : previous + 1;
}

export function throttleKeys(email: string, address: string) {
  return { pair: `pair:${email}|${address}`, account: `account:${email}`, address: `address:${address}` };
}

export function resetThrottleKeys(email: string, address: string) {
  return { account: `reset-account:${email}`, address: `reset-address:${address}` };
}

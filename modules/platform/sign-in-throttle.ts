/**
 * Sign-in throttling without a lock-out (the policy; the counts come from the database).
 *
 * - Per account and address pair: the first PAIR_FREE_FAILURES wrong passwords in the
 *   window cost nothing; after that each attempt from that address on that account waits
 *   a delay that doubles with every further failure (30 s, 1 min, 2 min ... at most 15 min).
 *   A guesser slows only themselves: the real user at another address is not affected.
 * - Per account, from addresses it has never signed in from: once ACCOUNT_FREE_FAILURES
 *   wrong passwords from anywhere are in the window (a guesser rotating addresses), attempts
 *   from new addresses wait the same doubling delay after the account's last failure.
 *   Addresses where the account signed in before keep their own (pair) budget, and a reset
 *   link by e-mail always gets the real user in.
 * - Per address over all accounts: MAX_FAILURES_PER_ADDRESS in the window, then wait
 *   until the oldest falls out (password spraying from one address).
 *
 * A delay applies to the next attempt whatever its password (checking the password first
 * would tell a guesser when they hit). Thresholds and delays are common practice, chosen
 * here, not taken from a standard.
 */
export const THROTTLE_WINDOW_MS = 15 * 60 * 1000;
export const PAIR_FREE_FAILURES = 5;
export const ACCOUNT_FREE_FAILURES = 10;
export const MAX_FAILURES_PER_ADDRESS = 25;
export const FIRST_DELAY_MS = 30 * 1000;
export const MAX_DELAY_MS = 15 * 60 * 1000;

export interface ThrottleCounts {
  byPair: number;
  lastByPair: Date | null;
  byAccount: number;
  lastByAccount: Date | null;
  byAddress: number;
  oldestByAddress: Date | null;
}

export type ThrottleVerdict = { allowed: true } | { allowed: false; scope: "pair" | "account" | "address"; retryAfterMs: number };

/** The delay owed after `failures` failures when `free` of them cost nothing. */
export function delayAfter(failures: number, free: number): number {
  if (failures < free) return 0;
  return Math.min(MAX_DELAY_MS, FIRST_DELAY_MS * 2 ** Math.min(20, failures - free));
}

export function judgeSignInAttempt(c: ThrottleCounts, knownAddress: boolean, now: number): ThrottleVerdict {
  if (c.byAddress >= MAX_FAILURES_PER_ADDRESS && c.oldestByAddress) {
    const wait = c.oldestByAddress.getTime() + THROTTLE_WINDOW_MS - now;
    if (wait > 0) return { allowed: false, scope: "address", retryAfterMs: wait };
  }
  if (c.lastByPair) {
    const wait = c.lastByPair.getTime() + delayAfter(c.byPair, PAIR_FREE_FAILURES) - now;
    if (wait > 0) return { allowed: false, scope: "pair", retryAfterMs: wait };
  }
  if (!knownAddress && c.lastByAccount) {
    const wait = c.lastByAccount.getTime() + delayAfter(c.byAccount, ACCOUNT_FREE_FAILURES) - now;
    if (wait > 0) return { allowed: false, scope: "account", retryAfterMs: wait };
  }
  return { allowed: true };
}

/** "about 40 seconds", "about 3 minutes": for the message. */
export function describeWait(ms: number): string {
  const s = Math.max(1, Math.ceil(ms / 1000));
  if (s < 90) return `about ${s} seconds`;
  return `about ${Math.ceil(s / 60)} minutes`;
}

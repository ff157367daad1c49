// The sign-in throttling policy: doubling delays, no lock-out of the real user.
import { describe, expect, it } from "vitest";
import { ACCOUNT_FREE_FAILURES, delayAfter, FIRST_DELAY_MS, judgeSignInAttempt, MAX_DELAY_MS, PAIR_FREE_FAILURES, type ThrottleCounts } from "@/modules/platform/sign-in-throttle";

const now = Date.parse("2026-12-02T12:00:00Z");
const quiet: ThrottleCounts = { byPair: 0, lastByPair: null, byAccount: 0, lastByAccount: null, byAddress: 0, oldestByAddress: null };

describe("sign-in throttling policy", () => {
  it("doubles the delay after the free failures, up to the cap", () => {
    expect(delayAfter(PAIR_FREE_FAILURES - 1, PAIR_FREE_FAILURES)).toBe(0);
    expect(delayAfter(PAIR_FREE_FAILURES, PAIR_FREE_FAILURES)).toBe(FIRST_DELAY_MS);
    expect(delayAfter(PAIR_FREE_FAILURES + 1, PAIR_FREE_FAILURES)).toBe(2 * FIRST_DELAY_MS);
    expect(delayAfter(PAIR_FREE_FAILURES + 40, PAIR_FREE_FAILURES)).toBe(MAX_DELAY_MS);
  });

  it("a pair over its budget waits; once the delay is over it may try again", () => {
    const c = { ...quiet, byPair: PAIR_FREE_FAILURES, lastByPair: new Date(now - 10_000), byAccount: PAIR_FREE_FAILURES, lastByAccount: new Date(now - 10_000) };
    expect(judgeSignInAttempt(c, false, now)).toMatchObject({ allowed: false, scope: "pair", retryAfterMs: FIRST_DELAY_MS - 10_000 });
    expect(judgeSignInAttempt(c, false, now + FIRST_DELAY_MS)).toEqual({ allowed: true });
  });

  it("an account under a spread attack slows new addresses, never a known one", () => {
    const c = { ...quiet, byAccount: ACCOUNT_FREE_FAILURES, lastByAccount: new Date(now - 1000) };
    expect(judgeSignInAttempt(c, false, now)).toMatchObject({ allowed: false, scope: "account" });
    expect(judgeSignInAttempt(c, true, now)).toEqual({ allowed: true });
  });
});

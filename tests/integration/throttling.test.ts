// Sign-in and forgot-password throttling: keyed on the socket address (a client's own
// X-Forwarded-For is ignored unless a proxy is trusted), slowing a guesser without
// locking the real user out, and a forgot-password answer that does the same work
// whether or not the account exists.
import { afterAll, describe, expect, it } from "vitest";
import { forgotPasswordAction, signInAction } from "@/app/(auth)/actions";
import { MAX_FAILURES_PER_ADDRESS, ACCOUNT_FREE_FAILURES, MAX_RESETS_PER_ACCOUNT, MAX_RESETS_PER_ADDRESS, PAIR_FREE_FAILURES } from "@/app/_lib/accounts-service";
import { clientAddressOf } from "@/app/_lib/client-address";
import { portFromRequest } from "@/app/_lib/request-context";
import { hashPassword } from "@/app/_lib/passwords";
import { resetMailIdle } from "@/app/_lib/reset-mail";
import { eq } from "drizzle-orm";
import { closeDb, getDb } from "@/db/client";
import { signInFailures } from "@/db/schema";
import { createUser } from "@/db/queries/accounts";
import { resetServerEnvForTests } from "@/modules/platform/env";
import { callAction, makeRequest, peer } from "./support/fixture";

const stamp = Date.now();
const password = "the right password";
// Each run its own address block, so reruns within the window do not meet old counts.
const net = `${(stamp >> 16) % 200}.${(stamp >> 8) % 250}`;

async function newUser(tag: string): Promise<string> {
  const email = `throttle-${tag}-${stamp}@example.test`;
  await createUser({ email, name: "Theo Throttle", passwordHash: await hashPassword(password) });
  return email;
}

afterAll(async () => {
  await resetMailIdle();
  await closeDb();
});

describe("the client address", () => {
  it("ignores a client's own X-Forwarded-For when no proxy is trusted (rotating it does not dodge the limit)", async () => {
    const address = `10.${net}.1`;
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i += 1) {
      const r = await callAction(signInAction, { email: `rotate-${stamp}-${i}@example.test`, password: "guess" }, null, { ...peer(address), "x-forwarded-for": `198.51.100.${i}` });
      if (!r.state.ok) expect(r.state.code).toBe("unauthenticated");
    }
    const next = await callAction(signInAction, { email: `rotate-${stamp}-last@example.test`, password: "guess" }, null, { ...peer(address), "x-forwarded-for": "198.51.100.250" });
    expect(next.state.ok).toBe(false);
    if (!next.state.ok) {
      expect(next.state.code).toBe("too_many_requests");
      expect(next.state.message).toMatch(/from your network/);
    }
  });

  it("with TRUST_PROXY=1 counts the entry the proxy appended (the last), not the client's first one", async () => {
    const saved = process.env.TRUST_PROXY;
    const email = `proxied-${stamp}@example.test`;
    try {
      process.env.TRUST_PROXY = "1";
      resetServerEnvForTests();
      const r = await callAction(signInAction, { email, password: "guess" }, null, { ...peer("10.0.0.2"), "x-forwarded-for": `6.6.6.6, 203.0.113.${stamp % 250}` });
      expect(r.state.ok).toBe(false);
      const rows = await getDb().select().from(signInFailures).where(eq(signInFailures.email, email));
      expect(rows.map((x) => x.clientAddress)).toEqual([`203.0.113.${stamp % 250}`]);
      // Two proxies: the entry the outer one appended; none: the socket.
      const port = portFromRequest(makeRequest("POST", "/", { headers: { ...peer("10.0.0.2"), "x-forwarded-for": "6.6.6.6, 203.0.113.9" } }));
      process.env.TRUST_PROXY = "2";
      resetServerEnvForTests();
      expect(clientAddressOf(port)).toBe("6.6.6.6");
      process.env.TRUST_PROXY = "0";
      resetServerEnvForTests();
      expect(clientAddressOf(port)).toBe("10.0.0.2");
    } finally {
      if (saved === undefined) delete process.env.TRUST_PROXY;
      else process.env.TRUST_PROXY = saved;
      resetServerEnvForTests();
    }
  });
});

describe("sign-in throttling", () => {
  it("slows the address that guesses, but the real user at another address signs in", async () => {
    const victim = await newUser("pair");
    const guesser = `10.${net}.2`;
    for (let i = 0; i < PAIR_FREE_FAILURES; i += 1) {
      const r = await callAction(signInAction, { email: victim, password: `wrong ${i}` }, null, peer(guesser));
      expect(r.state.ok).toBe(false);
      if (!r.state.ok) expect(r.state.code).toBe("unauthenticated");
    }
    // The guesser now waits, even with the right password (no oracle).
    const slowed = await callAction(signInAction, { email: victim, password }, null, peer(guesser));
    expect(slowed.state.ok).toBe(false);
    if (!slowed.state.ok) {
      expect(slowed.state.code).toBe("too_many_requests");
      expect(slowed.state.message).toMatch(/Try again in about \d+ seconds, or reset your password/);
    }
    const real = await callAction(signInAction, { email: victim, password }, null, peer(`10.${net}.3`));
    expect(real.state.ok).toBe(true);
  });

  it("a guesser rotating addresses slows new addresses, never one the account signed in from", async () => {
    const victim = await newUser("spread");
    const home = `10.${net}.4`;
    expect((await callAction(signInAction, { email: victim, password }, null, peer(home))).state.ok).toBe(true);
    for (let i = 0; i < ACCOUNT_FREE_FAILURES; i += 1) {
      await callAction(signInAction, { email: victim, password: `wrong ${i}` }, null, peer(`10.${net}.${100 + i}`));
    }
    const stranger = await callAction(signInAction, { email: victim, password }, null, peer(`10.${net}.99`));
    expect(stranger.state.ok).toBe(false);
    if (!stranger.state.ok) expect(stranger.state.code).toBe("too_many_requests");
    const atHome = await callAction(signInAction, { email: victim, password }, null, peer(home));
    expect(atHome.state.ok).toBe(true);
  });

  it("blocks an address that tries many accounts, but not other addresses", async () => {
    const address = `10.${net}.5`;
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i += 1) {
      await callAction(signInAction, { email: `spray-${stamp}-${i}@example.test`, password: "guess" }, null, peer(address));
    }
    const other = await newUser("fresh");
    const blocked = await callAction(signInAction, { email: other, password }, null, peer(address));
    expect(blocked.state.ok).toBe(false);
    if (!blocked.state.ok) expect(blocked.state.message).toMatch(/from your network/);
    const elsewhere = await callAction(signInAction, { email: other, password }, null, peer(`10.${net}.6`));
    expect(elsewhere.state.ok).toBe(true);
  });
});

describe("forgot-password", () => {
  it("is throttled per address", async () => {
    const address = `10.${net}.7`;
    for (let i = 0; i < MAX_RESETS_PER_ADDRESS; i += 1) {
      const r = await callAction(forgotPasswordAction, { email: `nobody-${stamp}-${i}@example.test` }, null, peer(address));
      expect(r.state.ok).toBe(true);
    }
    const r = await callAction(forgotPasswordAction, { email: `nobody-${stamp}-x@example.test` }, null, peer(address));
    expect(r.state.ok).toBe(false);
    if (!r.state.ok) expect(r.state.code).toBe("too_many_requests");
  });

  it("is throttled per target account, alike for a known and an unknown address", async () => {
    const known = await newUser("reset-flood");
    const unknown = `reset-flood-none-${stamp}@example.test`;
    const answers: Record<string, string[]> = { known: [], unknown: [] };
    for (const [kind, email] of [["known", known], ["unknown", unknown]] as const) {
      for (let i = 0; i <= MAX_RESETS_PER_ACCOUNT; i += 1) {
        const r = await callAction(forgotPasswordAction, { email }, null, peer(`10.${net}.${kind === "known" ? 20 + i : 40 + i}`));
        answers[kind]!.push(r.state.ok ? "ok" : r.state.code);
      }
    }
    const expected = [...Array<string>(MAX_RESETS_PER_ACCOUNT).fill("ok"), "too_many_requests"];
    expect(answers.known).toEqual(expected);
    expect(answers.unknown).toEqual(expected);
  });

  it("answers a known address in the time of an unknown one (no lookup, no SMTP on the request path)", async () => {
    const times: Record<"known" | "unknown", number[]> = { known: [], unknown: [] };
    for (let i = 0; i < 7; i += 1) {
      const known = await newUser(`timing-${i}`);
      for (const [kind, email] of [["known", known], ["unknown", `timing-none-${i}-${stamp}@example.test`]] as const) {
        await resetMailIdle();
        const t0 = performance.now();
        const r = await callAction(forgotPasswordAction, { email }, null, peer(`10.${net}.${60 + i * 2 + (kind === "known" ? 0 : 1)}`));
        times[kind].push(performance.now() - t0);
        expect(r.state.ok).toBe(true);
      }
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
    const k = median(times.known);
    const u = median(times.unknown);
    console.log(`[forgot-password] median known ${k.toFixed(1)} ms, unknown ${u.toFixed(1)} ms`);
    // Generous: the same two statements either way; an SMTP send on the path is ~10x.
    expect(k).toBeLessThan(2 * u + 5);
    expect(u).toBeLessThan(2 * k + 5);
  });
});

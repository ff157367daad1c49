// Failed sign-ins are throttled per account and per client address.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { signInAction } from "@/app/(auth)/actions";
import { MAX_FAILURES_PER_ACCOUNT, MAX_FAILURES_PER_ADDRESS } from "@/app/_lib/accounts-service";
import { hashPassword } from "@/app/_lib/passwords";
import { closeDb } from "@/db/client";
import { createUser } from "@/db/queries/accounts";
import { callAction } from "./support/fixture";

const stamp = Date.now();
const victim = `throttle-${stamp}@example.test`;
const password = "the right password";

beforeAll(async () => {
  await createUser({ email: victim, name: "Theo Throttle", passwordHash: await hashPassword(password) });
});
afterAll(async () => {
  await closeDb();
});

describe("sign-in throttling", () => {
  it("locks an account after repeated failures, even for the right password, from any address", async () => {
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i += 1) {
      const r = await callAction(signInAction, { email: victim, password: `wrong ${i}` }, null, { "x-forwarded-for": `10.20.0.${i + 1}` });
      expect(r.state.ok).toBe(false);
      if (!r.state.ok) expect(r.state.code).toBe("unauthenticated");
    }
    const locked = await callAction(signInAction, { email: victim, password }, null, { "x-forwarded-for": "10.20.1.1" });
    expect(locked.state.ok).toBe(false);
    if (!locked.state.ok) {
      expect(locked.state.code).toBe("too_many_requests");
      expect(locked.state.message).toMatch(/Too many failed sign-ins for this account\. Try again in about \d+ minutes/);
    }
  });

  it("blocks an address that tries many accounts, but not other addresses", async () => {
    const address = "10.30.0.7";
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i += 1) {
      await callAction(signInAction, { email: `spray-${stamp}-${i}@example.test`, password: "guess" }, null, { "x-forwarded-for": address });
    }
    const other = `fresh-${stamp}@example.test`;
    await createUser({ email: other, name: "Fay Fresh", passwordHash: await hashPassword(password) });
    const blocked = await callAction(signInAction, { email: other, password }, null, { "x-forwarded-for": address });
    expect(blocked.state.ok).toBe(false);
    if (!blocked.state.ok) expect(blocked.state.message).toMatch(/from your network/);
    const elsewhere = await callAction(signInAction, { email: other, password }, null, { "x-forwarded-for": "10.30.0.8" });
    expect(elsewhere.state.ok).toBe(true);
  });
});

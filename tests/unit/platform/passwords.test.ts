import bcrypt from "bcryptjs";
import { describe, expect, it } from "vitest";
import { BCRYPT_COST, hashPassword, verifyPassword } from "@/app/_lib/passwords";

describe("password hashing on the worker pool", () => {
  it("hashes with bcrypt at the stated cost and verifies right and wrong passwords", async () => {
    const hash = await hashPassword("correct horse 42");
    // a standard bcrypt string ($2b$10$...) that bcryptjs on this thread accepts too
    expect(hash).toMatch(/^\$2[aby]\$10\$/);
    expect(bcrypt.getRounds(hash)).toBe(BCRYPT_COST);
    expect(bcrypt.compareSync("correct horse 42", hash)).toBe(true);
    const [right, wrong] = await Promise.all([verifyPassword("correct horse 42", hash), verifyPassword("correct horse 43", hash)]);
    expect(right).toBe(true);
    expect(wrong).toBe(false);
  });

  it("answers every one of many simultaneous requests, each with its own verdict", async () => {
    const hash = bcrypt.hashSync("pump house", 4);
    const guesses = ["pump house", "pump-house", "pump house", "", "PUMP HOUSE", "pump house"];
    const verdicts = await Promise.all(guesses.map((g) => verifyPassword(g, hash)));
    expect(verdicts).toEqual(guesses.map((g) => g === "pump house"));
  });
});

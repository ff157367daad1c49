import bcrypt from "bcryptjs";

// bcrypt cost 10 (the floor we accept; raise it when sign-in latency allows).
export const BCRYPT_COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

let dummyHash: string | undefined;

/** A hash to compare against when the account does not exist, so both paths take as long. */
export function getDummyHash(): string {
  dummyHash ??= bcrypt.hashSync("no-such-account-placeholder", BCRYPT_COST);
  return dummyHash;
}

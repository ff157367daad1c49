// The fingerprint of an analysis input: SHA-256 of its canonical JSON (object keys
// sorted at every level, no whitespace), so two drafts that mean the same thing hash
// the same whatever order their keys were saved in. Array order is kept: in the
// contract an array's order can carry meaning (bearings, coordinates).
import { createHash } from "node:crypto";

function canonicalise(value: unknown): unknown {
  if (Array.isArray(value)) return value.map((v) => (v === undefined ? null : canonicalise(v)));
  if (value !== null && typeof value === "object") {
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value).sort()) {
      const v = (value as Record<string, unknown>)[key];
      // JSON drops undefined members; so does the fingerprint.
      if (v !== undefined) out[key] = canonicalise(v);
    }
    return out;
  }
  return value;
}

/** JSON text with sorted keys and no whitespace. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(canonicalise(value));
}

/** SHA-256 (lower-case hex) of the canonical JSON. */
export function canonicalInputHash(value: unknown): string {
  return createHash("sha256").update(canonicalJson(value), "utf8").digest("hex");
}

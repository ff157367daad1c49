// The result must never carry NaN or Infinity: checked before it leaves the engine.

/** True when every number reachable from value is finite; objects in `skip` are not entered. */
function allFinite(value: unknown, skip: ReadonlySet<object>): boolean {
  if (typeof value === "number") return value - value === 0;
  if (value === null || typeof value !== "object" || skip.has(value)) return true;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) if (!allFinite(value[i], skip)) return false;
    return true;
  }
  for (const key in value) if (!allFinite((value as Record<string, unknown>)[key], skip)) return false;
  return true;
}

/** JSON path of the first non-finite number (slow; only on failure). */
function firstBad(value: unknown, path: string, skip: ReadonlySet<object>): string | null {
  if (typeof value === "number") return value - value === 0 ? null : path || "(root)";
  if (value === null || typeof value !== "object" || skip.has(value)) return null;
  const entries: [string, unknown][] = Array.isArray(value)
    ? value.map((v, i) => [`${path}[${i}]`, v])
    : Object.entries(value).map(([k, v]) => [path ? `${path}.${k}` : k, v]);
  for (const [p, v] of entries) {
    const bad = firstBad(v, p, skip);
    if (bad) return bad;
  }
  return null;
}

/**
 * Throws with the JSON path of the first non-finite number in a value. Objects in `skip` (the
 * sweep's long series, which the sweep loop checks as it writes them) are not entered.
 */
export function assertFinite(value: unknown, skip: ReadonlySet<object> = new Set()): void {
  if (allFinite(value, skip)) return;
  throw new Error(`internal error: non-finite number at ${firstBad(value, "", skip) ?? "(unknown)"}`);
}

// The result must never carry NaN or Infinity: checked before it leaves the engine.

const NO_SKIP: ReadonlySet<string> = new Set();

function fail(path: string): never {
  throw new Error(`internal error: non-finite number at ${path || "(root)"}`);
}

/**
 * Throws with the JSON path of the first non-finite number in a value. Paths in `skip` (e.g.
 * "sweep.series") are not entered (the sweep checks its own long series as it writes them).
 */
export function assertFinite(value: unknown, path = "", skip: ReadonlySet<string> = NO_SKIP): void {
  if (typeof value === "number") {
    if (!Number.isFinite(value)) fail(path);
    return;
  }
  if (Array.isArray(value)) {
    const n = value.length;
    for (let i = 0; i < n; i++) {
      const v: unknown = value[i];
      // fast path for the long numeric series of the sweep
      if (typeof v === "number") {
        if (v - v !== 0) fail(`${path}[${i}]`);
      } else {
        assertFinite(v, `${path}[${i}]`, skip);
      }
    }
    return;
  }
  if (value !== null && typeof value === "object") {
    for (const key in value) {
      const child = path ? `${path}.${key}` : key;
      if (skip.has(child)) continue;
      assertFinite((value as Record<string, unknown>)[key], child, skip);
    }
  }
}

// Shared helpers of the hardening tests (tests/integration/hardening/): a route call with
// a query string or a raw body, a bounded wait, a status tally for the reports, and a
// scan of stored JSON for numbers that are not finite.
import { getPool } from "@/db/client";
import { makeRequest } from "./fixture";

type RouteModule = Record<string, (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>>;

/** Like callRoute, with an optional query string and a body sent as given (a string is sent raw). */
export async function callRouteAt(
  route: string,
  method: string,
  params: Record<string, string>,
  opts: { cookie?: string | null; body?: unknown; query?: string; headers?: Record<string, string> } = {},
): Promise<Response> {
  const mod = (await import(/* @vite-ignore */ `@/app/api/${route}/route.ts`)) as RouteModule;
  const handler = mod[method];
  if (!handler) throw new Error(`${route} has no ${method}`);
  const path = route.replace(/\[(\w+)\]/g, (_, k: string) => params[k] ?? `missing-${k}`);
  const req = makeRequest(method, `/api/${path}${opts.query ? `?${opts.query}` : ""}`, { cookie: opts.cookie, body: opts.body, headers: opts.headers });
  return handler(req, { params: Promise.resolve(params) });
}

/** A multipart upload as the browser sends it, to a route handler function. */
export function uploadRequest(cookie: string | null, file: Buffer, fileName: string, fields: Record<string, string> = {}): Request {
  const form = new FormData();
  form.append("file", new Blob([new Uint8Array(file)]), fileName);
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  const headers: Record<string, string> = { host: "127.0.0.1:3100", origin: "http://127.0.0.1:3100" };
  if (cookie) headers.cookie = cookie;
  return new Request("http://127.0.0.1:3100/api/upload", { method: "POST", headers, body: form });
}

export class TimedOut extends Error {}

/** Rejects with TimedOut when the promise has not settled within ms (a hung request). */
export function within<T>(promise: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new TimedOut(`no answer within ${ms} ms`)), ms);
  });
  return Promise.race([promise, timeout]).finally(() => clearTimeout(timer));
}

/** Counts of what was seen, printed at the end of a test as its figures. */
export class Tally {
  private readonly counts = new Map<string, number>();
  add(key: string | number): void {
    const k = String(key);
    this.counts.set(k, (this.counts.get(k) ?? 0) + 1);
  }
  get total(): number {
    let n = 0;
    for (const v of this.counts.values()) n += v;
    return n;
  }
  keys(): string[] {
    return [...this.counts.keys()];
  }
  toString(): string {
    return [...this.counts.entries()]
      .sort(([a], [b]) => a.localeCompare(b))
      .map(([k, v]) => `${k}×${v}`)
      .join(", ");
  }
}

/** What a refused route call must look like: a JSON error with a code that is not "internal". */
export async function errorOf(res: Response): Promise<{ code: string; message: string } | null> {
  const text = await res.text();
  try {
    const body = JSON.parse(text) as { error?: { code?: unknown; message?: unknown } };
    if (body.error && typeof body.error.code === "string" && typeof body.error.message === "string") return { code: body.error.code, message: body.error.message };
  } catch {
    // not JSON: the caller reports it
  }
  return null;
}

const nonFiniteText = /^[+-]?(nan|inf|infinity)$/i;

/**
 * JSON paths of every value in a stored document that stands for a number that is not finite:
 * a number that is NaN or infinite, a string "NaN"/"Infinity", and (when nullIsBad, for
 * inputs, whose contract has no nulls) a null, which is what JSON.stringify makes of NaN.
 */
export function nonFinitePaths(value: unknown, nullIsBad: boolean, path = "", out: string[] = []): string[] {
  if (typeof value === "number") {
    if (!Number.isFinite(value)) out.push(path || "(root)");
  } else if (typeof value === "string") {
    if (nonFiniteText.test(value.trim())) out.push(path || "(root)");
  } else if (value === null) {
    if (nullIsBad) out.push(path || "(root)");
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => nonFinitePaths(v, nullIsBad, `${path}[${i}]`, out));
  } else if (typeof value === "object") {
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) nonFinitePaths(v, nullIsBad, path ? `${path}.${k}` : k, out);
  }
  return out;
}

/** Scans every stored draft input and revision input and result; returns "table id path" lines. */
export async function scanStoredNumbers(): Promise<{ drafts: number; revisions: number; bad: string[] }> {
  const pool = getPool();
  const bad: string[] = [];
  const drafts = await pool.query<{ id: string; input: unknown }>("SELECT id, input FROM foundation_drafts");
  for (const r of drafts.rows) for (const p of nonFinitePaths(r.input, true)) bad.push(`foundation_drafts ${r.id} input.${p}`);
  const revisions = await pool.query<{ id: string; input: unknown; result: unknown }>("SELECT id, input, result FROM revisions");
  for (const r of revisions.rows) {
    for (const p of nonFinitePaths(r.input, true)) bad.push(`revisions ${r.id} input.${p}`);
    for (const p of nonFinitePaths(r.result, false)) bad.push(`revisions ${r.id} result.${p}`);
  }
  return { drafts: drafts.rowCount ?? 0, revisions: revisions.rowCount ?? 0, bad };
}

/** True when a (drizzle-wrapped) PostgreSQL error is a unique violation of that constraint. */
export function isUniqueViolation(e: unknown, constraint?: string): boolean {
  let cur: unknown = e;
  for (let depth = 0; depth < 4 && cur; depth += 1) {
    const c = cur as { code?: unknown; constraint?: unknown; cause?: unknown };
    if (c.code === "23505") return constraint === undefined || c.constraint === constraint;
    cur = c.cause;
  }
  return false;
}

/**
 * True when PostgreSQL refused a value itself (SQLSTATE class 22, data exception: a NUL
 * byte in text, a malformed uuid, a number out of range): the caller sent something the
 * database cannot hold, which is the caller's mistake, not a server fault.
 */
export function isDataException(e: unknown): boolean {
  let cur: unknown = e;
  for (let depth = 0; depth < 4 && cur; depth += 1) {
    const c = cur as { code?: unknown; cause?: unknown };
    if (typeof c.code === "string" && /^22[0-9A-Z]{3}$/.test(c.code)) return true;
    cur = c.cause;
  }
  return false;
}

/**
 * True when the database could not be reached or dropped the connection (a restart,
 * a failover): the request may be retried, so it answers 503 rather than 500.
 */
export function isDatabaseUnavailable(e: unknown): boolean {
  let cur: unknown = e;
  for (let depth = 0; depth < 4 && cur; depth += 1) {
    const c = cur as { code?: unknown; message?: unknown; cause?: unknown };
    if (typeof c.code === "string" && (/^(08|57P0)/.test(c.code) || ["ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT"].includes(c.code))) return true;
    if (typeof c.message === "string" && /Connection terminated|connection timeout|the database system is (starting up|shutting down)/i.test(c.message)) return true;
    cur = c.cause;
  }
  return false;
}

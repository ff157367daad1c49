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

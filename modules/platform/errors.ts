// One error type for the whole server side; its code maps to an HTTP status and
// a public message. Anything else thrown is an internal error and is not shown.
export const errorCodes = {
  unauthenticated: { status: 401, message: "Please sign in." },
  forbidden: { status: 403, message: "You do not have access to this." },
  not_found: { status: 404, message: "Not found." },
  invalid_input: { status: 400, message: "Some fields need attention." },
  conflict: { status: 409, message: "Someone else changed this first." },
  too_many_requests: { status: 429, message: "Too many attempts. Please wait and try again." },
  payload_too_large: { status: 413, message: "The request is too large." },
  unsupported_media_type: { status: 415, message: "Send the body as JSON (Content-Type: application/json)." },
  cross_site: { status: 403, message: "Cross-site request refused." },
  unavailable: { status: 503, message: "The database is briefly unavailable. Please try again in a moment." },
  busy: { status: 503, message: "The server is busy with other analyses. Please try again in a moment." },
  analysis_limit: { status: 422, message: "The analysis needed more time or memory than the server allows and was stopped: lower sweep.points, the check points or the speed-ramp runs." },
  internal: { status: 500, message: "Something went wrong on our side." },
} as const;

export type ErrorCode = keyof typeof errorCodes;

export interface FieldIssue {
  path: string;
  message: string;
}

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly issues: FieldIssue[];
  /** Seconds for a Retry-After header (503 busy). */
  readonly retryAfterS: number | undefined;
  constructor(code: ErrorCode, message?: string, issues: FieldIssue[] = [], options: { retryAfterS?: number } = {}) {
    super(message ?? errorCodes[code].message);
    this.name = "AppError";
    this.code = code;
    this.issues = issues;
    this.retryAfterS = options.retryAfterS;
  }
  get status(): number {
    return errorCodes[this.code].status;
  }
}

export function isAppError(e: unknown): e is AppError {
  return e instanceof AppError;
}

/** Zod issues to `{ path, message }` with paths like `machines[0].rotors[1].mass`. */
export function formatIssuePath(path: ReadonlyArray<PropertyKey>): string {
  let out = "";
  for (const p of path) {
    if (typeof p === "number") out += `[${p}]`;
    else out += out ? `.${String(p)}` : String(p);
  }
  return out || "(root)";
}

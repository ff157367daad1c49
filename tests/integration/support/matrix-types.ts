import type { ActionFn, Fixture, MatrixRole } from "./fixture";

// One row per route handler method and per server action: which roles may call
// it. Every file under tests/integration/matrix/ exports `routeCases` and/or
// `actionCases`; the role-matrix test fails when a route or action exists that
// no row covers.
export interface RouteCase {
  /** Folder under app/api, e.g. "v1/projects/[projectId]/members". */
  route: string;
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  allowed: MatrixRole[];
  request: (fx: Fixture, role: MatrixRole) => Promise<{ params: Record<string, string>; body?: unknown }>;
  /** Ends the session it runs in: run each role on a fresh session. */
  freshSession?: boolean;
}

export interface ActionCase {
  /** The registry name given to defineAction. */
  name: string;
  action: ActionFn;
  allowed: MatrixRole[];
  fields: (fx: Fixture, role: MatrixRole) => Promise<Record<string, string>>;
  /** Ends the session it runs in (sign-out): run each role on a fresh session. */
  freshSession?: boolean;
}

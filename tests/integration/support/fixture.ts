// Integration fixture: the real PostgreSQL that scripts/test.sh started (with the
// demo seeded), real sealed session cookies for each role, and helpers to call
// route handlers and server actions exactly as Next would.
import { DEMO_PASSWORD, DEMO_PROJECT_CODE, demoAccounts } from "@/modules/platform/demo";
import { createSession, createUser, getUserByEmail } from "@/db/queries/accounts";
import { getProjectByCode, listFoundations, listMembers, upsertMember } from "@/db/queries/projects";
import { sealSessionCookie, SESSION_COOKIE } from "@/app/_lib/session";
import { portFromRequest, runWithRequest, type RequestPort } from "@/app/_lib/request-context";
import { hashPassword } from "@/app/_lib/passwords";
import type { ProjectRole } from "@/modules/platform/permissions";
import { installPeerAddressHook, PEER_ADDRESS_HEADER } from "@/app/_lib/client-address";

// As in the server (instrumentation.ts): with the hook installed the peer header is
// trusted, so a test names the socket address of its request with `peer(address)`.
installPeerAddressHook();
export const peer = (address: string): Record<string, string> => ({ [PEER_ADDRESS_HEADER]: address });
// A socket address no other request of any run within the throttling window has used
// (documentation and private ranges are plenty), for tests where the address does not matter.
let peerCounter = Math.floor(Date.now() / 1000) % 1_000_000;
export const freshPeer = (): Record<string, string> => {
  peerCounter += 1;
  return peer(`fd00::${(peerCounter >> 16).toString(16)}:${(peerCounter & 0xffff).toString(16)}`);
};

export type MatrixRole = ProjectRole | "admin" | "outsider" | "anonymous";
export const matrixRoles: MatrixRole[] = ["anonymous", "outsider", "admin", "manager", "designer", "checker", "vendor", "viewer"];

export interface Fixture {
  projectId: string;
  foundationIds: string[];
  cookies: Record<MatrixRole, string | null>;
  userIds: Record<Exclude<MatrixRole, "anonymous">, string>;
  /** A fresh member to remove, so destructive cases do not eat the fixture. */
  createThrowawayMember(role?: ProjectRole): Promise<string>;
}

export const demoEmail = (role: string): string => {
  const a = demoAccounts.find((x) => x.role === role);
  if (!a) throw new Error(`no demo account for ${role}`);
  return a.email;
};

export async function cookieFor(userId: string): Promise<string> {
  const { id } = await createSession(userId);
  return `${SESSION_COOKIE}=${encodeURIComponent(await sealSessionCookie(id))}`;
}

let cached: Fixture | undefined;

export async function getFixture(): Promise<Fixture> {
  if (cached) return cached;
  const project = await getProjectByCode(DEMO_PROJECT_CODE);
  if (!project) throw new Error("demo project missing: did scripts/test.sh seed the database?");
  const userIds = {} as Fixture["userIds"];
  for (const role of ["admin", "manager", "designer", "checker", "vendor", "viewer"] as const) {
    const u = await getUserByEmail(demoEmail(role));
    if (!u) throw new Error(`demo ${role} missing`);
    userIds[role] = u.id;
  }
  const outsiderEmail = "outsider@elsewhere.test";
  const outsider = (await getUserByEmail(outsiderEmail)) ?? (await createUser({ email: outsiderEmail, name: "Olu Outsider", passwordHash: await hashPassword(DEMO_PASSWORD) }));
  userIds.outsider = outsider.id;
  const cookies = { anonymous: null } as Fixture["cookies"];
  for (const [role, id] of Object.entries(userIds)) cookies[role as MatrixRole] = await cookieFor(id);
  const managerActor = { userId: userIds.manager, isAdmin: false };
  const foundations = await listFoundations(managerActor, project.id);
  let n = 0;
  cached = {
    projectId: project.id,
    foundationIds: foundations.map((f) => f.id),
    cookies,
    userIds,
    async createThrowawayMember(role: ProjectRole = "viewer") {
      n += 1;
      const email = `throwaway-${Date.now()}-${n}@example.test`;
      const u = await createUser({ email, name: `Throwaway ${n}` });
      return upsertMember({ projectId: project.id, userId: u.id, role });
    },
  };
  return cached;
}

export async function listMemberIds(projectId: string, managerId: string): Promise<string[]> {
  return (await listMembers({ userId: managerId, isAdmin: false }, projectId)).map((m) => m.memberId);
}

/** Builds a Request as the browser would send it (same-origin, with the cookie). */
export function makeRequest(method: string, url: string, opts: { cookie?: string | null; body?: unknown; headers?: Record<string, string> } = {}): Request {
  // A browser sends Origin with every state-changing request; a test drops it with origin: "".
  const sameOrigin: Record<string, string> = method === "GET" || method === "HEAD" ? {} : { origin: "http://127.0.0.1:3100" };
  const headers: Record<string, string> = { host: "127.0.0.1:3100", ...sameOrigin, ...(opts.headers ?? {}) };
  for (const [k, v] of Object.entries(headers)) if (v === "") delete headers[k];
  if (opts.cookie) headers.cookie = opts.cookie;
  let body: string | undefined;
  if (opts.body !== undefined) {
    headers["content-type"] ??= "application/json";
    body = typeof opts.body === "string" ? opts.body : JSON.stringify(opts.body);
  }
  return new Request(new URL(url, "http://127.0.0.1:3100"), { method, headers, body });
}

type RouteModule = Record<string, (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>>;

/** Calls the route handler in app/api/<route>/route.ts directly. */
export async function callRoute(
  route: string,
  method: string,
  params: Record<string, string>,
  opts: { cookie?: string | null; body?: unknown; headers?: Record<string, string> } = {},
): Promise<Response> {
  const mod = (await import(/* @vite-ignore */ `@/app/api/${route}/route.ts`)) as RouteModule;
  const handler = mod[method];
  if (!handler) throw new Error(`${route} has no ${method}`);
  const path = route.replace(/\[(\w+)\]/g, (_, k: string) => params[k] ?? `missing-${k}`);
  return handler(makeRequest(method, `/api/${path}`, opts), { params: Promise.resolve(params) });
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- actions differ in their state type
export type ActionFn = (prev: any, fd: FormData) => Promise<unknown>;
export type ActionResult = { ok: true; data: Record<string, unknown> } | { ok: false; code: string; message: string; fieldErrors?: Record<string, string[]> };

/** Runs a server action with the given cookie, through the same guard as in Next. */
export async function callAction(
  action: ActionFn,
  fields: Record<string, string>,
  cookie: string | null,
  headers?: Record<string, string>,
): Promise<{ state: ActionResult; port: RequestPort & { setCookieHeaders: string[] } }> {
  const port = portFromRequest(makeRequest("POST", "/", { cookie, headers }));
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.append(k, v);
  const state = (await runWithRequest(port, () => action(null, fd))) as ActionResult;
  return { state, port };
}

/** The session cookie a response or action set, as a Cookie header value. */
export function sessionCookieFrom(setCookieHeaders: string[]): string | null {
  for (const h of setCookieHeaders) {
    const first = h.split(";")[0] ?? "";
    if (first.startsWith(`${SESSION_COOKIE}=`) && first.length > SESSION_COOKIE.length + 1) return first;
  }
  return null;
}

/** Waits for the fake SMTP server to have received a message for `to`. */
export async function waitForEmail(to: string, subjectIncludes: string, timeoutMs = 8000): Promise<{ subject: string; text: string }> {
  const { listCapturedEmails } = await import("@/db/queries/mail");
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const hit = (await listCapturedEmails(200)).find((m) => m.envelopeTo.includes(to) && m.subject.includes(subjectIncludes));
    if (hit) return { subject: hit.subject, text: hit.text };
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`no e-mail "${subjectIncludes}" for ${to} within ${timeoutMs} ms`);
}

export function linkToken(text: string, kind: "reset" | "invite"): string {
  const m = new RegExp(`/${kind}/([A-Za-z0-9_-]{20,})`).exec(text);
  if (!m?.[1]) throw new Error(`no /${kind}/ link in: ${text}`);
  return m[1];
}

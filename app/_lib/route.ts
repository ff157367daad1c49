import { z } from "zod";
import { AppError, errorCodes, formatIssuePath, isAppError } from "@/modules/platform/errors";
import type { Membership } from "@/db/queries/projects";
import { isDatabaseUnavailable, isDataException } from "@/db/queries/errors";
import { requireAdmin, requireProjectPermission, requireUser, type Access, type AuthContext } from "./guard";
import { portFromRequest, type RequestPort } from "./request-context";
import { getServerEnv } from "@/modules/platform/env";
import { SESSION_COOKIE } from "./session";
import { foreignOriginReason, hasNoOriginSignal, isJsonContentType } from "./request-origin";

export interface RouteContext<P> {
  request: Request;
  params: P;
  port: RequestPort;
  auth: AuthContext | null;
  membership: Membership | null;
}

interface RouteDefinition<P, B extends z.ZodType | undefined, R> {
  access: Access;
  /** For project access: the project id from the path parameters. */
  projectId?: (params: P) => string;
  body?: B;
  /** Largest accepted body in bytes. */
  maxBodyBytes?: number;
  handler: (ctx: RouteContext<P>, body: B extends z.ZodType ? z.infer<B> : undefined) => Promise<R | Response>;
  status?: number;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function jsonError(e: AppError): Response {
  const body: Record<string, unknown> = { error: { code: e.code, message: e.message } };
  if (e.issues.length) (body.error as Record<string, unknown>).issues = e.issues;
  const headers = e.retryAfterS !== undefined ? { "retry-after": String(e.retryAfterS) } : undefined;
  return Response.json(body, { status: e.status, headers });
}

/**
 * Refuses state-changing requests sent from another site (the browser says so, or the
 * Origin is not this host; X-Forwarded-Host counts only behind a trusted proxy), and those
 * that say nothing of where they come from unless they carry a JSON type, which a
 * cross-site form cannot send.
 */
function assertSameSite(request: Request): void {
  if (request.method === "GET" || request.method === "HEAD") return;
  const trustProxy = Number(getServerEnv().TRUST_PROXY) > 0;
  if (foreignOriginReason(request.headers, trustProxy)) throw new AppError("cross_site");
  if (hasNoOriginSignal(request.headers) && !isJsonContentType(request.headers.get("content-type"))) {
    throw new AppError("cross_site", "Cross-site request refused: a request without Origin or Sec-Fetch-Site must carry Content-Type: application/json.");
  }
}

/**
 * The body as text, counting bytes as they arrive: past maxBytes the read stops and the
 * stream is cancelled, so a chunked body without Content-Length is never held whole.
 */
export async function readBodyText(request: Request, maxBytes: number): Promise<string> {
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (declared > maxBytes) throw new AppError("payload_too_large");
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw new AppError("payload_too_large");
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks, total).toString("utf8");
}

async function readJsonBody(request: Request, maxBytes: number): Promise<unknown> {
  // A text/plain or form body is what a cross-site form sends without a preflight.
  if (!isJsonContentType(request.headers.get("content-type"))) throw new AppError("unsupported_media_type");
  const text = await readBodyText(request, maxBytes);
  if (!text.trim()) throw new AppError("invalid_input", "The request body is empty.", [{ path: "(root)", message: "Expected a JSON body" }]);
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("invalid_input", "The request body is not valid JSON.", [{ path: "(root)", message: "Not valid JSON" }]);
  }
}

/** Answers to a signed-in caller (or that set a cookie) are theirs alone: no shared or browser cache keeps them. */
function noStoreWhenPersonal(response: Response, access: Access, port: RequestPort & { setCookieHeaders: string[] }): Response {
  const personal = access.kind !== "public" || port.setCookieHeaders.length > 0 || port.getCookie(SESSION_COOKIE) !== undefined;
  if (personal && !response.headers.has("cache-control")) response.headers.set("cache-control", "private, no-store");
  return response;
}

/**
 * The one route-handler wrapper, in the order: same-site check, authenticate,
 * authorise by project role, read and validate the body, then the handler
 * (a caller without the role learns nothing, not even which fields are wrong).
 */
export function defineRoute<P extends Record<string, string>, B extends z.ZodType | undefined, R>(def: RouteDefinition<P, B, R>) {
  const handler = async (request: Request, context: { params: Promise<P> }): Promise<Response> => {
    const port = portFromRequest(request);
    try {
      assertSameSite(request);
      const params = (await context.params) ?? ({} as P);
      const auth = def.access.kind === "public" ? null : await requireUser(port);
      if (def.access.kind === "admin" && auth) requireAdmin(auth);
      let membership: Membership | null = null;
      if (def.access.kind === "project") {
        const pid = def.projectId?.(params);
        if (!auth || !pid || !uuidPattern.test(pid)) throw new AppError(uuidPattern.test(pid ?? "") ? "forbidden" : "not_found");
        membership = await requireProjectPermission(auth, pid, def.access.permission);
      }
      let body: unknown = undefined;
      if (def.body) {
        const raw = await readJsonBody(request, def.maxBodyBytes ?? 1_000_000);
        const parsed = def.body.safeParse(raw);
        if (!parsed.success) {
          throw new AppError(
            "invalid_input",
            undefined,
            parsed.error.issues.map((i) => ({ path: formatIssuePath(i.path), message: i.message })),
          );
        }
        body = parsed.data;
      }
      const result = await def.handler({ request, params, port, auth, membership }, body as B extends z.ZodType ? z.infer<B> : undefined);
      const response = result instanceof Response ? result : Response.json(result, { status: def.status ?? 200 });
      for (const c of port.setCookieHeaders) response.headers.append("set-cookie", c);
      return noStoreWhenPersonal(response, def.access, port);
    } catch (e) {
      if (isAppError(e)) return noStoreWhenPersonal(jsonError(e), def.access, port);
      if (isDatabaseUnavailable(e)) return jsonError(new AppError("unavailable"));
      if (isDataException(e)) return jsonError(new AppError("invalid_input", "A field holds a value that cannot be stored (for example a NUL character)."));
      console.error(`[route ${request.method} ${new URL(request.url).pathname}]`, e);
      return Response.json({ error: { code: "internal", message: errorCodes.internal.message } }, { status: 500 });
    }
  };
  return Object.assign(handler, { access: def.access });
}

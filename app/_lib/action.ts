import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { z } from "zod";
import { AppError, formatIssuePath, isAppError } from "@/modules/platform/errors";
import type { Membership } from "@/db/queries/projects";
import { isDatabaseUnavailable, isDataException } from "@/db/queries/errors";
import { requireAdmin, requireProjectPermission, requireUser, type Access, type AuthContext } from "./guard";
import { getRequestPort } from "./next-port";
import type { RequestPort } from "./request-context";

export type ActionState<T = unknown> =
  | { ok: true; data: T; message?: string }
  | { ok: false; code: string; message: string; fieldErrors?: Record<string, string[]> }
  | null;

export interface ActionContext {
  port: RequestPort;
  auth: AuthContext | null;
  membership: Membership | null;
}

interface ActionDefinition<S extends z.ZodType, R> {
  /** Registry name, used by the role-matrix test. */
  name: string;
  access: Access;
  schema: S;
  /** For project access: where the project id is in the parsed input. */
  projectId?: (input: z.infer<S>) => string;
  handler: (ctx: ActionContext, input: z.infer<S>) => Promise<R>;
  /** Where to go after success (pages only; detached callers get the data). */
  redirectTo?: (data: R) => string | null;
  /** Pages whose server-rendered data the action changed. */
  revalidate?: (data: R, input: z.infer<S>) => string[];
}

export type ServerAction<R> = ((prev: ActionState<R>, formData: FormData) => Promise<ActionState<R>>) & {
  actionName: string;
  access: Access;
};

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const actionRegistry = new Map<string, Access>();

function formDataToObject(fd: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of fd.entries()) {
    if (key.startsWith("$ACTION")) continue;
    if (key in out) {
      const prev = out[key];
      out[key] = Array.isArray(prev) ? [...prev, value] : [prev, value];
    } else out[key] = value;
  }
  return out;
}

export function zodFieldErrors(error: z.ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = formatIssuePath(issue.path);
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

/**
 * The one action wrapper: authenticate, authorise by project role, parse with
 * zod, call the domain, and return a typed state. Errors never leak internals.
 */
export function defineAction<S extends z.ZodType, R>(def: ActionDefinition<S, R>): ServerAction<R> {
  actionRegistry.set(def.name, def.access);
  const run = async (_prev: ActionState<R>, formData: FormData): Promise<ActionState<R>> => {
    const port = await getRequestPort();
    let target: string | null = null;
    try {
      const auth = def.access.kind === "public" ? null : await requireUser(port);
      if (def.access.kind === "admin" && auth) requireAdmin(auth);
      const parsed = def.schema.safeParse(formDataToObject(formData));
      if (!parsed.success) {
        // A non-member learns nothing, not even which fields were wrong.
        if (def.access.kind === "project" && auth) {
          const pid = formData.get("projectId");
          // Only a well-formed id can name a project (anything else would be a database error).
          if (typeof pid === "string" && uuidPattern.test(pid)) await requireProjectPermission(auth, pid, def.access.permission);
        }
        return { ok: false, code: "invalid_input", message: "Some fields need attention.", fieldErrors: zodFieldErrors(parsed.error) };
      }
      let membership: Membership | null = null;
      if (def.access.kind === "project") {
        if (!auth || !def.projectId) throw new AppError("forbidden");
        membership = await requireProjectPermission(auth, def.projectId(parsed.data), def.access.permission);
      }
      const data = await def.handler({ port, auth, membership }, parsed.data);
      if (def.revalidate && !port.detached) for (const p of def.revalidate(data, parsed.data)) revalidatePath(p);
      target = def.redirectTo ? def.redirectTo(data) : null;
      if (!target || port.detached) return { ok: true, data };
    } catch (e) {
      if (isAppError(e)) {
        return {
          ok: false,
          code: e.code,
          message: e.message,
          ...(e.issues.length ? { fieldErrors: Object.fromEntries(e.issues.map((i) => [i.path, [i.message]])) } : {}),
        };
      }
      if (isDatabaseUnavailable(e)) return { ok: false, code: "unavailable", message: "The database is briefly unavailable. Please try again in a moment." };
      if (isDataException(e)) return { ok: false, code: "invalid_input", message: "A field holds a value that cannot be stored (for example a NUL character)." };
      console.error(`[action ${def.name}]`, e);
      return { ok: false, code: "internal", message: "Something went wrong on our side." };
    }
    redirect(target);
  };
  return Object.assign(run, { actionName: def.name, access: def.access });
}

import { AsyncLocalStorage } from "node:async_hooks";

/**
 * What the server code needs of the incoming request: cookies, a few headers,
 * and a way to set a cookie on the answer. Pages and server actions get it from
 * next/headers; route handlers from their Request; the integration tests run
 * actions inside `runWithRequest` with a real sealed cookie, so the same guard
 * code runs in every case.
 */
export interface RequestPort {
  getCookie(name: string): string | undefined;
  getHeader(name: string): string | null;
  setCookie(name: string, value: string, options: CookieOptions): void;
  deleteCookie(name: string): void;
  /** True when the port is not Next's, so the caller must not call redirect(). */
  readonly detached: boolean;
}

export interface CookieOptions {
  httpOnly: boolean;
  sameSite: "lax" | "strict";
  secure: boolean;
  path: string;
  maxAge?: number;
}

const storage = new AsyncLocalStorage<RequestPort>();

export function runWithRequest<T>(port: RequestPort, fn: () => Promise<T>): Promise<T> {
  return storage.run(port, fn);
}

export function getDetachedPort(): RequestPort | undefined {
  return storage.getStore();
}

function parseCookieHeader(header: string | null): Map<string, string> {
  const map = new Map<string, string>();
  if (!header) return map;
  for (const part of header.split(";")) {
    const eq = part.indexOf("=");
    if (eq < 0) continue;
    const key = part.slice(0, eq).trim();
    const value = part.slice(eq + 1).trim();
    if (key) {
      try {
        map.set(key, decodeURIComponent(value));
      } catch {
        map.set(key, value);
      }
    }
  }
  return map;
}

export function serialiseCookie(name: string, value: string, o: CookieOptions): string {
  const parts = [`${name}=${encodeURIComponent(value)}`, `Path=${o.path}`, `SameSite=${o.sameSite === "lax" ? "Lax" : "Strict"}`];
  if (o.httpOnly) parts.push("HttpOnly");
  if (o.secure) parts.push("Secure");
  if (o.maxAge !== undefined) parts.push(`Max-Age=${o.maxAge}`);
  return parts.join("; ");
}

/** A port over a fetch Request; cookies set on it are collected for the Response. */
export function portFromRequest(request: Request): RequestPort & { setCookieHeaders: string[] } {
  const cookies = parseCookieHeader(request.headers.get("cookie"));
  const setCookieHeaders: string[] = [];
  return {
    detached: true,
    setCookieHeaders,
    getCookie: (name) => cookies.get(name),
    getHeader: (name) => request.headers.get(name),
    setCookie: (name, value, options) => {
      cookies.set(name, value);
      setCookieHeaders.push(serialiseCookie(name, value, options));
    },
    deleteCookie: (name) => {
      cookies.delete(name);
      setCookieHeaders.push(`${name}=; Path=/; Max-Age=0; HttpOnly; SameSite=Lax`);
    },
  };
}

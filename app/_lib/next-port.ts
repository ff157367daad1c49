import "server-only";
import { cookies, headers } from "next/headers";
import { getDetachedPort, type RequestPort } from "./request-context";

/** The request port for pages and server actions: next/headers, unless a test runs us detached. */
export async function getRequestPort(): Promise<RequestPort> {
  const detached = getDetachedPort();
  if (detached) return detached;
  const jar = await cookies();
  const hdrs = await headers();
  return {
    detached: false,
    getCookie: (name) => jar.get(name)?.value,
    getHeader: (name) => hdrs.get(name),
    setCookie: (name, value, options) => {
      jar.set(name, value, options);
    },
    deleteCookie: (name) => {
      jar.delete(name);
    },
  };
}

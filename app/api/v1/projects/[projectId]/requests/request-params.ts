import "server-only";
import { AppError } from "@/modules/platform/errors";

export type RequestParams = { projectId: string; requestId: string };

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A malformed id is a request that does not exist (404), never a database error. */
export function requireUuid(value: string): string {
  if (!uuid.test(value)) throw new AppError("not_found");
  return value;
}

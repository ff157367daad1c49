import { AppError } from "@/modules/platform/errors";

/** Path parameters of the routes under one foundation. */
// A type alias, not an interface: defineRoute wants params assignable to Record<string, string>.
export type FoundationParams = { projectId: string; foundationId: string };

export const projectIdOf = (p: FoundationParams): string => p.projectId;

const uuidShape = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The foundation id, or 404 before PostgreSQL would refuse a malformed uuid with an error. */
export function foundationIdOf(p: FoundationParams): string {
  if (!uuidShape.test(p.foundationId)) throw new AppError("not_found", "That foundation is not in this project.");
  return p.foundationId;
}

export const foundationNotFound = (): AppError => new AppError("not_found", "That foundation is not in this project.");

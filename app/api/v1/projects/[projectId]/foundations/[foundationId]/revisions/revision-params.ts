import { AppError } from "@/modules/platform/errors";

// Path parameters of the routes under a foundation's revisions. Type aliases, not
// interfaces: defineRoute wants params assignable to Record<string, string>.
export type RevisionListParams = { projectId: string; foundationId: string };
export type RevisionParams = RevisionListParams & { revisionId: string };
export type CommentParams = RevisionParams & { commentId: string };

const uuidShape = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The id, or 404 before PostgreSQL would refuse a malformed uuid with an error. */
export function idOf(value: string | null | undefined, what: "foundation" | "revision" | "comment"): string {
  if (!value || !uuidShape.test(value)) throw new AppError("not_found", `That ${what} is not on this project.`);
  return value;
}

export const revisionNotFound = (): AppError => new AppError("not_found", "That revision is not on this foundation.");

// The shapes a client sends for the revision commands: one schema for the form
// (server action) and the JSON body (route handler).
import { z } from "zod";
import { REVISION_PURPOSES } from "./status";

const uuid = (what: string) => z.uuid(`${what} is not a valid id`);

export const revisionIssueSchema = z.object({
  projectId: uuid("Project"),
  foundationId: uuid("Foundation"),
  // The draft version the designer looked at: a draft saved since is refused, not issued
  // unseen. Optional for scripts that issue whatever is saved.
  draftVersion: z.coerce.number("Draft version must be a number").int("Draft version must be a whole number").min(1, "Save the draft before issuing it").optional(),
  // What changed since the previous revision and why: the checker reads it first, the package prints it.
  note: z.string("Write a revision note: what changed and why").trim().min(1, "Write a revision note: what changed and why").max(4000, "Keep the revision note under 4000 characters"),
  // What the revision is issued for; "issued for check" when not said.
  purpose: z.enum(REVISION_PURPOSES, `Purpose must be one of: ${REVISION_PURPOSES.join(", ")}`).default("issued-for-check"),
});

export const revisionDecisionSchema = z.object({
  projectId: uuid("Project"),
  foundationId: uuid("Foundation"),
  revisionId: uuid("Revision"),
  // "checked" is the first signature of a two-step sign-off (refused in a one-step project).
  outcome: z.enum(["checked", "returned", "approved"], "Choose checked, return or approve"),
  note: z.string().trim().max(4000, "Keep the note under 4000 characters").default(""),
});

export const revisionCommentSchema = z.object({
  projectId: uuid("Project"),
  foundationId: uuid("Foundation"),
  revisionId: uuid("Revision"),
  body: z.string().trim().min(1, "Write the comment").max(4000, "Keep the comment under 4000 characters"),
  // A field of the revision (a path the revision page lists), or empty for the whole revision.
  fieldPath: z
    .string()
    .trim()
    .max(400, "That field path is too long")
    .optional()
    .transform((v) => (v ? v : null)),
  parentId: z
    .union([uuid("Parent comment"), z.literal("")])
    .optional()
    .transform((v) => (v ? v : null)),
});

export const resolveCommentSchema = z.object({
  projectId: uuid("Project"),
  foundationId: uuid("Foundation"),
  commentId: uuid("Comment"),
  resolved: z.enum(["true", "false"], "Resolved must be true or false").transform((v) => v === "true"),
});

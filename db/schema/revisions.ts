import { boolean, check, index, integer, jsonb, pgTable, text, timestamp, unique, uuid, type AnyPgColumn } from "drizzle-orm/pg-core";
import { sql } from "drizzle-orm";
import { users } from "./accounts";
import { foundations, projects } from "./projects";

const stamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
};

// One row per issue for check. Immutable once inserted: a trigger (migration
// "revisions-immutable") refuses every UPDATE and DELETE, so what a checker signed
// is what stays on record. Its state lives in revision_decisions.
export const revisions = pgTable(
  "revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    // Restrict, not cascade: an issued revision outlives nothing it was issued from.
    foundationId: uuid("foundation_id")
      .notNull()
      .references(() => foundations.id, { onDelete: "restrict" }),
    projectId: uuid("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "restrict" }),
    // 1, 2, 3 … per foundation; the unique pair makes two racing issues yield one winner.
    sequence: integer("sequence").notNull(),
    // Per the project's revision scheme at the time of issue (A, B … or 0, 1 …).
    label: text("label").notNull(),
    input: jsonb("input").notNull(),
    result: jsonb("result").notNull(),
    engineVersion: text("engine_version").notNull(),
    // SHA-256 (hex) of the canonical input JSON (keys sorted): identical drafts are not re-issued.
    inputHash: text("input_hash").notNull(),
    // The vendor submission the draft used; no FK, the vendor tables belong to another module.
    vendorSubmissionId: uuid("vendor_submission_id"),
    issuedById: uuid("issued_by_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    issuedAt: timestamp("issued_at", { withTimezone: true }).notNull().defaultNow(),
    // Who edited the draft between the previous revision and this one (the draft's editor
    // set at issue). With the issuer, these are the revision's authors: none may decide on it.
    // Users are never deleted while they have revisions (issued_by_id restricts it).
    editorIds: uuid("editor_ids").array().notNull().default(sql`'{}'::uuid[]`),
    // The draft's machine placements at issue (datum on the block and the vendor's own figures
    // per machine, modules/desk/machine-placements.ts); '[]' for revisions issued before.
    machinePlacements: jsonb("machine_placements").notNull().default(sql`'[]'::jsonb`),
    // The designer's revision note: what changed since the previous revision and why. Required
    // at issue (zod); revisions issued before the note existed keep '' (shown as "no note").
    note: text("note").notNull().default(""),
    // What the revision is issued for (modules/revisions REVISION_PURPOSES), chosen when issuing.
    purpose: text("purpose", { enum: ["issued-for-check", "issued-for-information", "issued-for-approval", "issued-for-construction", "as-built"] })
      .notNull()
      .default("issued-for-check"),
    ...stamps,
  },
  (t) => [
    unique("revisions_foundation_sequence_uq").on(t.foundationId, t.sequence),
    unique("revisions_foundation_label_uq").on(t.foundationId, t.label),
    index("revisions_project_idx").on(t.projectId),
    check("revisions_sequence_positive", sql`${t.sequence} > 0`),
  ],
);

// A checker's (or manager's) return or approval. UNIQUE on the revision, so of two
// racing decisions exactly one row exists; the insert itself refuses the issuer.
export const revisionDecisions = pgTable("revision_decisions", {
  id: uuid("id").primaryKey().defaultRandom(),
  revisionId: uuid("revision_id")
    .notNull()
    .unique("revision_decisions_revision_uq")
    .references(() => revisions.id, { onDelete: "restrict" }),
  outcome: text("outcome", { enum: ["returned", "approved"] }).notNull(),
  note: text("note").notNull().default(""),
  decidedById: uuid("decided_by_id")
    .notNull()
    .references(() => users.id, { onDelete: "restrict" }),
  // The decider's project role at the time (null on decisions recorded before roles were kept).
  decidedByRole: text("decided_by_role"),
  decidedAt: timestamp("decided_at", { withTimezone: true }).notNull().defaultNow(),
  ...stamps,
});

// The first step of a two-step sign-off: a checker's "checked" (the approval that follows,
// by someone else, is a revision_decisions row). UNIQUE on the revision; immutable; triggers
// refuse the revision's authors, as for decisions, and refuse the checker as approver.
export const revisionChecks = pgTable("revision_checks", {
  id: uuid("id").primaryKey().defaultRandom(),
  revisionId: uuid("revision_id")
    .notNull()
    .unique("revision_checks_revision_uq")
    .references(() => revisions.id, { onDelete: "restrict" }),
  note: text("note").notNull().default(""),
  checkedById: uuid("checked_by_id")
    .notNull()
    .references(() => users.id, { onDelete: "restrict" }),
  // The checker's project role when checking, as signed on the cover.
  checkedByRole: text("checked_by_role").notNull(),
  checkedAt: timestamp("checked_at", { withTimezone: true }).notNull().defaultNow(),
  ...stamps,
});

// Review comments on a revision, on the whole (fieldPath null) or on one field
// (e.g. `soil.poissonRatio`); answers point at their parent.
export const revisionComments = pgTable(
  "revision_comments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    revisionId: uuid("revision_id")
      .notNull()
      .references(() => revisions.id, { onDelete: "restrict" }),
    parentId: uuid("parent_id").references((): AnyPgColumn => revisionComments.id, { onDelete: "restrict" }),
    fieldPath: text("field_path"),
    body: text("body").notNull(),
    resolved: boolean("resolved").notNull().default(false),
    authorId: uuid("author_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    resolvedById: uuid("resolved_by_id").references(() => users.id, { onDelete: "set null" }),
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
    ...stamps,
  },
  (t) => [index("revision_comments_revision_idx").on(t.revisionId, t.createdAt)],
);

// A revision a manager shared with the client (the viewer role) before or without its
// approval: the viewer may then download its package. A row of its own because revisions
// are immutable; sharing and withdrawing the share are audit events.
export const revisionClientShares = pgTable("revision_client_shares", {
  revisionId: uuid("revision_id")
    .primaryKey()
    .references(() => revisions.id, { onDelete: "restrict" }),
  sharedById: uuid("shared_by_id")
    .notNull()
    .references(() => users.id, { onDelete: "restrict" }),
  sharedAt: timestamp("shared_at", { withTimezone: true }).notNull().defaultNow(),
  ...stamps,
});

export type RevisionRow = typeof revisions.$inferSelect;
export type RevisionDecisionRow = typeof revisionDecisions.$inferSelect;
export type RevisionCheckRow = typeof revisionChecks.$inferSelect;
export type RevisionCommentRow = typeof revisionComments.$inferSelect;

import { integer, jsonb, pgTable, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./accounts";
import { foundations } from "./projects";
import { vendorSubmissions } from "./vendor";

// The working copy of a foundation's analysis input (calc-contract.md, SI), one per
// foundation. `version` is bumped by every save so two editors cannot silently
// overwrite each other (optimistic concurrency).
export const foundationDrafts = pgTable("foundation_drafts", {
  id: uuid("id").primaryKey().defaultRandom(),
  foundationId: uuid("foundation_id")
    .notNull()
    .unique("foundation_drafts_foundation_uq")
    .references(() => foundations.id, { onDelete: "cascade" }),
  input: jsonb("input").notNull(),
  version: integer("version").notNull().default(1),
  // The vendor submission this draft's machine data came from.
  vendorSubmissionId: uuid("vendor_submission_id").references(() => vendorSubmissions.id, { onDelete: "set null" }),
  updatedById: uuid("updated_by_id").references(() => users.id, { onDelete: "set null" }),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

export type FoundationDraftRow = typeof foundationDrafts.$inferSelect;

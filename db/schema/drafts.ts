import { sql } from "drizzle-orm";
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
  // Everyone who changed the draft since the last revision was issued (saves, a vendor
  // submission taken in); issuing copies the set into the revision and empties it, so the
  // four-eyes rule can refuse a decision by anyone who wrote the revision, not just its issuer.
  // An array, not a link table: it is read and replaced whole, always with the draft row.
  editorIds: uuid("editor_ids").array().notNull().default(sql`'{}'::uuid[]`),
  // Per machine: where its own datum sits on the block and the vendor's own figures behind it
  // (modules/desk/machine-placements.ts). Beside the input, not in it: the input stays the
  // contract's, in block coordinates. '[]' for drafts from before: positions are block coordinates.
  machinePlacements: jsonb("machine_placements").notNull().default(sql`'[]'::jsonb`),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

export type FoundationDraftRow = typeof foundationDrafts.$inferSelect;

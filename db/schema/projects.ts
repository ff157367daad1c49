import { index, jsonb, pgTable, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import type { FoundationSoilFlag } from "@/modules/desk/measurement-flag";
import { users } from "./accounts";

export type { FoundationSoilFlag };

const stamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
};

// Machine vendors; a vendor member of a project belongs to one company.
export const companies = pgTable("companies", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull().unique(),
  ...stamps,
});

export const projects = pgTable("projects", {
  id: uuid("id").primaryKey().defaultRandom(),
  code: text("code").notNull().unique(),
  name: text("name").notNull(),
  client: text("client").notNull().default(""),
  site: text("site").notNull().default(""),
  units: text("units", { enum: ["si", "us"] }).notNull().default("si"),
  // Project defaults for blank criteria in a draft (SI, the contract's keys), and the soil band factors.
  criteriaDefaults: jsonb("criteria_defaults").$type<Record<string, number>>().notNull().default({}),
  soilBand: jsonb("soil_band").$type<{ lowerFactor?: number; upperFactor?: number }>().notNull().default({}),
  // Revision labels: letters A, B, C while in check, or numbers 0, 1, 2 for issue for construction.
  revisionScheme: text("revision_scheme", { enum: ["letters", "numbers"] }).notNull().default("letters"),
  // Paper of the printed calculation package (workbook page setup and PDF): A4 or US Letter.
  paperSize: text("paper_size", { enum: ["a4", "letter"] }).notNull().default("a4"),
  // Sign-off of a revision: one step (a checker or manager approves) or two (checked by a
  // checker, then approved by a different checker or a manager).
  signOffSteps: text("sign_off_steps", { enum: ["one", "two"] }).notNull().default("one"),
  createdById: uuid("created_by_id").references(() => users.id, { onDelete: "set null" }),
  ...stamps,
});

export const projectMembers = pgTable(
  "project_members",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    role: text("role", { enum: ["manager", "designer", "checker", "vendor", "viewer"] }).notNull(),
    companyId: uuid("company_id").references(() => companies.id, { onDelete: "set null" }),
    ...stamps,
  },
  (t) => [unique("project_members_project_user_uq").on(t.projectId, t.userId), index("project_members_user_idx").on(t.userId)],
);

export const foundations = pgTable(
  "foundations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    tag: text("tag").notNull(),
    machineTrain: text("machine_train").notNull().default(""),
    location: text("location").notNull().default(""),
    // Withdrawn (archived) by a manager: off the project table and the register, its
    // revisions and audit trail kept and readable by managers, and restorable.
    withdrawnAt: timestamp("withdrawn_at", { withTimezone: true }),
    withdrawnById: uuid("withdrawn_by_id").references(() => users.id, { onDelete: "set null" }),
    withdrawalReason: text("withdrawal_reason").notNull().default(""),
    // Raised by a commissioning record whose fitted soil shear modulus falls outside the
    // design's soil band (the latest such record; cleared by a later record inside the band).
    soilFlag: jsonb("soil_flag").$type<FoundationSoilFlag | null>(),
    ...stamps,
  },
  (t) => [unique("foundations_project_tag_uq").on(t.projectId, t.tag)],
);

export type ProjectRow = typeof projects.$inferSelect;
export type ProjectMemberRow = typeof projectMembers.$inferSelect;
export type FoundationRow = typeof foundations.$inferSelect;

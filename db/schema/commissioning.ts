import { sql } from "drizzle-orm";
import { check, index, integer, jsonb, pgTable, real, text, timestamp, uuid, type AnyPgColumn } from "drizzle-orm/pg-core";
import { users } from "./accounts";
import { companies, foundations, projects } from "./projects";
import { revisions } from "./revisions";
import { storedFiles } from "./vendor";

const stamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
};

/**
 * One site measurement of a foundation's machines (acceptance test or a later survey), tied to
 * the approved revision it is judged against. Immutable: a trigger (migration
 * "measurement-records-immutable") refuses UPDATE and DELETE, so what was measured and judged
 * stays on record with its file's SHA-256; a correction is a new record whose `supersedesId`
 * names the one it corrects.
 */
export const measurementRecords = pgTable(
  "measurement_records",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "restrict" }),
    foundationId: uuid("foundation_id").notNull().references(() => foundations.id, { onDelete: "restrict" }),
    revisionId: uuid("revision_id").notNull().references(() => revisions.id, { onDelete: "restrict" }),
    // The vendor company whose field staff added it (null when the design team did): a vendor
    // reads only its own company's records.
    companyId: uuid("company_id").references(() => companies.id, { onDelete: "restrict" }),
    measuredOn: text("measured_on").notNull(),
    measuredBy: text("measured_by").notNull(),
    instrument: text("instrument").notNull(),
    instrumentCalibratedOn: text("instrument_calibrated_on").notNull(),
    // Machine state during the measurement: running speed (rpm) and load as stated (e.g. "100 %").
    speedRpm: real("speed_rpm").notNull(),
    load: text("load").notNull().default(""),
    kind: text("kind", { enum: ["readings", "run-up"] }).notNull(),
    fileId: uuid("file_id").notNull().references(() => storedFiles.id, { onDelete: "restrict" }),
    fileName: text("file_name").notNull(),
    sha256: text("sha256").notNull(),
    byteSize: integer("byte_size").notNull(),
    // The parsed file (modules/commissioning readings.ts shapes, SI) and what the desk computed.
    readings: jsonb("readings").notNull().default(sql`'[]'::jsonb`),
    trace: jsonb("trace"),
    verdicts: jsonb("verdicts").notNull(),
    calibration: jsonb("calibration"),
    engineVersion: text("engine_version").notNull(),
    supersedesId: uuid("supersedes_id").references((): AnyPgColumn => measurementRecords.id, { onDelete: "restrict" }),
    note: text("note").notNull().default(""),
    createdById: uuid("created_by_id").notNull().references(() => users.id, { onDelete: "restrict" }),
    ...stamps,
  },
  (t) => [
    index("measurement_records_revision_idx").on(t.revisionId, t.createdAt),
    index("measurement_records_foundation_idx").on(t.foundationId, t.createdAt),
    check("measurement_records_speed_positive", sql`${t.speedRpm} > 0`),
  ],
);

export type MeasurementRecordRow = typeof measurementRecords.$inferSelect;

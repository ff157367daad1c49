import { sql } from "drizzle-orm";
import { customType, index, integer, jsonb, pgTable, primaryKey, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { users } from "./accounts";
import { companies, foundations, projects } from "./projects";

const stamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
};

// node-postgres hands bytea back as a Buffer and takes one on insert.
const bytea = customType<{ data: Buffer; driverData: Buffer }>({
  dataType() {
    return "bytea";
  },
});

/**
 * A designer's request to a vendor company for the machine data of one foundation.
 * `machines` is what the desk held when the request was sent (the contract's machines,
 * SI): the workbook is prefilled from it and the first submission is compared with it.
 */
export const vendorRequests = pgTable(
  "vendor_requests",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    foundationId: uuid("foundation_id").notNull().references(() => foundations.id, { onDelete: "cascade" }),
    // Every vendor member of this company sees the request; the contact is e-mailed.
    companyId: uuid("company_id").notNull().references(() => companies.id),
    contactUserId: uuid("contact_user_id").notNull().references(() => users.id),
    requestedById: uuid("requested_by_id").references(() => users.id, { onDelete: "set null" }),
    message: text("message").notNull().default(""),
    dueOn: text("due_on"),
    machines: jsonb("machines").notNull(),
    ...stamps,
  },
  (t) => [index("vendor_requests_project_company_idx").on(t.projectId, t.companyId), index("vendor_requests_foundation_idx").on(t.foundationId)],
);

/**
 * Metadata of an uploaded file. The bytes live wherever `storage` says (see
 * db/queries/files.ts): `postgres` keeps them in file_blobs under `storageKey`.
 */
export const storedFiles = pgTable(
  "stored_files",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    // Vendor files belong to a request, which decides which vendor company may read them.
    requestId: uuid("request_id").references(() => vendorRequests.id, { onDelete: "cascade" }),
    purpose: text("purpose", { enum: ["machine-data", "drawing"] }).notNull(),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    byteSize: integer("byte_size").notNull(),
    sha256: text("sha256").notNull(),
    storage: text("storage").notNull(),
    storageKey: text("storage_key").notNull().unique("stored_files_storage_key_uq"),
    uploadedById: uuid("uploaded_by_id").references(() => users.id),
    ...stamps,
  },
  (t) => [index("stored_files_request_idx").on(t.requestId)],
);

/** The bytes of files kept in PostgreSQL (the default storage). */
export const fileBlobs = pgTable("file_blobs", {
  storageKey: text("storage_key").primaryKey(),
  bytes: bytea("bytes").notNull(),
  ...stamps,
});

/**
 * One version of a vendor's answer: the parsed machines (contract shape, SI), the
 * original file and its SHA-256 (for the web form, the SHA-256 of the canonical JSON).
 * Immutable: the database refuses UPDATE and DELETE (see the vendor-submissions-immutable
 * migration); a revision of the data is a new version.
 */
export const vendorSubmissions = pgTable(
  "vendor_submissions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    requestId: uuid("request_id").notNull().references(() => vendorRequests.id, { onDelete: "cascade" }),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    source: text("source", { enum: ["workbook", "csv", "form"] }).notNull(),
    machines: jsonb("machines").notNull(),
    // The frame of the machines' positions: "machine-datum" (template version 2 and the web form)
    // or "block" (version 1 template, and every version stored before the datum existed).
    frame: text("frame", { enum: ["machine-datum", "block"] }).notNull().default("block"),
    // The vendor's start-up and coast-down times per rotor ({ machine, rotor, startUpS?, coastDownS? }, s).
    rampTimes: jsonb("ramp_times").notNull().default(sql`'[]'::jsonb`),
    // Cascade only so that a removed request can take its files and versions together; on its
    // own, removing the file of a version is refused by the immutability trigger.
    fileId: uuid("file_id").references(() => storedFiles.id, { onDelete: "cascade" }),
    sha256: text("sha256").notNull(),
    note: text("note").notNull().default(""),
    submittedById: uuid("submitted_by_id").notNull().references(() => users.id),
    ...stamps,
  },
  (t) => [unique("vendor_submissions_request_version_uq").on(t.requestId, t.version), index("vendor_submissions_project_idx").on(t.projectId)],
);

/** Drawings (PDF) attached to a submission, fixed with it. */
export const vendorSubmissionDrawings = pgTable(
  "vendor_submission_drawings",
  {
    submissionId: uuid("submission_id").notNull().references(() => vendorSubmissions.id, { onDelete: "cascade" }),
    fileId: uuid("file_id")
      .notNull()
      .references(() => storedFiles.id, { onDelete: "cascade" }),
    ...stamps,
  },
  (t) => [primaryKey({ columns: [t.submissionId, t.fileId], name: "vendor_submission_drawings_pk" })],
);

/** The designer's decision on a submission: one per submission, final. */
export const vendorSubmissionReviews = pgTable("vendor_submission_reviews", {
  id: uuid("id").primaryKey().defaultRandom(),
  submissionId: uuid("submission_id")
    .notNull()
    .unique("vendor_submission_reviews_submission_uq")
    .references(() => vendorSubmissions.id, { onDelete: "cascade" }),
  decision: text("decision", { enum: ["accepted", "returned"] }).notNull(),
  comment: text("comment").notNull().default(""),
  // The draft version the accepted machines were saved as.
  draftVersion: integer("draft_version"),
  reviewedById: uuid("reviewed_by_id").notNull().references(() => users.id),
  ...stamps,
});

export type VendorRequestRow = typeof vendorRequests.$inferSelect;
export type StoredFileRow = typeof storedFiles.$inferSelect;
export type VendorSubmissionRow = typeof vendorSubmissions.$inferSelect;
export type VendorSubmissionReviewRow = typeof vendorSubmissionReviews.$inferSelect;

import { boolean, index, pgTable, text, timestamp, uuid, bigserial, uniqueIndex } from "drizzle-orm/pg-core";

const stamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
};

export const users = pgTable("users", {
  id: uuid("id").primaryKey().defaultRandom(),
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  // Null until an invited person sets a password through their one-time link.
  passwordHash: text("password_hash"),
  isAdmin: boolean("is_admin").notNull().default(false),
  mayCreateProjects: boolean("may_create_projects").notNull().default(false),
  // The person's display units; null follows each project's default.
  unitsPreference: text("units_preference", { enum: ["si", "us"] }),
  ...stamps,
});

// The sealed cookie carries the session id; this row makes sign-out final even
// for a copied cookie, while app servers themselves stay stateless.
export const sessions = pgTable(
  "sessions",
  {
    id: text("id").primaryKey(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    ...stamps,
  },
  (t) => [index("sessions_user_idx").on(t.userId)],
);

export const oneTimeTokens = pgTable("one_time_tokens", {
  id: uuid("id").primaryKey().defaultRandom(),
  purpose: text("purpose", { enum: ["password-reset", "invitation"] }).notNull(),
  // Only the SHA-256 of the token is stored; the token itself is in the e-mail.
  tokenHash: text("token_hash").notNull().unique(),
  userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
  projectId: uuid("project_id"),
  role: text("role"),
  companyId: uuid("company_id"),
  expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
  usedAt: timestamp("used_at", { withTimezone: true }),
  ...stamps,
});

export const signInFailures = pgTable(
  "sign_in_failures",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    email: text("email").notNull(),
    clientAddress: text("client_address").notNull(),
    ...stamps,
  },
  (t) => [index("sign_in_failures_email_idx").on(t.email, t.createdAt), index("sign_in_failures_addr_idx").on(t.clientAddress, t.createdAt)],
);

// Addresses an account has signed in from with its password: a wrong-password storm
// against the account slows sign-ins from new addresses, never from these.
export const knownSignInAddresses = pgTable(
  "known_sign_in_addresses",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    clientAddress: text("client_address").notNull(),
    lastSeenAt: timestamp("last_seen_at", { withTimezone: true }).notNull().defaultNow(),
    ...stamps,
  },
  (t) => [uniqueIndex("known_sign_in_addresses_user_addr_idx").on(t.userId, t.clientAddress)],
);

// Forgot-password requests: the throttling log and the work queue in one. The request
// path only counts and inserts, the same for known and unknown addresses; the mail
// worker looks the account up, makes the link and queues the message.
export const passwordResetRequests = pgTable(
  "password_reset_requests",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    email: text("email").notNull(),
    clientAddress: text("client_address").notNull(),
    processedAt: timestamp("processed_at", { withTimezone: true }),
    ...stamps,
  },
  (t) => [
    index("password_reset_requests_email_idx").on(t.email, t.createdAt),
    index("password_reset_requests_addr_idx").on(t.clientAddress, t.createdAt),
    index("password_reset_requests_pending_idx").on(t.processedAt, t.createdAt),
  ],
);

export type UserRow = typeof users.$inferSelect;
export type SessionRow = typeof sessions.$inferSelect;

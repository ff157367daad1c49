import { integer, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";

const stamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
};

// Every message the product sends is written here first, then handed to SMTP;
// one that cannot be delivered stays queued and is retried later.
export const outgoingEmails = pgTable("outgoing_emails", {
  id: uuid("id").primaryKey().defaultRandom(),
  to: text("to").notNull(),
  subject: text("subject").notNull(),
  text: text("text").notNull(),
  // "sending": claimed by one server, which sends it outside any transaction (no database
  // connection held while SMTP answers); the claim lapses at claimedUntil if that server dies.
  status: text("status", { enum: ["queued", "sending", "sent", "failed"] }).notNull().default("queued"),
  attempts: integer("attempts").notNull().default(0),
  claimToken: uuid("claim_token"),
  claimedUntil: timestamp("claimed_until", { withTimezone: true }),
  lastError: text("last_error"),
  sentAt: timestamp("sent_at", { withTimezone: true }),
  ...stamps,
});

// What the local fake SMTP server received (demo and tests only).
export const capturedEmails = pgTable("captured_emails", {
  id: uuid("id").primaryKey().defaultRandom(),
  envelopeFrom: text("envelope_from").notNull(),
  envelopeTo: jsonb("envelope_to").$type<string[]>().notNull(),
  subject: text("subject").notNull(),
  text: text("text").notNull(),
  raw: text("raw").notNull(),
  ...stamps,
});

export type OutgoingEmailRow = typeof outgoingEmails.$inferSelect;
export type CapturedEmailRow = typeof capturedEmails.$inferSelect;

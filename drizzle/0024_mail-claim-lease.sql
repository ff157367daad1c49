ALTER TABLE "outgoing_emails" ADD COLUMN "claim_token" uuid;--> statement-breakpoint
ALTER TABLE "outgoing_emails" ADD COLUMN "claimed_until" timestamp with time zone;
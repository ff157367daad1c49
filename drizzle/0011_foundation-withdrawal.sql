ALTER TABLE "foundations" ADD COLUMN "withdrawn_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "foundations" ADD COLUMN "withdrawn_by_id" uuid;--> statement-breakpoint
ALTER TABLE "foundations" ADD COLUMN "withdrawal_reason" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "foundations" ADD CONSTRAINT "foundations_withdrawn_by_id_users_id_fk" FOREIGN KEY ("withdrawn_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;
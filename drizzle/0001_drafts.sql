CREATE TABLE "foundation_drafts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"foundation_id" uuid NOT NULL,
	"input" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"vendor_submission_id" uuid,
	"updated_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "foundation_drafts_foundation_uq" UNIQUE("foundation_id")
);
--> statement-breakpoint
ALTER TABLE "foundation_drafts" ADD CONSTRAINT "foundation_drafts_foundation_id_foundations_id_fk" FOREIGN KEY ("foundation_id") REFERENCES "public"."foundations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "foundation_drafts" ADD CONSTRAINT "foundation_drafts_updated_by_id_users_id_fk" FOREIGN KEY ("updated_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;
CREATE TABLE "revision_checks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"revision_id" uuid NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"checked_by_id" uuid NOT NULL,
	"checked_by_role" text NOT NULL,
	"checked_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "revision_checks_revision_uq" UNIQUE("revision_id")
);
--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "sign_off_steps" text DEFAULT 'one' NOT NULL;--> statement-breakpoint
ALTER TABLE "revision_decisions" ADD COLUMN "decided_by_role" text;--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "purpose" text DEFAULT 'issued-for-check' NOT NULL;--> statement-breakpoint
ALTER TABLE "revision_checks" ADD CONSTRAINT "revision_checks_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_checks" ADD CONSTRAINT "revision_checks_checked_by_id_users_id_fk" FOREIGN KEY ("checked_by_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;
ALTER TABLE "foundation_drafts" ADD COLUMN "machine_placements" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "machine_placements" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "vendor_submissions" ADD COLUMN "frame" text DEFAULT 'block' NOT NULL;--> statement-breakpoint
ALTER TABLE "vendor_submissions" ADD COLUMN "ramp_times" jsonb DEFAULT '[]'::jsonb NOT NULL;
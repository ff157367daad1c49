ALTER TABLE "projects" ADD COLUMN "soil_band" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "revision_scheme" text DEFAULT 'letters' NOT NULL;
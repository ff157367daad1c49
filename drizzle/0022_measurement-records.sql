CREATE TABLE "measurement_records" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"foundation_id" uuid NOT NULL,
	"revision_id" uuid NOT NULL,
	"company_id" uuid,
	"measured_on" text NOT NULL,
	"measured_by" text NOT NULL,
	"instrument" text NOT NULL,
	"instrument_calibrated_on" text NOT NULL,
	"speed_rpm" real NOT NULL,
	"load" text DEFAULT '' NOT NULL,
	"kind" text NOT NULL,
	"file_id" uuid NOT NULL,
	"file_name" text NOT NULL,
	"sha256" text NOT NULL,
	"byte_size" integer NOT NULL,
	"readings" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"trace" jsonb,
	"verdicts" jsonb NOT NULL,
	"calibration" jsonb,
	"engine_version" text NOT NULL,
	"supersedes_id" uuid,
	"note" text DEFAULT '' NOT NULL,
	"created_by_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "measurement_records_speed_positive" CHECK ("measurement_records"."speed_rpm" > 0)
);
--> statement-breakpoint
ALTER TABLE "foundations" ADD COLUMN "soil_flag" jsonb;--> statement-breakpoint
ALTER TABLE "measurement_records" ADD CONSTRAINT "measurement_records_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurement_records" ADD CONSTRAINT "measurement_records_foundation_id_foundations_id_fk" FOREIGN KEY ("foundation_id") REFERENCES "public"."foundations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurement_records" ADD CONSTRAINT "measurement_records_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurement_records" ADD CONSTRAINT "measurement_records_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurement_records" ADD CONSTRAINT "measurement_records_file_id_stored_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."stored_files"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurement_records" ADD CONSTRAINT "measurement_records_supersedes_id_measurement_records_id_fk" FOREIGN KEY ("supersedes_id") REFERENCES "public"."measurement_records"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurement_records" ADD CONSTRAINT "measurement_records_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "measurement_records_revision_idx" ON "measurement_records" USING btree ("revision_id","created_at");--> statement-breakpoint
CREATE INDEX "measurement_records_foundation_idx" ON "measurement_records" USING btree ("foundation_id","created_at");
ALTER TABLE "vendor_submission_drawings" DROP CONSTRAINT "vendor_submission_drawings_file_id_stored_files_id_fk";
--> statement-breakpoint
ALTER TABLE "vendor_submissions" DROP CONSTRAINT "vendor_submissions_file_id_stored_files_id_fk";
--> statement-breakpoint
ALTER TABLE "vendor_submission_drawings" ADD CONSTRAINT "vendor_submission_drawings_file_id_stored_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."stored_files"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vendor_submissions" ADD CONSTRAINT "vendor_submissions_file_id_stored_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."stored_files"("id") ON DELETE cascade ON UPDATE no action;
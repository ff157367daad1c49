-- A vendor submission is a record of what the vendor sent: the database itself refuses to
-- change one, whatever the application code does; a revision of the data is a new version.
-- Its drawings and its review (a decision is final) are fixed the same way; a stored file's
-- row and bytes never change (an attached file cannot go either: the foreign keys hold it).
-- A row may only go when its parent has gone in the same statement (a project or request
-- removed with ON DELETE CASCADE), never on its own.
CREATE FUNCTION plinth_vendor_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  parent_gone boolean := false;
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF TG_TABLE_NAME = 'vendor_submissions' THEN
      parent_gone := NOT EXISTS (SELECT 1 FROM "vendor_requests" r WHERE r."id" = OLD."request_id");
    ELSIF TG_TABLE_NAME IN ('vendor_submission_reviews', 'vendor_submission_drawings') THEN
      parent_gone := NOT EXISTS (SELECT 1 FROM "vendor_submissions" s WHERE s."id" = OLD."submission_id");
    END IF;
    IF parent_gone THEN
      RETURN OLD;
    END IF;
  END IF;
  RAISE EXCEPTION '% rows are immutable: % refused', TG_TABLE_NAME, TG_OP
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$;
--> statement-breakpoint
CREATE TRIGGER vendor_submissions_immutable BEFORE UPDATE OR DELETE ON "vendor_submissions"
  FOR EACH ROW EXECUTE FUNCTION plinth_vendor_refuse_change();
--> statement-breakpoint
CREATE TRIGGER vendor_submission_drawings_immutable BEFORE UPDATE OR DELETE ON "vendor_submission_drawings"
  FOR EACH ROW EXECUTE FUNCTION plinth_vendor_refuse_change();
--> statement-breakpoint
CREATE TRIGGER vendor_submission_reviews_immutable BEFORE UPDATE OR DELETE ON "vendor_submission_reviews"
  FOR EACH ROW EXECUTE FUNCTION plinth_vendor_refuse_change();
--> statement-breakpoint
CREATE TRIGGER stored_files_immutable BEFORE UPDATE ON "stored_files"
  FOR EACH ROW EXECUTE FUNCTION plinth_vendor_refuse_change();
--> statement-breakpoint
-- The bytes under a key never change (the submission keeps their SHA-256); removing an
-- unattached blob stays possible for a later clean-up of abandoned uploads.
CREATE TRIGGER file_blobs_immutable BEFORE UPDATE ON "file_blobs"
  FOR EACH ROW EXECUTE FUNCTION plinth_vendor_refuse_change();

-- A drawing link may also go when its submission's request has gone: removing a request
-- removes its files and versions in one statement, and the links go with the files
-- (ON DELETE CASCADE) before or after the versions. A file removed on its own still has
-- its request, so removing it (and with it a version or a link) is refused as before.
CREATE OR REPLACE FUNCTION plinth_vendor_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  parent_gone boolean := false;
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF TG_TABLE_NAME = 'vendor_submissions' THEN
      parent_gone := NOT EXISTS (SELECT 1 FROM "vendor_requests" r WHERE r."id" = OLD."request_id");
    ELSIF TG_TABLE_NAME = 'vendor_submission_reviews' THEN
      parent_gone := NOT EXISTS (SELECT 1 FROM "vendor_submissions" s WHERE s."id" = OLD."submission_id");
    ELSIF TG_TABLE_NAME = 'vendor_submission_drawings' THEN
      parent_gone := NOT EXISTS (
        SELECT 1 FROM "vendor_submissions" s JOIN "vendor_requests" r ON r."id" = s."request_id" WHERE s."id" = OLD."submission_id"
      );
    END IF;
    IF parent_gone THEN
      RETURN OLD;
    END IF;
  END IF;
  RAISE EXCEPTION '% rows are immutable: % refused', TG_TABLE_NAME, TG_OP
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$;

-- Two-step sign-off in the database too: a check is final, is never by one of the revision's
-- authors (its issuer or a draft editor), and the checker never approves what they checked.
CREATE TRIGGER revision_checks_immutable BEFORE UPDATE OR DELETE ON "revision_checks"
  FOR EACH ROW EXECUTE FUNCTION plinth_refuse_change();
--> statement-breakpoint
CREATE TRIGGER revision_checks_no_truncate BEFORE TRUNCATE ON "revision_checks"
  FOR EACH STATEMENT EXECUTE FUNCTION plinth_refuse_change();
--> statement-breakpoint
CREATE FUNCTION plinth_refuse_self_check() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF EXISTS (SELECT 1 FROM "revisions" r WHERE r."id" = NEW."revision_id" AND (r."issued_by_id" = NEW."checked_by_id" OR NEW."checked_by_id" = ANY(r."editor_ids"))) THEN
    RAISE EXCEPTION 'a revision cannot be checked by one of its authors'
      USING ERRCODE = 'check_violation';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER revision_checks_not_by_author BEFORE INSERT ON "revision_checks"
  FOR EACH ROW EXECUTE FUNCTION plinth_refuse_self_check();
--> statement-breakpoint
CREATE FUNCTION plinth_refuse_approval_by_checker() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF NEW."outcome" = 'approved' AND EXISTS (SELECT 1 FROM "revision_checks" c WHERE c."revision_id" = NEW."revision_id" AND c."checked_by_id" = NEW."decided_by_id") THEN
    RAISE EXCEPTION 'a revision cannot be approved by the person who checked it'
      USING ERRCODE = 'check_violation';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER revision_decisions_not_by_checker BEFORE INSERT ON "revision_decisions"
  FOR EACH ROW EXECUTE FUNCTION plinth_refuse_approval_by_checker();

-- An issued revision is a record of what was signed: the database itself refuses to
-- change or remove one, whatever the application code does. Decisions are final too.
CREATE FUNCTION plinth_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION '% rows are immutable: % refused', TG_TABLE_NAME, TG_OP
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$;
--> statement-breakpoint
CREATE TRIGGER revisions_immutable BEFORE UPDATE OR DELETE ON "revisions"
  FOR EACH ROW EXECUTE FUNCTION plinth_refuse_change();
--> statement-breakpoint
CREATE TRIGGER revisions_no_truncate BEFORE TRUNCATE ON "revisions"
  FOR EACH STATEMENT EXECUTE FUNCTION plinth_refuse_change();
--> statement-breakpoint
CREATE TRIGGER revision_decisions_immutable BEFORE UPDATE OR DELETE ON "revision_decisions"
  FOR EACH ROW EXECUTE FUNCTION plinth_refuse_change();
--> statement-breakpoint
CREATE TRIGGER revision_decisions_no_truncate BEFORE TRUNCATE ON "revision_decisions"
  FOR EACH STATEMENT EXECUTE FUNCTION plinth_refuse_change();
--> statement-breakpoint
-- Nobody decides on a revision they issued, even through a query that forgets to check.
CREATE FUNCTION plinth_refuse_self_decision() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF EXISTS (SELECT 1 FROM "revisions" r WHERE r."id" = NEW."revision_id" AND r."issued_by_id" = NEW."decided_by_id") THEN
    RAISE EXCEPTION 'a revision cannot be decided by the person who issued it'
      USING ERRCODE = 'check_violation';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER revision_decisions_not_by_issuer BEFORE INSERT ON "revision_decisions"
  FOR EACH ROW EXECUTE FUNCTION plinth_refuse_self_decision();

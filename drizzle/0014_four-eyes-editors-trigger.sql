-- Four eyes in the database too: nobody who edited the draft of a revision (its editor set)
-- decides on it, as nobody who issued it does, even through a query that forgets to check.
CREATE OR REPLACE FUNCTION plinth_refuse_self_decision() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF EXISTS (SELECT 1 FROM "revisions" r WHERE r."id" = NEW."revision_id" AND r."issued_by_id" = NEW."decided_by_id") THEN
    RAISE EXCEPTION 'a revision cannot be decided by the person who issued it'
      USING ERRCODE = 'check_violation';
  END IF;
  IF EXISTS (SELECT 1 FROM "revisions" r WHERE r."id" = NEW."revision_id" AND NEW."decided_by_id" = ANY(r."editor_ids")) THEN
    RAISE EXCEPTION 'a revision cannot be decided by a person who edited its draft'
      USING ERRCODE = 'check_violation';
  END IF;
  RETURN NEW;
END;
$$;

-- A measurement record is what was measured and how the desk judged it at the time: the
-- database refuses to change or remove one, whatever the application code does. A correction
-- is a new record pointing at the one it corrects (supersedes_id).
CREATE FUNCTION plinth_measurement_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION '% rows are immutable: % refused', TG_TABLE_NAME, TG_OP
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$;
--> statement-breakpoint
CREATE TRIGGER measurement_records_immutable BEFORE UPDATE OR DELETE ON "measurement_records"
  FOR EACH ROW EXECUTE FUNCTION plinth_measurement_refuse_change();

-- A published procedure version never changes: attempts are scored against it and point at it.
CREATE OR REPLACE FUNCTION procedure_versions_refuse_update() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'procedure version % of % is immutable; publish a new version instead', OLD.version, OLD.procedure_id;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER procedure_versions_immutable
  BEFORE UPDATE ON procedure_versions
  FOR EACH ROW EXECUTE FUNCTION procedure_versions_refuse_update();

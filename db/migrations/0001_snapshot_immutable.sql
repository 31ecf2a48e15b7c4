-- Snapshots are immutable: the database itself refuses UPDATE and DELETE on them.
CREATE OR REPLACE FUNCTION snapshots_refuse_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'snapshots are immutable (% refused on snapshot %)', TG_OP, OLD.id
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER snapshots_immutable
  BEFORE UPDATE OR DELETE ON snapshots
  FOR EACH ROW EXECUTE FUNCTION snapshots_refuse_change();
--> statement-breakpoint
CREATE TRIGGER snapshots_no_truncate
  BEFORE TRUNCATE ON snapshots
  FOR EACH STATEMENT EXECUTE FUNCTION snapshots_refuse_change();

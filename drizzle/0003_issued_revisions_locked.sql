-- An issued revision is locked: its model, site and issue record cannot change or be deleted.
CREATE OR REPLACE FUNCTION facility_revision_locked() RETURNS trigger AS $$
BEGIN
  IF OLD.issued_at IS NOT NULL THEN
    RAISE EXCEPTION 'revision % of facility % is issued and locked', OLD.number, OLD.facility_id;
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  IF NEW.model IS DISTINCT FROM OLD.model OR NEW.site IS DISTINCT FROM OLD.site OR NEW.number <> OLD.number THEN
    RAISE EXCEPTION 'revision snapshots are immutable';
  END IF;
  RETURN NEW;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER facility_revisions_lock BEFORE UPDATE OR DELETE ON facility_revisions
  FOR EACH ROW EXECUTE FUNCTION facility_revision_locked();

-- Guards the database keeps itself, whatever the app does.
CREATE EXTENSION IF NOT EXISTS btree_gist;
--> statement-breakpoint
-- Serial ranges of one board model never overlap.
ALTER TABLE "production_lots" ADD CONSTRAINT "production_lots_no_overlap"
  EXCLUDE USING gist ("board_model_id" WITH =, int8range("serial_from", "serial_to", '[]') WITH &&);
--> statement-breakpoint
-- A published profile version is immutable: its document, version and checksums never change.
CREATE OR REPLACE FUNCTION loopkeeper_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION '% rows are immutable: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'restrict_violation';
END;
$$;
--> statement-breakpoint
CREATE TRIGGER profile_versions_immutable BEFORE UPDATE OR DELETE ON "profile_versions"
  FOR EACH ROW EXECUTE FUNCTION loopkeeper_refuse_change();
--> statement-breakpoint
CREATE TRIGGER audit_events_immutable BEFORE UPDATE OR DELETE ON "audit_events"
  FOR EACH ROW EXECUTE FUNCTION loopkeeper_refuse_change();

-- A production lot may only name a build the factory may flash (pilot or production).
-- The app checks this under a row lock on the build; the trigger keeps any other writer honest.
-- Recording a lot of a build withdrawn later (historic data entry by the demo seed only)
-- sets loopkeeper.historic_lot = 'on' for its own transaction.
CREATE OR REPLACE FUNCTION loopkeeper_lot_build_stage() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  build_stage text;
BEGIN
  IF coalesce(current_setting('loopkeeper.historic_lot', true), '') = 'on' THEN
    RETURN NEW;
  END IF;
  SELECT stage::text INTO build_stage FROM builds WHERE id = NEW.build_id FOR SHARE;
  IF build_stage IS NULL OR build_stage NOT IN ('pilot', 'production') THEN
    RAISE EXCEPTION 'lot % names a build at stage %; lots may only name builds at pilot or production', NEW.lot_code, coalesce(build_stage, 'unknown')
      USING ERRCODE = 'check_violation', CONSTRAINT = 'production_lots_build_stage';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER production_lots_build_stage BEFORE INSERT OR UPDATE OF build_id ON "production_lots"
  FOR EACH ROW EXECUTE FUNCTION loopkeeper_lot_build_stage();

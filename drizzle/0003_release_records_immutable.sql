-- Builds past draft, their slots, and sent mail are records of what happened: the app never
-- rewrites them, and the database refuses it whatever the app does.

-- A build's content is fixed once it leaves draft; only its stage and release paperwork move on.
CREATE OR REPLACE FUNCTION loopkeeper_guard_build() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF OLD.stage <> 'draft' THEN
      RAISE EXCEPTION 'builds past draft are immutable: DELETE refused' USING ERRCODE = 'restrict_violation';
    END IF;
    RETURN OLD;
  END IF;
  IF OLD.stage <> 'draft' AND (
       NEW.board_model_id IS DISTINCT FROM OLD.board_model_id
    OR NEW.version IS DISTINCT FROM OLD.version
    OR NEW.revision_range IS DISTINCT FROM OLD.revision_range
    OR NEW.author_user_id IS DISTINCT FROM OLD.author_user_id
    OR NEW.firmware_upload_id IS DISTINCT FROM OLD.firmware_upload_id
    OR NEW.bank_image IS DISTINCT FROM OLD.bank_image
    OR NEW.bank_bytes IS DISTINCT FROM OLD.bank_bytes
    OR NEW.bank_sha256 IS DISTINCT FROM OLD.bank_sha256
    OR NEW.bank_crc32 IS DISTINCT FROM OLD.bank_crc32
    OR NEW.created_at IS DISTINCT FROM OLD.created_at
    OR (OLD.stage = 'withdrawn')
    OR (OLD.withdrawn_reason IS NOT NULL AND NEW.withdrawn_reason IS DISTINCT FROM OLD.withdrawn_reason)
    OR (OLD.release_notes IS NOT NULL AND NEW.release_notes IS DISTINCT FROM OLD.release_notes)
  ) THEN
    RAISE EXCEPTION 'builds past draft are immutable: only the stage and release records may change' USING ERRCODE = 'restrict_violation';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER builds_immutable_past_draft BEFORE UPDATE OR DELETE ON "builds"
  FOR EACH ROW EXECUTE FUNCTION loopkeeper_guard_build();
--> statement-breakpoint
-- Slots change only while their build is a draft, or in the transaction that creates the build.
CREATE OR REPLACE FUNCTION loopkeeper_guard_build_slot() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  b record;
BEGIN
  SELECT stage, xmin::text AS created_xid INTO b FROM builds WHERE id = COALESCE(NEW.build_id, OLD.build_id);
  IF NOT FOUND OR b.stage = 'draft' THEN
    RETURN COALESCE(NEW, OLD);
  END IF;
  IF TG_OP = 'INSERT' AND b.created_xid = (pg_current_xact_id()::text::bigint % 4294967296)::text THEN
    RETURN NEW;
  END IF;
  RAISE EXCEPTION 'slots of a build past draft are immutable: % refused', TG_OP USING ERRCODE = 'restrict_violation';
END;
$$;
--> statement-breakpoint
CREATE TRIGGER build_slots_immutable_past_draft BEFORE INSERT OR UPDATE OR DELETE ON "build_slots"
  FOR EACH ROW EXECUTE FUNCTION loopkeeper_guard_build_slot();
--> statement-breakpoint
-- A sent message is history.
CREATE OR REPLACE FUNCTION loopkeeper_guard_sent_mail() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF OLD.status = 'sent' THEN
    RAISE EXCEPTION 'sent mail is immutable: % refused', TG_OP USING ERRCODE = 'restrict_violation';
  END IF;
  RETURN COALESCE(NEW, OLD);
END;
$$;
--> statement-breakpoint
CREATE TRIGGER mail_outbox_sent_immutable BEFORE UPDATE OR DELETE ON "mail_outbox"
  FOR EACH ROW EXECUTE FUNCTION loopkeeper_guard_sent_mail();

-- App instances cache who a token or session belongs to for a few seconds. Whatever changes
-- a user's access (role, disabling, sign-out everywhere, password, a token revoked or
-- deleted) announces it on this channel when the transaction commits, whichever code path
-- made the change, so every instance drops its cached entry at once.
CREATE OR REPLACE FUNCTION loopkeeper_notify_user_access() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    PERFORM pg_notify('loopkeeper_actor_changed', OLD.id::text);
    RETURN OLD;
  END IF;
  IF NEW.role IS DISTINCT FROM OLD.role
     OR NEW.disabled_at IS DISTINCT FROM OLD.disabled_at
     OR NEW.session_epoch IS DISTINCT FROM OLD.session_epoch
     OR NEW.password_hash IS DISTINCT FROM OLD.password_hash
     OR NEW.email IS DISTINCT FROM OLD.email
     OR NEW.name IS DISTINCT FROM OLD.name THEN
    PERFORM pg_notify('loopkeeper_actor_changed', NEW.id::text);
  END IF;
  RETURN NEW;
END $$;
--> statement-breakpoint
CREATE TRIGGER users_notify_access AFTER UPDATE OR DELETE ON users
  FOR EACH ROW EXECUTE FUNCTION loopkeeper_notify_user_access();
--> statement-breakpoint
CREATE OR REPLACE FUNCTION loopkeeper_notify_token_access() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    PERFORM pg_notify('loopkeeper_actor_changed', OLD.user_id::text);
    RETURN OLD;
  END IF;
  IF NEW.revoked_at IS DISTINCT FROM OLD.revoked_at
     OR NEW.expires_at IS DISTINCT FROM OLD.expires_at
     OR NEW.user_id IS DISTINCT FROM OLD.user_id THEN
    PERFORM pg_notify('loopkeeper_actor_changed', OLD.user_id::text);
  END IF;
  RETURN NEW;
END $$;
--> statement-breakpoint
CREATE TRIGGER api_tokens_notify_access AFTER UPDATE OR DELETE ON api_tokens
  FOR EACH ROW EXECUTE FUNCTION loopkeeper_notify_token_access();

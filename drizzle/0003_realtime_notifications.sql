-- Live co-editing (docs/co-editing.md). Three things every server process must hear about, whoever
-- made the change, so they are raised by the database itself on the channel "tapline_realtime":
--  1. a sheet change that did not come through the live path (REST save, revision restore,
--     import) is recorded in the operation log as a whole-sheet replace, so the log stays the
--     complete history and live clients receive it like any other operation;
--  2. a session row deleted (sign-out, expiry): sockets opened with it are closed;
--  3. a membership changed or removed (role change, removal, project deleted): the sockets of
--     that user in that project are told at once.
-- The live path marks its own transactions with tapline.sheet_writer = 'realtime' and writes
-- its log rows itself.
CREATE OR REPLACE FUNCTION tapline_log_sheet_replace() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF NEW.version IS DISTINCT FROM OLD.version
     AND coalesce(current_setting('tapline.sheet_writer', true), '') <> 'realtime' THEN
    INSERT INTO sheet_ops (project_id, version, author_id, ops)
    VALUES (NEW.id, NEW.version, NEW.updated_by, jsonb_build_array(jsonb_build_object('op', 'replaceSheet', 'sheet', NEW.sheet)))
    ON CONFLICT (project_id, version) DO NOTHING;
    IF FOUND THEN
      PERFORM pg_notify('tapline_realtime', json_build_object('kind', 'sheet', 'projectId', NEW.id, 'version', NEW.version)::text);
    END IF;
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER projects_log_sheet_replace AFTER UPDATE OF version ON projects
  FOR EACH ROW EXECUTE FUNCTION tapline_log_sheet_replace();
--> statement-breakpoint
CREATE OR REPLACE FUNCTION tapline_notify_session_end() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM pg_notify('tapline_realtime', json_build_object('kind', 'session', 'sid', OLD.sid)::text);
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER session_notify_end AFTER DELETE ON session
  FOR EACH ROW EXECUTE FUNCTION tapline_notify_session_end();
--> statement-breakpoint
CREATE OR REPLACE FUNCTION tapline_notify_membership() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    PERFORM pg_notify('tapline_realtime', json_build_object('kind', 'membership', 'projectId', OLD.project_id, 'userId', OLD.user_id, 'role', NULL)::text);
  ELSIF NEW.role IS DISTINCT FROM OLD.role THEN
    PERFORM pg_notify('tapline_realtime', json_build_object('kind', 'membership', 'projectId', NEW.project_id, 'userId', NEW.user_id, 'role', NEW.role)::text);
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER memberships_notify_change AFTER UPDATE OR DELETE ON memberships
  FOR EACH ROW EXECUTE FUNCTION tapline_notify_membership();

-- The audit trail is append-only: what happened stays recorded as it was. Rows are only
-- ever inserted; UPDATE, DELETE and TRUNCATE are refused by the database itself, whatever
-- the application does. (A user with audit events can therefore not be deleted: people
-- leave a firm by losing their membership, their history stays.)
CREATE FUNCTION audit_event_append_only() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'the audit trail is append-only: % on audit_event is not allowed', TG_OP
    USING ERRCODE = 'restrict_violation',
          HINT = 'Record a new audit event instead of changing or removing one.';
END;
$$;
--> statement-breakpoint
CREATE TRIGGER audit_event_no_update_or_delete
  BEFORE UPDATE OR DELETE ON "audit_event"
  FOR EACH ROW EXECUTE FUNCTION audit_event_append_only();
--> statement-breakpoint
CREATE TRIGGER audit_event_no_truncate
  BEFORE TRUNCATE ON "audit_event"
  FOR EACH STATEMENT EXECUTE FUNCTION audit_event_append_only();

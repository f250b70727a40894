-- A saved revision of a case is a record of what was written and calculated: it is never
-- changed and never deleted. Every save adds a new revision instead.
CREATE FUNCTION case_revision_immutable() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'case revisions are immutable: % on case_revision is not allowed; save a new revision instead', TG_OP
    USING ERRCODE = 'restrict_violation',
          HINT = 'Every save of a case writes a new case_revision row; earlier revisions stay as they were.';
END;
$$;
--> statement-breakpoint
CREATE TRIGGER case_revision_no_update_or_delete
  BEFORE UPDATE OR DELETE ON "case_revision"
  FOR EACH ROW EXECUTE FUNCTION case_revision_immutable();
--> statement-breakpoint
CREATE TRIGGER case_revision_no_truncate
  BEFORE TRUNCATE ON "case_revision"
  FOR EACH STATEMENT EXECUTE FUNCTION case_revision_immutable();

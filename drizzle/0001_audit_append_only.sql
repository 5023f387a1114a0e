-- The audit log is append-only: refuse every UPDATE and DELETE, whoever asks.
CREATE OR REPLACE FUNCTION audit_entries_refuse_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'audit_entries is append-only (% refused)', TG_OP USING ERRCODE = 'insufficient_privilege';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER audit_entries_append_only
  BEFORE UPDATE OR DELETE ON audit_entries
  FOR EACH ROW EXECUTE FUNCTION audit_entries_refuse_change();
--> statement-breakpoint
CREATE TRIGGER audit_entries_no_truncate
  BEFORE TRUNCATE ON audit_entries
  FOR EACH STATEMENT EXECUTE FUNCTION audit_entries_refuse_change();

-- Server schema version 9: readings taken again after the repair, as in the bench's file (version
-- 9 there too), in a table of their own so that no diagnosis counts them, each with the healthy
-- band it was checked against. Each takes a change number when added, so that benches pull it. A
-- new table only: nothing on the server changes, so no change numbers are taken.

CREATE TABLE after_repair_reading (
  row_no BIGINT GENERATED ALWAYS AS IDENTITY,
  id TEXT PRIMARY KEY,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  at TEXT NOT NULL,
  value DOUBLE PRECISION NOT NULL,
  meter TEXT NOT NULL,
  taken_at BIGINT NOT NULL,
  healthy_low DOUBLE PRECISION,
  healthy_high DOUBLE PRECISION,
  change_no BIGINT NOT NULL DEFAULT 0
);
CREATE INDEX after_repair_by_case ON after_repair_reading (case_id, taken_at);
CREATE INDEX after_repair_reading_by_change ON after_repair_reading (change_no);
CREATE TRIGGER after_repair_reading_change BEFORE INSERT OR UPDATE ON after_repair_reading
  FOR EACH ROW EXECUTE FUNCTION stamp_change();

-- A new table has no rights yet: each bench role that may add readings gets the same rights on it,
-- so that a shop brought up to date keeps syncing without running server-init again.
DO 'DECLARE r record;
BEGIN
  FOR r IN SELECT DISTINCT grantee FROM information_schema.role_table_grants
           WHERE table_schema = current_schema() AND table_name = ''reading''
             AND privilege_type = ''INSERT'' AND grantee <> current_user LOOP
    EXECUTE format(''GRANT SELECT, INSERT, UPDATE ON after_repair_reading TO %I'', r.grantee);
  END LOOP;
END';

-- Server schema version 8: photos of the board attached to a case, as in the bench's file
-- (version 8 there too). The picture is kept exactly as attached (PNG or JPEG, at most 20 MB);
-- like every record it takes a change number when added, so that benches pull it. A new table
-- only: nothing on the server changes, so no change numbers are taken.

CREATE TABLE case_photo (
  row_no BIGINT GENERATED ALWAYS AS IDENTITY,
  id TEXT PRIMARY KEY,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  file_name TEXT NOT NULL,
  media_type TEXT NOT NULL CHECK (media_type IN ('image/png', 'image/jpeg')),
  width INTEGER NOT NULL,
  height INTEGER NOT NULL,
  bytes BIGINT NOT NULL,
  attached_at BIGINT NOT NULL,
  attached_by TEXT NOT NULL,
  image BYTEA NOT NULL,
  change_no BIGINT NOT NULL DEFAULT 0
);
CREATE INDEX photo_by_case ON case_photo (case_id, attached_at);
CREATE INDEX case_photo_by_change ON case_photo (change_no);
CREATE TRIGGER case_photo_change BEFORE INSERT OR UPDATE ON case_photo
  FOR EACH ROW EXECUTE FUNCTION stamp_change();

-- A new table has no rights yet: each bench role that may add readings gets the same rights on
-- photos, so that a shop brought up to date keeps syncing without running server-init again.
DO 'DECLARE r record;
BEGIN
  FOR r IN SELECT DISTINCT grantee FROM information_schema.role_table_grants
           WHERE table_schema = current_schema() AND table_name = ''reading''
             AND privilege_type = ''INSERT'' AND grantee <> current_user LOOP
    EXECUTE format(''GRANT SELECT, INSERT, UPDATE ON case_photo TO %I'', r.grantee);
  END LOOP;
END';

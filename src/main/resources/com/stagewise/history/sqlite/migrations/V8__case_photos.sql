-- Schema version 8: photos of the board attached to a case. The picture (PNG or JPEG, at most
-- 20 MB) is kept exactly as attached, with the name of the file it came from, its kind and size in
-- pixels, and when and by whom it was attached. A photo is never edited; like every record it
-- goes to the outbox when added, so that sync carries it to the shop server. Nothing earlier
-- changes: a new table only.

CREATE TABLE case_photo (
  row INTEGER PRIMARY KEY,
  id TEXT NOT NULL UNIQUE,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  file_name TEXT NOT NULL,
  media_type TEXT NOT NULL CHECK (media_type IN ('image/png', 'image/jpeg')),
  width INTEGER NOT NULL,
  height INTEGER NOT NULL,
  bytes INTEGER NOT NULL,
  attached_at INTEGER NOT NULL,
  attached_by TEXT NOT NULL,
  image BLOB NOT NULL
);
CREATE INDEX photo_by_case ON case_photo (case_id, attached_at);

CREATE TRIGGER case_photo_outbox_insert AFTER INSERT ON case_photo BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('photo', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'photo' AND id = new.id), 0) + 1);
END;

-- Schema version 4: power-off (ohms) readings. A reading may now be of kind 'ohms', between "at"
-- and a second point, to_point (empty for volts); an ohms reading's value is in ohms, and the
-- meter's over-range (OL) is stored as +Infinity. SQLite cannot widen a CHECK constraint in place,
-- so the table is rebuilt the way SQLite's documentation says (a new table, every row copied with
-- its rowid so arrival order is kept, the old table dropped, the new one renamed, its index and
-- outbox triggers made again). Copying fires no trigger: the outbox is unchanged.

CREATE TABLE reading_v4 (
  id TEXT PRIMARY KEY NOT NULL,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  at TEXT NOT NULL,
  kind TEXT NOT NULL CHECK (kind IN ('dc', 'ac', 'ohms')),
  value REAL NOT NULL,
  hz REAL,
  uncertainty REAL,
  meter TEXT NOT NULL,
  taken_at INTEGER NOT NULL,
  to_point TEXT NOT NULL DEFAULT '',
  CHECK ((kind = 'ohms') = (to_point <> ''))
);
INSERT INTO reading_v4 (rowid, id, case_id, at, kind, value, hz, uncertainty, meter, taken_at)
  SELECT rowid, id, case_id, at, kind, value, hz, uncertainty, meter, taken_at FROM reading;
DROP TABLE reading;
ALTER TABLE reading_v4 RENAME TO reading;
CREATE INDEX reading_by_case ON reading (case_id, taken_at);
CREATE TRIGGER reading_outbox_insert AFTER INSERT ON reading BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('reading', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'reading' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER reading_outbox_update AFTER UPDATE ON reading BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('reading', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'reading' AND id = new.id), 0) + 1);
END;

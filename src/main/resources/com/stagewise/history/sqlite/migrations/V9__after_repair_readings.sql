-- Schema version 9: readings taken again after the repair, at the points read during the
-- diagnosis, each with the healthy band it was checked against (NULL ends when none was known).
-- They are kept in a table of their own, apart from the readings of the fault, so that no
-- diagnosis ever counts them. Never edited once stored; like every record each goes to the
-- outbox when added. A new table only: nothing earlier changes.

CREATE TABLE after_repair_reading (
  row INTEGER PRIMARY KEY,
  id TEXT NOT NULL UNIQUE,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  at TEXT NOT NULL,
  value REAL NOT NULL,
  meter TEXT NOT NULL,
  taken_at INTEGER NOT NULL,
  healthy_low REAL,
  healthy_high REAL
);
CREATE INDEX after_repair_by_case ON after_repair_reading (case_id, taken_at);

CREATE TRIGGER after_repair_reading_outbox_insert AFTER INSERT ON after_repair_reading BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('after-repair reading', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'after-repair reading' AND id = new.id), 0)
    + 1);
END;

-- Schema version 4: readings struck out. A mistyped reading is never deleted: struck_at says when
-- it was struck out (NULL while it stands), and updated_at when it was taken, struck or restored,
-- whichever came last, so that a strike travels to other benches like any other change. Readings
-- stored before this version stand and were last changed when they were taken.

ALTER TABLE reading ADD COLUMN struck_at INTEGER;
ALTER TABLE reading ADD COLUMN updated_at INTEGER NOT NULL DEFAULT 0;

-- Filling in updated_at is not a change to send to the server: the outbox trigger is set aside
-- for it and made again as version 3 made it.
DROP TRIGGER reading_outbox_update;
UPDATE reading SET updated_at = taken_at;
CREATE TRIGGER reading_outbox_update AFTER UPDATE ON reading BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('reading', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'reading' AND id = new.id), 0) + 1);
END;

-- Server schema version 4: readings struck out, as in the bench's file (version 4 there too).
-- struck_at says when a reading was struck out (NULL while it stands); updated_at when it was
-- taken, struck or restored, whichever came last. Filling in updated_at for the readings already
-- on the server is not a change for the benches to pull, so it does not take change numbers.

ALTER TABLE reading ADD COLUMN struck_at BIGINT;
ALTER TABLE reading ADD COLUMN updated_at BIGINT NOT NULL DEFAULT 0;
ALTER TABLE reading DISABLE TRIGGER reading_change;
UPDATE reading SET updated_at = taken_at;
ALTER TABLE reading ENABLE TRIGGER reading_change;

-- Server schema version 7: the measure of an AC reading, as in the bench's file (version 7 there
-- too): rms or pp, NULL for a peak, the only measure AC readings had before. Adding a column
-- changes no row, so no change numbers are taken.

ALTER TABLE reading ADD COLUMN measure TEXT CHECK (measure IN ('rms', 'peak', 'pp'));

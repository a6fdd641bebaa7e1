-- Server schema version 10: readings after the repair of every kind, as in the bench's file
-- (version 10 there too): kind ('dc', 'ac' or 'ohms'), the measure of an AC reading (rms, peak or
-- pp) and its test frequency hz, the second point to_point of an ohms reading (OL stored as
-- 'Infinity'). Every row of version 9 was a DC level, and the defaults read it so. Adding columns
-- with constant defaults rewrites no row and fires no trigger, so no change numbers are taken; the
-- bench roles' rights on the table cover the new columns.

ALTER TABLE after_repair_reading ADD COLUMN kind TEXT NOT NULL DEFAULT 'dc';
ALTER TABLE after_repair_reading ADD COLUMN measure TEXT;
ALTER TABLE after_repair_reading ADD COLUMN hz DOUBLE PRECISION;
ALTER TABLE after_repair_reading ADD COLUMN to_point TEXT NOT NULL DEFAULT '';
ALTER TABLE after_repair_reading ADD CONSTRAINT after_repair_kind_check
  CHECK (kind IN ('dc', 'ac', 'ohms'));
ALTER TABLE after_repair_reading ADD CONSTRAINT after_repair_measure_check
  CHECK ((kind = 'ac') = (measure IS NOT NULL)
    AND (measure IS NULL OR measure IN ('rms', 'peak', 'pp')));
ALTER TABLE after_repair_reading ADD CONSTRAINT after_repair_hz_check
  CHECK ((kind = 'ac') = (hz IS NOT NULL) AND (hz IS NULL OR hz > 0));
ALTER TABLE after_repair_reading ADD CONSTRAINT after_repair_to_point_check
  CHECK ((kind = 'ohms') = (to_point <> ''));

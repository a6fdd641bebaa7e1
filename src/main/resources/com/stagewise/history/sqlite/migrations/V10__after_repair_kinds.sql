-- Schema version 10: a reading taken again after the repair may be of any kind read during the
-- diagnosis: a DC level, an AC amplitude (in the measure it was read in, rms, peak or pp, at the
-- test frequency hz) or ohms with the power off between "at" and a second point, to_point (its
-- value in ohms, the meter's over-range OL stored as +Infinity, as in the reading table). Every row
-- of version 9 was a DC level: the defaults read it so (kind 'dc', no measure, no frequency, no
-- second point). Adding columns changes no row, so nothing goes to the outbox.

ALTER TABLE after_repair_reading ADD COLUMN kind TEXT NOT NULL DEFAULT 'dc'
  CHECK (kind IN ('dc', 'ac', 'ohms'));
ALTER TABLE after_repair_reading ADD COLUMN measure TEXT
  CHECK ((kind = 'ac') = (measure IS NOT NULL)
    AND (measure IS NULL OR measure IN ('rms', 'peak', 'pp')));
ALTER TABLE after_repair_reading ADD COLUMN hz REAL
  CHECK ((kind = 'ac') = (hz IS NOT NULL) AND (hz IS NULL OR hz > 0));
ALTER TABLE after_repair_reading ADD COLUMN to_point TEXT NOT NULL DEFAULT ''
  CHECK ((kind = 'ohms') = (to_point <> ''));

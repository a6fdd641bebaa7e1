-- Server schema version 4: power-off (ohms) readings, as in the bench's file (version 4). A reading
-- may now be of kind 'ohms', between "at" and a second point, to_point (empty for volts); an ohms
-- reading's value is in ohms, and the meter's over-range (OL) is stored as 'Infinity'. The kind's
-- check is widened in place; every row keeps its change number.

ALTER TABLE reading ADD COLUMN to_point TEXT NOT NULL DEFAULT '';
ALTER TABLE reading DROP CONSTRAINT reading_kind_check;
ALTER TABLE reading ADD CONSTRAINT reading_kind_check CHECK (kind IN ('dc', 'ac', 'ohms'));
ALTER TABLE reading ADD CONSTRAINT reading_to_point_check CHECK ((kind = 'ohms') = (to_point <> ''));

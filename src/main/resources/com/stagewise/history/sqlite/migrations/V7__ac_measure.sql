-- Schema version 7: the measure of an AC reading. A meter's AC volts are RMS, a scope gives peak or
-- peak to peak; the column says which (rms or pp), and NULL is a peak, the only measure AC readings
-- had before, so every reading stored earlier keeps its meaning. Adding a column changes no row,
-- so nothing goes to the outbox.

ALTER TABLE reading ADD COLUMN measure TEXT CHECK (measure IN ('rms', 'peak', 'pp'));

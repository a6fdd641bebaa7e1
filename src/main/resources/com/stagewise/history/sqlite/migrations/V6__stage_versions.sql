-- Schema version 6: versions of the board models' library stages, and the stage version each case
-- is diagnosed with. A library stage is known by its board model and its title (letter case aside);
-- each saving of a changed stage is a new row with the next version number, and no row is ever
-- rewritten with other content. saved_by and saved_at say who saved a version and when (updated_at
-- stays the time the row last changed, e.g. when a merge moved it to the next free number).
-- Sheets stored before this version become the versions of their stage in the order they were
-- stored: a stage saved again under the same title was an edit of it.

ALTER TABLE stage_sheet ADD COLUMN version INTEGER NOT NULL DEFAULT 1;
ALTER TABLE stage_sheet ADD COLUMN saved_by TEXT NOT NULL DEFAULT '';
ALTER TABLE stage_sheet ADD COLUMN saved_at INTEGER NOT NULL DEFAULT 0;
ALTER TABLE repair_case ADD COLUMN stage_sheet_id TEXT REFERENCES stage_sheet (id);

-- Numbering the sheets already stored is not a change to send to the server (the server numbers
-- its own by the same rule): the outbox trigger is set aside for it and made again as version 3
-- made it.
DROP TRIGGER stage_sheet_outbox_update;
UPDATE stage_sheet SET saved_at = updated_at, version = (
  SELECT count(*) FROM stage_sheet o
  WHERE o.board_model_id = stage_sheet.board_model_id
    AND o.title = stage_sheet.title COLLATE NOCASE
    AND (o.updated_at < stage_sheet.updated_at
      OR (o.updated_at = stage_sheet.updated_at AND o.id <= stage_sheet.id)));
CREATE TRIGGER stage_sheet_outbox_update AFTER UPDATE ON stage_sheet BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('stage sheet', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'stage sheet' AND id = new.id), 0) + 1);
END;

CREATE UNIQUE INDEX stage_sheet_version ON stage_sheet (board_model_id, title COLLATE NOCASE, version);
CREATE INDEX case_by_stage_sheet ON repair_case (stage_sheet_id);

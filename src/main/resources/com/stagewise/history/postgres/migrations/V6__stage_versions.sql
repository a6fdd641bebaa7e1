-- Server schema version 6: versions of the board models' library stages and the stage version each
-- case is diagnosed with, as in the bench's file (version 6 there too). A library stage is known by
-- its board model and its title (letter case aside); each saving of a changed stage is a new row
-- with the next version number. Sheets already on the server become the versions of their stage in
-- the order they were stored, by the same rule as the benches' files, so numbering them is not a
-- change for the benches to pull and takes no change numbers.

ALTER TABLE stage_sheet ADD COLUMN version INTEGER NOT NULL DEFAULT 1;
ALTER TABLE stage_sheet ADD COLUMN saved_by TEXT NOT NULL DEFAULT '';
ALTER TABLE stage_sheet ADD COLUMN saved_at BIGINT NOT NULL DEFAULT 0;
ALTER TABLE repair_case ADD COLUMN stage_sheet_id TEXT REFERENCES stage_sheet (id);

ALTER TABLE stage_sheet DISABLE TRIGGER stage_sheet_change;
UPDATE stage_sheet s SET saved_at = s.updated_at, version = n.rank
  FROM (SELECT id, row_number() OVER (PARTITION BY board_model_id, lower(title)
                                      ORDER BY updated_at, id COLLATE "C") AS rank
        FROM stage_sheet) n
  WHERE n.id = s.id;
ALTER TABLE stage_sheet ENABLE TRIGGER stage_sheet_change;

CREATE UNIQUE INDEX stage_sheet_version ON stage_sheet (board_model_id, lower(title), version);
CREATE INDEX case_by_stage_sheet ON repair_case (stage_sheet_id);

-- Schema version 1: board models, stage sheets, units, cases and what happens in a case.
-- Times are milliseconds since 1970-01-01 UTC. Ids are UUID strings that travel between benches.
-- repair_case and case_note have an explicit integer key, so that their row numbers survive VACUUM
-- (full-text indexes refer to them by row number).

CREATE TABLE board_model (
  id TEXT PRIMARY KEY NOT NULL,
  name TEXT NOT NULL,
  maker TEXT NOT NULL,
  notes TEXT NOT NULL,
  updated_at INTEGER NOT NULL
);
CREATE UNIQUE INDEX board_model_by_name ON board_model (name COLLATE NOCASE);

CREATE TABLE stage_sheet (
  id TEXT PRIMARY KEY NOT NULL,
  board_model_id TEXT NOT NULL REFERENCES board_model (id),
  title TEXT NOT NULL,
  sheet_json TEXT NOT NULL,
  updated_at INTEGER NOT NULL
);
CREATE INDEX stage_sheet_by_model ON stage_sheet (board_model_id);

CREATE TABLE unit (
  id TEXT PRIMARY KEY NOT NULL,
  serial TEXT NOT NULL,
  board_model_id TEXT NOT NULL REFERENCES board_model (id),
  owner TEXT NOT NULL,
  updated_at INTEGER NOT NULL
);
CREATE UNIQUE INDEX unit_by_model_serial ON unit (board_model_id, serial);
CREATE INDEX unit_by_serial ON unit (serial COLLATE NOCASE);

CREATE TABLE repair_case (
  row INTEGER PRIMARY KEY,
  id TEXT NOT NULL UNIQUE,
  unit_id TEXT NOT NULL REFERENCES unit (id),
  opened_at INTEGER NOT NULL,
  symptom TEXT NOT NULL,
  status TEXT NOT NULL CHECK (status IN ('open', 'closed')),
  closed_at INTEGER,
  outcome TEXT CHECK (outcome IN ('fixed', 'not-fixed', 'returned')),
  updated_at INTEGER NOT NULL,
  CHECK ((status = 'open' AND closed_at IS NULL AND outcome IS NULL)
      OR (status = 'closed' AND closed_at IS NOT NULL AND outcome IS NOT NULL))
);
CREATE INDEX case_by_unit ON repair_case (unit_id, opened_at);
CREATE INDEX case_by_opened ON repair_case (opened_at);

CREATE TABLE confirmed_fault (
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  position INTEGER NOT NULL,
  fault_id TEXT NOT NULL,
  PRIMARY KEY (case_id, position)
) WITHOUT ROWID;
CREATE INDEX confirmed_fault_by_fault ON confirmed_fault (fault_id);

-- Part designators that a case's confirmed faults and actions mention (R2, U1, U1A), for search.
CREATE TABLE case_part (
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  part TEXT NOT NULL COLLATE NOCASE,
  PRIMARY KEY (case_id, part)
) WITHOUT ROWID;
CREATE INDEX case_part_by_part ON case_part (part);

CREATE TABLE reading (
  id TEXT PRIMARY KEY NOT NULL,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  at TEXT NOT NULL,
  kind TEXT NOT NULL CHECK (kind IN ('dc', 'ac')),
  value REAL NOT NULL,
  hz REAL,
  uncertainty REAL,
  meter TEXT NOT NULL,
  taken_at INTEGER NOT NULL
);
CREATE INDEX reading_by_case ON reading (case_id, taken_at);

CREATE TABLE suspect_list (
  id TEXT PRIMARY KEY NOT NULL,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  computed_at INTEGER NOT NULL,
  program_version TEXT NOT NULL,
  verdict TEXT NOT NULL,
  next_probes TEXT NOT NULL
);
CREATE INDEX suspect_list_by_case ON suspect_list (case_id, computed_at);

CREATE TABLE suspect (
  suspect_list_id TEXT NOT NULL REFERENCES suspect_list (id),
  rank INTEGER NOT NULL,
  fault_id TEXT NOT NULL,
  probability REAL NOT NULL,
  fault_group TEXT NOT NULL,
  why TEXT NOT NULL,
  PRIMARY KEY (suspect_list_id, rank)
) WITHOUT ROWID;

CREATE TABLE repair_action (
  id TEXT PRIMARY KEY NOT NULL,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  at INTEGER NOT NULL,
  kind TEXT NOT NULL CHECK (kind IN ('part-replaced', 'reflow', 'adjustment', 'other')),
  part TEXT NOT NULL,
  old_value TEXT NOT NULL,
  new_value TEXT NOT NULL,
  text TEXT NOT NULL,
  updated_at INTEGER NOT NULL
);
CREATE INDEX action_by_case ON repair_action (case_id, at);

CREATE TABLE case_note (
  row INTEGER PRIMARY KEY,
  id TEXT NOT NULL UNIQUE,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  at INTEGER NOT NULL,
  text TEXT NOT NULL,
  updated_at INTEGER NOT NULL
);
CREATE INDEX note_by_case ON case_note (case_id, at);

-- Server schema version 1: the same records as the bench's history file (its version 1), in the
-- shop's own schema. Times are milliseconds since 1970-01-01 UTC; ids are the UUID strings that
-- travel between benches. row_no keeps the order in which rows arrived (SQLite's rowid).

CREATE TABLE board_model (
  id TEXT PRIMARY KEY,
  name TEXT NOT NULL,
  maker TEXT NOT NULL,
  notes TEXT NOT NULL,
  updated_at BIGINT NOT NULL
);
CREATE UNIQUE INDEX board_model_by_name ON board_model (lower(name));

CREATE TABLE stage_sheet (
  row_no BIGINT GENERATED ALWAYS AS IDENTITY,
  id TEXT PRIMARY KEY,
  board_model_id TEXT NOT NULL REFERENCES board_model (id),
  title TEXT NOT NULL,
  sheet_json TEXT NOT NULL,
  updated_at BIGINT NOT NULL
);
CREATE INDEX stage_sheet_by_model ON stage_sheet (board_model_id);

CREATE TABLE unit (
  id TEXT PRIMARY KEY,
  serial TEXT NOT NULL,
  board_model_id TEXT NOT NULL REFERENCES board_model (id),
  owner TEXT NOT NULL,
  updated_at BIGINT NOT NULL
);
CREATE UNIQUE INDEX unit_by_model_serial ON unit (board_model_id, serial);
CREATE INDEX unit_by_serial ON unit (lower(serial));

CREATE TABLE repair_case (
  row_no BIGINT GENERATED ALWAYS AS IDENTITY,
  id TEXT PRIMARY KEY,
  unit_id TEXT NOT NULL REFERENCES unit (id),
  opened_at BIGINT NOT NULL,
  symptom TEXT NOT NULL,
  status TEXT NOT NULL CHECK (status IN ('open', 'closed')),
  closed_at BIGINT,
  outcome TEXT CHECK (outcome IN ('fixed', 'not-fixed', 'returned')),
  updated_at BIGINT NOT NULL,
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
);
CREATE INDEX confirmed_fault_by_fault ON confirmed_fault (fault_id);

-- Part designators that a case's confirmed faults and actions mention (R2, U1, U1A), for search.
CREATE TABLE case_part (
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  part TEXT NOT NULL,
  PRIMARY KEY (case_id, part)
);
CREATE INDEX case_part_by_part ON case_part (lower(part));

CREATE TABLE reading (
  row_no BIGINT GENERATED ALWAYS AS IDENTITY,
  id TEXT PRIMARY KEY,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  at TEXT NOT NULL,
  kind TEXT NOT NULL CHECK (kind IN ('dc', 'ac')),
  value DOUBLE PRECISION NOT NULL,
  hz DOUBLE PRECISION,
  uncertainty DOUBLE PRECISION,
  meter TEXT NOT NULL,
  taken_at BIGINT NOT NULL
);
CREATE INDEX reading_by_case ON reading (case_id, taken_at);

CREATE TABLE suspect_list (
  row_no BIGINT GENERATED ALWAYS AS IDENTITY,
  id TEXT PRIMARY KEY,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  computed_at BIGINT NOT NULL,
  program_version TEXT NOT NULL,
  verdict TEXT NOT NULL,
  next_probes TEXT NOT NULL
);
CREATE INDEX suspect_list_by_case ON suspect_list (case_id, computed_at);

CREATE TABLE suspect (
  suspect_list_id TEXT NOT NULL REFERENCES suspect_list (id),
  rank INTEGER NOT NULL,
  fault_id TEXT NOT NULL,
  probability DOUBLE PRECISION NOT NULL,
  fault_group TEXT NOT NULL,
  why TEXT NOT NULL,
  PRIMARY KEY (suspect_list_id, rank)
);

CREATE TABLE repair_action (
  row_no BIGINT GENERATED ALWAYS AS IDENTITY,
  id TEXT PRIMARY KEY,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  at BIGINT NOT NULL,
  kind TEXT NOT NULL CHECK (kind IN ('part-replaced', 'reflow', 'adjustment', 'other')),
  part TEXT NOT NULL,
  old_value TEXT NOT NULL,
  new_value TEXT NOT NULL,
  text TEXT NOT NULL,
  updated_at BIGINT NOT NULL
);
CREATE INDEX action_by_case ON repair_action (case_id, at);

CREATE TABLE case_note (
  row_no BIGINT GENERATED ALWAYS AS IDENTITY,
  id TEXT PRIMARY KEY,
  case_id TEXT NOT NULL REFERENCES repair_case (id),
  at BIGINT NOT NULL,
  text TEXT NOT NULL,
  updated_at BIGINT NOT NULL
);
CREATE INDEX note_by_case ON case_note (case_id, at);

-- Server schema version 3: change numbers for sync. Every insert or update of a record stamps it
-- with the next number of one sequence; a bench asks for everything above the last number it has
-- seen. Writers take one lock per schema (see PgDatabase), so numbers become visible in order.

CREATE SEQUENCE change_number;

CREATE FUNCTION stamp_change() RETURNS trigger LANGUAGE plpgsql AS
'BEGIN NEW.change_no := nextval(''change_number''); RETURN NEW; END';

ALTER TABLE board_model ADD COLUMN change_no BIGINT NOT NULL DEFAULT 0;
ALTER TABLE stage_sheet ADD COLUMN change_no BIGINT NOT NULL DEFAULT 0;
ALTER TABLE unit ADD COLUMN change_no BIGINT NOT NULL DEFAULT 0;
ALTER TABLE repair_case ADD COLUMN change_no BIGINT NOT NULL DEFAULT 0;
ALTER TABLE reading ADD COLUMN change_no BIGINT NOT NULL DEFAULT 0;
ALTER TABLE suspect_list ADD COLUMN change_no BIGINT NOT NULL DEFAULT 0;
ALTER TABLE repair_action ADD COLUMN change_no BIGINT NOT NULL DEFAULT 0;
ALTER TABLE case_note ADD COLUMN change_no BIGINT NOT NULL DEFAULT 0;

UPDATE board_model SET change_no = nextval('change_number');
UPDATE stage_sheet SET change_no = nextval('change_number');
UPDATE unit SET change_no = nextval('change_number');
UPDATE repair_case SET change_no = nextval('change_number');
UPDATE reading SET change_no = nextval('change_number');
UPDATE suspect_list SET change_no = nextval('change_number');
UPDATE repair_action SET change_no = nextval('change_number');
UPDATE case_note SET change_no = nextval('change_number');

CREATE TRIGGER board_model_change BEFORE INSERT OR UPDATE ON board_model
  FOR EACH ROW EXECUTE FUNCTION stamp_change();
CREATE TRIGGER stage_sheet_change BEFORE INSERT OR UPDATE ON stage_sheet
  FOR EACH ROW EXECUTE FUNCTION stamp_change();
CREATE TRIGGER unit_change BEFORE INSERT OR UPDATE ON unit
  FOR EACH ROW EXECUTE FUNCTION stamp_change();
CREATE TRIGGER repair_case_change BEFORE INSERT OR UPDATE ON repair_case
  FOR EACH ROW EXECUTE FUNCTION stamp_change();
CREATE TRIGGER reading_change BEFORE INSERT OR UPDATE ON reading
  FOR EACH ROW EXECUTE FUNCTION stamp_change();
CREATE TRIGGER suspect_list_change BEFORE INSERT OR UPDATE ON suspect_list
  FOR EACH ROW EXECUTE FUNCTION stamp_change();
CREATE TRIGGER repair_action_change BEFORE INSERT OR UPDATE ON repair_action
  FOR EACH ROW EXECUTE FUNCTION stamp_change();
CREATE TRIGGER case_note_change BEFORE INSERT OR UPDATE ON case_note
  FOR EACH ROW EXECUTE FUNCTION stamp_change();

CREATE INDEX board_model_by_change ON board_model (change_no);
CREATE INDEX stage_sheet_by_change ON stage_sheet (change_no);
CREATE INDEX unit_by_change ON unit (change_no);
CREATE INDEX repair_case_by_change ON repair_case (change_no);
CREATE INDEX reading_by_change ON reading (change_no);
CREATE INDEX suspect_list_by_change ON suspect_list (change_no);
CREATE INDEX repair_action_by_change ON repair_action (change_no);
CREATE INDEX case_note_by_change ON case_note (change_no);

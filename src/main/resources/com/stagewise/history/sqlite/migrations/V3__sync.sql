-- Schema version 3: sync with a shop server. outbox lists every record added or changed on this
-- bench that the server has not yet confirmed (triggers keep it; version counts the changes, so a
-- record changed again while it was being sent stays listed). sync_state keeps, per server, the
-- last change number merged from it and when the last sync ended; shop_fault_count caches the
-- server's confirmed-fault counts per board model for working offline.

CREATE TABLE outbox (
  kind TEXT NOT NULL,
  id TEXT NOT NULL,
  version INTEGER NOT NULL,
  PRIMARY KEY (kind, id)
) WITHOUT ROWID;

CREATE TABLE sync_state (
  server TEXT PRIMARY KEY NOT NULL,
  pulled_through INTEGER NOT NULL,
  synced_at INTEGER
);

CREATE TABLE shop_fault_count (
  board_model TEXT NOT NULL COLLATE NOCASE,
  fault_id TEXT NOT NULL,
  count INTEGER NOT NULL,
  PRIMARY KEY (board_model, fault_id)
) WITHOUT ROWID;

INSERT INTO outbox (kind, id, version) SELECT 'board model', id, 1 FROM board_model;
INSERT INTO outbox (kind, id, version) SELECT 'stage sheet', id, 1 FROM stage_sheet;
INSERT INTO outbox (kind, id, version) SELECT 'unit', id, 1 FROM unit;
INSERT INTO outbox (kind, id, version) SELECT 'case', id, 1 FROM repair_case;
INSERT INTO outbox (kind, id, version) SELECT 'reading', id, 1 FROM reading;
INSERT INTO outbox (kind, id, version) SELECT 'suspect list', id, 1 FROM suspect_list;
INSERT INTO outbox (kind, id, version) SELECT 'action', id, 1 FROM repair_action;
INSERT INTO outbox (kind, id, version) SELECT 'note', id, 1 FROM case_note;
CREATE TRIGGER board_model_outbox_insert AFTER INSERT ON board_model BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('board model', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'board model' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER board_model_outbox_update AFTER UPDATE ON board_model BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('board model', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'board model' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER stage_sheet_outbox_insert AFTER INSERT ON stage_sheet BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('stage sheet', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'stage sheet' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER stage_sheet_outbox_update AFTER UPDATE ON stage_sheet BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('stage sheet', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'stage sheet' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER unit_outbox_insert AFTER INSERT ON unit BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('unit', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'unit' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER unit_outbox_update AFTER UPDATE ON unit BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('unit', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'unit' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER repair_case_outbox_insert AFTER INSERT ON repair_case BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('case', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'case' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER repair_case_outbox_update AFTER UPDATE ON repair_case BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('case', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'case' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER reading_outbox_insert AFTER INSERT ON reading BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('reading', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'reading' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER reading_outbox_update AFTER UPDATE ON reading BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('reading', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'reading' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER suspect_list_outbox_insert AFTER INSERT ON suspect_list BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('suspect list', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'suspect list' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER suspect_list_outbox_update AFTER UPDATE ON suspect_list BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('suspect list', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'suspect list' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER repair_action_outbox_insert AFTER INSERT ON repair_action BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('action', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'action' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER repair_action_outbox_update AFTER UPDATE ON repair_action BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('action', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'action' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER case_note_outbox_insert AFTER INSERT ON case_note BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('note', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'note' AND id = new.id), 0) + 1);
END;
CREATE TRIGGER case_note_outbox_update AFTER UPDATE ON case_note BEGIN
  INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('note', new.id,
    coalesce((SELECT version FROM outbox WHERE kind = 'note' AND id = new.id), 0) + 1);
END;

-- Schema version 2: full-text search over reported symptoms and notes (FTS5, ranked by bm25).
-- Each index row has the row number of its case or note; triggers keep the indexes in step.

CREATE VIRTUAL TABLE symptom_text USING fts5 (
  body, tokenize = 'unicode61 remove_diacritics 2'
);
CREATE VIRTUAL TABLE note_text USING fts5 (
  body, tokenize = 'unicode61 remove_diacritics 2'
);

INSERT INTO symptom_text (rowid, body) SELECT row, symptom FROM repair_case;
INSERT INTO note_text (rowid, body) SELECT row, text FROM case_note;

CREATE TRIGGER symptom_text_insert AFTER INSERT ON repair_case BEGIN
  INSERT INTO symptom_text (rowid, body) VALUES (new.row, new.symptom);
END;
CREATE TRIGGER symptom_text_update AFTER UPDATE OF symptom ON repair_case BEGIN
  DELETE FROM symptom_text WHERE rowid = old.row;
  INSERT INTO symptom_text (rowid, body) VALUES (new.row, new.symptom);
END;
CREATE TRIGGER symptom_text_delete AFTER DELETE ON repair_case BEGIN
  DELETE FROM symptom_text WHERE rowid = old.row;
END;

CREATE TRIGGER note_text_insert AFTER INSERT ON case_note BEGIN
  INSERT INTO note_text (rowid, body) VALUES (new.row, new.text);
END;
CREATE TRIGGER note_text_update AFTER UPDATE OF text ON case_note BEGIN
  DELETE FROM note_text WHERE rowid = old.row;
  INSERT INTO note_text (rowid, body) VALUES (new.row, new.text);
END;
CREATE TRIGGER note_text_delete AFTER DELETE ON case_note BEGIN
  DELETE FROM note_text WHERE rowid = old.row;
END;

package com.stagewise.interchange.history;

import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.interchange.JsonField;
import java.time.Instant;
import java.util.List;

/**
 * The stage library's fields of a history bundle: a stage sheet's version, who saved it and when
 * (format version 3), and the stage version a case is diagnosed with.
 *
 * <p>Each is optional when read, so that bundles of earlier versions read as before: a sheet
 * without a version number is version 1 saved when it was last changed, by nobody named (the import
 * then places it as the next version of its stage, {@code StageVersions}), and a case without a
 * stage names none.
 */
final class LibraryFields {
  static final List<String> STAGE_SHEET =
      List.of("id", "boardModelId", "title", "sheet", "updatedAt", "version", "savedBy", "savedAt");

  /** The key of a case's stage version. */
  static final String CASE_STAGE = "stageSheetId";

  private static final String TIME = "a UTC time such as 2026-03-04T10:15:30Z";

  private LibraryFields() {}

  /** Reads one entry of {@code stageSheets}. */
  static StageSheetRecord sheet(JsonField f) {
    f.object("a stage sheet", STAGE_SHEET);
    Instant updatedAt = f.require("updatedAt", TIME).time();
    int version = 1;
    if (f.optional("version").isPresent()) {
      JsonField field = f.require("version", "a version number");
      version = field.integer("a version number, 1 or more");
      if (version < 1) {
        throw field.error("expected a version number, 1 or more, found " + version);
      }
    }
    return new StageSheetRecord(
        f.require("id", "a string").text(),
        f.require("boardModelId", "a string").text(),
        f.optionalText("title", ""),
        f.require("sheet", "a string").text(),
        updatedAt,
        version,
        f.optionalText("savedBy", ""),
        f.optional("savedAt").map(JsonField::time).orElse(updatedAt));
  }

  /** Writes one entry of {@code stageSheets}. */
  static ObjectNode tree(StageSheetRecord s) {
    ObjectNode o = JsonNodeFactory.instance.objectNode();
    o.put("id", s.id())
        .put("boardModelId", s.boardModelId())
        .put("title", s.title())
        .put("sheet", s.sheetJson())
        .put("updatedAt", s.updatedAt().toString());
    return o.put("version", s.version())
        .put("savedBy", s.savedBy())
        .put("savedAt", s.savedAt().toString());
  }

  /** Returns a case entry's stage version, or null when it names none. */
  static String caseStage(JsonField f) {
    return f.optional(CASE_STAGE).map(JsonField::text).orElse(null);
  }

  /** Adds a case's stage version to its entry, when it has one. */
  static void caseStage(RepairCase c, ObjectNode o) {
    if (c.stageSheetId() != null) {
      o.put(CASE_STAGE, c.stageSheetId());
    }
  }
}

package com.stagewise.history.jdbc;

import static com.stagewise.history.jdbc.Require.SOURCE;

import com.stagewise.history.Checks;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.StageLibrary;
import com.stagewise.history.StageVersions;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import java.sql.SQLException;
import java.time.Instant;
import java.util.List;
import java.util.Optional;

/** The board models' stage sheets in a store reached through JDBC, in versions. */
public final class JdbcLibrary implements StageLibrary {
  private final JdbcAccess history;

  /** Serves the stage library of the store behind {@code history}. */
  public JdbcLibrary(JdbcAccess history) {
    this.history = history;
  }

  @Override
  public StageSheetRecord add(String boardModelId, String title, String sheetJson) {
    return save(boardModelId, title, sheetJson, "");
  }

  @Override
  public StageSheetRecord save(
      String boardModelId, String title, String sheetJson, String savedBy) {
    checkSheet("", title, sheetJson);
    Checks.shortText(SOURCE, "saved by", savedBy, false);
    Instant now = history.clock().instant();
    return history.write(
        "save a stage sheet",
        c -> {
          try (Rows rows = history.rows(c)) {
            Require.exists(rows, "board_model", boardModelId, "board model");
            return saveIn(rows, boardModelId, title, sheetJson, savedBy, now);
          }
        });
  }

  @Override
  public StageSheetRecord useForCase(
      String caseId, String title, String sheetJson, String savedBy) {
    checkSheet("", title, sheetJson);
    Checks.shortText(SOURCE, "saved by", savedBy, false);
    Instant now = history.clock().instant();
    return history.write(
        "keep the case's stage",
        c -> {
          try (Rows rows = history.rows(c)) {
            RepairCase rc = Require.repairCase(rows, caseId);
            String modelId =
                rows.first(
                        "SELECT board_model_id FROM unit WHERE id = ?",
                        rs -> rs.getString(1),
                        rc.unitId())
                    .orElseThrow();
            StageSheetRecord used = saveIn(rows, modelId, title, sheetJson, savedBy, now);
            if (!used.id().equals(rc.stageSheetId())) {
              rows.replace(rc.withStageSheet(used.id(), now));
            }
            return used;
          }
        });
  }

  /** Returns the version with this text, or adds the next version; inside a write. */
  static StageSheetRecord saveIn(
      Rows rows, String modelId, String title, String sheetJson, String savedBy, Instant now)
      throws SQLException {
    List<StageSheetRecord> versions = versionsIn(rows, modelId, title);
    Optional<StageSheetRecord> same = StageVersions.withText(versions, sheetJson);
    if (same.isPresent()) {
      return same.get();
    }
    StageSheetRecord added =
        new StageSheetRecord(
            HistoryStore.newId(),
            modelId,
            title,
            sheetJson,
            now,
            StageVersions.next(versions),
            savedBy,
            now);
    rows.insert(added);
    return added;
  }

  /** Returns the versions of one stage (board model and title, any case), latest first. */
  static List<StageSheetRecord> versionsIn(Rows rows, String modelId, String title)
      throws SQLException {
    return rows.query(
        Records.STAGE_SHEET
            + " WHERE board_model_id = ? AND "
            + rows.dialect().caselessEquals("title")
            + " ORDER BY version DESC, saved_at DESC, "
            + rows.dialect().binaryOrder("id"),
        Records::stageSheet,
        modelId,
        title);
  }

  private static void checkSheet(String at, String title, String sheetJson) {
    Checks.shortText(SOURCE, at + "title", title, false);
    Checks.text(SOURCE, at + "stage sheet", sheetJson, Checks.MAX_SHEET);
  }

  @Override
  public List<StageSheetRecord> sheets(String boardModelId) {
    return history.read(
        "list stage sheets",
        c -> {
          try (Rows rows = history.rows(c)) {
            return rows.query(
                Records.STAGE_SHEET
                    + " WHERE board_model_id = ? ORDER BY saved_at, updated_at, "
                    + rows.dialect().binaryOrder("id"),
                Records::stageSheet,
                boardModelId);
          }
        });
  }

  @Override
  public List<StageSheetRecord> versions(String boardModelId, String title) {
    return history.read(
        "list a stage's versions",
        c -> {
          try (Rows rows = history.rows(c)) {
            return versionsIn(rows, boardModelId, title);
          }
        });
  }

  @Override
  public Optional<StageSheetRecord> find(String sheetId) {
    return history.read(
        "find a stage sheet",
        c -> {
          try (Rows rows = history.rows(c)) {
            return rows.first(Records.STAGE_SHEET + " WHERE id = ?", Records::stageSheet, sheetId);
          }
        });
  }

  @Override
  public BoardModel addBoardModel(String name, String maker, List<SheetDraft> sheets) {
    Checks.shortText(SOURCE, "board model", name, true);
    Checks.shortText(SOURCE, "maker", maker, false);
    Checks.list(SOURCE, "sheets", sheets);
    for (int i = 0; i < sheets.size(); i++) {
      checkSheet("sheets[" + i + "].", sheets.get(i).title(), sheets.get(i).sheetJson());
    }
    Instant now = history.clock().instant();
    return history.write(
        "add a board model",
        c -> {
          try (Rows rows = history.rows(c)) {
            BoardModel model = JdbcUnits.findOrAddModel(rows, name, maker, now).model();
            for (SheetDraft sheet : sheets) {
              saveIn(rows, model.id(), sheet.title(), sheet.sheetJson(), "", now);
            }
            return model;
          }
        });
  }
}

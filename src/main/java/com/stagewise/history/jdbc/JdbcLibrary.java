package com.stagewise.history.jdbc;

import static com.stagewise.history.jdbc.Require.SOURCE;

import com.stagewise.history.Checks;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.StageLibrary;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.StageSheetRecord;
import java.time.Instant;
import java.util.List;

/** The board models' stage sheets in a store reached through JDBC. */
public final class JdbcLibrary implements StageLibrary {
  private final JdbcAccess history;

  /** Serves the stage library of the store behind {@code history}. */
  public JdbcLibrary(JdbcAccess history) {
    this.history = history;
  }

  @Override
  public StageSheetRecord add(String boardModelId, String title, String sheetJson) {
    checkSheet("", title, sheetJson);
    Instant now = history.clock().instant();
    return history.write(
        "add a stage sheet",
        c -> {
          try (Rows rows = history.rows(c)) {
            Require.exists(rows, "board_model", boardModelId, "board model");
            StageSheetRecord sheet =
                new StageSheetRecord(HistoryStore.newId(), boardModelId, title, sheetJson, now);
            rows.insert(sheet);
            return sheet;
          }
        });
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
                    + " WHERE board_model_id = ? ORDER BY updated_at, "
                    + rows.dialect().binaryOrder("id"),
                Records::stageSheet,
                boardModelId);
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
              rows.insert(
                  new StageSheetRecord(
                      HistoryStore.newId(), model.id(), sheet.title(), sheet.sheetJson(), now));
            }
            return model;
          }
        });
  }
}

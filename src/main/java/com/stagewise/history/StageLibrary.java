package com.stagewise.history;

import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.StageSheetRecord;
import java.util.List;
import java.util.Objects;

/**
 * The stage sheets of each board model, kept as their JSON text exactly.
 *
 * <p>The store checks the text's limits only; whether a sheet is a valid stage is the stage sheet
 * reader's job, which callers run before adding it.
 */
public interface StageLibrary {

  /** Adds a stage sheet (its JSON text, kept exactly) to a board model and returns it. */
  StageSheetRecord add(String boardModelId, String title, String sheetJson);

  /** Returns the stage sheets of a board model, in the order they were added. */
  List<StageSheetRecord> sheets(String boardModelId);

  /**
   * Returns the board model named {@code name} (adding it if there is none) after adding {@code
   * sheets} to it, in one transaction: every sheet is checked first, and if any is refused neither
   * the model nor any sheet is written.
   *
   * @throws com.stagewise.circuit.InvalidInputException naming the sheet that was refused
   */
  BoardModel addBoardModel(String name, String maker, List<SheetDraft> sheets);

  /**
   * A stage sheet to be added.
   *
   * @param title its title (may be empty)
   * @param sheetJson the sheet's JSON text
   */
  record SheetDraft(String title, String sheetJson) {
    public SheetDraft {
      Objects.requireNonNull(title, "title");
      Objects.requireNonNull(sheetJson, "sheetJson");
    }
  }
}

package com.stagewise.casework;

import com.stagewise.circuit.Stage;
import com.stagewise.history.record.StageSheetRecord;
import java.util.Objects;

/**
 * A stage of a board model's library, one version: the sheet as stored and the stage read from it.
 *
 * @param sheet the stored stage sheet
 * @param stage the stage it describes
 */
public record LibraryStage(StageSheetRecord sheet, Stage stage) {
  public LibraryStage {
    Objects.requireNonNull(sheet, "sheet");
    Objects.requireNonNull(stage, "stage");
  }

  /** Returns the version number of the stage sheet among the versions of its stage. */
  public int version() {
    return sheet.version();
  }

  /** Returns the title to show: the stage's own title, else the title it was stored under. */
  public String title() {
    return stage.title().isBlank() ? sheet.title() : stage.title();
  }
}

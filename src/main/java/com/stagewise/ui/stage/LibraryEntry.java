package com.stagewise.ui.stage;

import com.stagewise.casework.LibraryStage;
import com.stagewise.circuit.Stage;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.ui.words.Words;

/**
 * One version of a stage of the board model's library, as listed where a stage is picked.
 *
 * @param title its title
 * @param stage the stage
 * @param sheet the stored version (its number, who saved it and when)
 */
public record LibraryEntry(String title, Stage stage, StageSheetRecord sheet) {

  /** Returns the entry of a library stage. */
  static LibraryEntry of(LibraryStage stored) {
    return new LibraryEntry(stored.title(), stored.stage(), stored.sheet());
  }

  /** Returns the version number. */
  public int version() {
    return sheet.version();
  }

  /**
   * Returns who saved the version and when, in words: {@code version 3, saved by Ben 2026-03-04
   * 10:15} (a version stored before versions were kept names nobody).
   */
  public String versionLine() {
    return "version "
        + sheet.version()
        + ", saved"
        + (sheet.savedBy().isBlank() ? "" : " by " + sheet.savedBy())
        + " "
        + Words.dateTime(sheet.savedAt());
  }
}

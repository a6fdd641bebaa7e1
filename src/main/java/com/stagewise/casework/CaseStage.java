package com.stagewise.casework;

import com.stagewise.history.record.StageSheetRecord;
import java.util.Objects;

/**
 * The stage version a case is diagnosed with, beside the latest version of that stage.
 *
 * @param used the version the case is diagnosed with, and the stage read from it
 * @param latest the latest version of the same library stage (the same as {@code used} when no
 *     later version was saved)
 */
public record CaseStage(LibraryStage used, StageSheetRecord latest) {
  public CaseStage {
    Objects.requireNonNull(used, "used");
    Objects.requireNonNull(latest, "latest");
  }

  /** Returns whether a later version of the stage was saved after the case's. */
  public boolean newerExists() {
    return latest.version() > used.sheet().version();
  }
}

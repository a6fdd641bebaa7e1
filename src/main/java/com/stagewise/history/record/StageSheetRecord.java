package com.stagewise.history.record;

import java.time.Instant;
import java.util.Objects;

/**
 * A stage sheet kept with a board model, as the JSON text of a {@code *.stage.json} file.
 *
 * <p>The text is stored and returned exactly as given; the history does not parse it.
 *
 * @param id stable id (UUID)
 * @param boardModelId the board model it belongs to
 * @param title a short title, e.g. the stage's own title
 * @param sheetJson the stage sheet's JSON text
 * @param updatedAt when this record was last changed
 */
public record StageSheetRecord(
    String id, String boardModelId, String title, String sheetJson, Instant updatedAt) {
  public StageSheetRecord {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(boardModelId, "boardModelId");
    Times.text(title, "title");
    Times.text(sheetJson, "sheetJson");
    updatedAt = Times.millis(Objects.requireNonNull(updatedAt, "updatedAt"));
  }
}

package com.stagewise.history.record;

import java.time.Instant;
import java.util.Objects;

/**
 * One version of a stage of a board model's library, as the JSON text of a {@code *.stage.json}
 * file.
 *
 * <p>The text is stored and returned exactly as given; the history does not parse it. A library
 * stage is known by its board model and its title (letter case aside); each saving of a changed
 * stage is a new record with the next version number, and a record never takes other content.
 *
 * @param id stable id (UUID)
 * @param boardModelId the board model it belongs to
 * @param title a short title, e.g. the stage's own title; the versions of one stage share it
 * @param sheetJson the stage sheet's JSON text
 * @param updatedAt when this record was last changed (a merge may move it to another number)
 * @param version its version number among the versions of its stage, 1 or more
 * @param savedBy who saved it (may be empty: sheets stored before versions were kept)
 * @param savedAt when it was saved
 */
public record StageSheetRecord(
    String id,
    String boardModelId,
    String title,
    String sheetJson,
    Instant updatedAt,
    int version,
    String savedBy,
    Instant savedAt) {
  public StageSheetRecord {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(boardModelId, "boardModelId");
    Times.text(title, "title");
    Times.text(sheetJson, "sheetJson");
    updatedAt = Times.millis(Objects.requireNonNull(updatedAt, "updatedAt"));
    if (version < 1) {
      throw new IllegalArgumentException("version (" + version + ") must be 1 or more");
    }
    Times.text(savedBy, "savedBy");
    savedAt = Times.millis(Objects.requireNonNull(savedAt, "savedAt"));
  }

  /**
   * A first version saved by nobody named, at {@code updatedAt} (as sheets were before versions).
   */
  public StageSheetRecord(
      String id, String boardModelId, String title, String sheetJson, Instant updatedAt) {
    this(id, boardModelId, title, sheetJson, updatedAt, 1, "", updatedAt);
  }

  /** Returns this record with another version number, changed at {@code at}. */
  public StageSheetRecord withVersion(int newVersion, Instant at) {
    return new StageSheetRecord(
        id, boardModelId, title, sheetJson, at, newVersion, savedBy, savedAt);
  }

  /** Returns this record of another board model (the same model known here by another id). */
  public StageSheetRecord withBoardModel(String modelId) {
    return new StageSheetRecord(
        id, modelId, title, sheetJson, updatedAt, version, savedBy, savedAt);
  }

  /** Returns whether {@code other} is a version of the same library stage (model and title). */
  public boolean sameStage(StageSheetRecord other) {
    return boardModelId.equals(other.boardModelId) && title.equalsIgnoreCase(other.title);
  }

  /**
   * Returns whether {@code other} holds the same as this one in everything but when the record last
   * changed.
   */
  public boolean sameSaving(StageSheetRecord other) {
    return id.equals(other.id)
        && boardModelId.equals(other.boardModelId)
        && title.equals(other.title)
        && sheetJson.equals(other.sheetJson)
        && version == other.version
        && savedBy.equals(other.savedBy)
        && savedAt.equals(other.savedAt);
  }
}

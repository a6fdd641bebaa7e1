package com.stagewise.history.record;

import java.time.Instant;
import java.util.Objects;

/**
 * One physical device under repair, known by its serial number within its board model.
 *
 * @param id stable id (UUID)
 * @param serial the serial number exactly as written on the unit
 * @param boardModelId the board model it is built to
 * @param owner the owner or job reference (may be empty)
 * @param updatedAt when this record was last changed
 */
public record Unit(String id, String serial, String boardModelId, String owner, Instant updatedAt) {
  public Unit {
    Objects.requireNonNull(id, "id");
    Times.text(serial, "serial");
    Objects.requireNonNull(boardModelId, "boardModelId");
    Times.text(owner, "owner");
    updatedAt = Times.millis(Objects.requireNonNull(updatedAt, "updatedAt"));
  }
}

package com.stagewise.history.record;

import java.time.Instant;
import java.util.Objects;

/**
 * A time-stamped free-text note on a case.
 *
 * @param id stable id (UUID)
 * @param caseId the case it belongs to
 * @param at when it was written
 * @param text the note, exactly as written
 * @param updatedAt when this record was last changed
 */
public record CaseNote(String id, String caseId, Instant at, String text, Instant updatedAt) {
  public CaseNote {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(caseId, "caseId");
    at = Times.millis(Objects.requireNonNull(at, "at"));
    Times.text(text, "text");
    updatedAt = Times.millis(Objects.requireNonNull(updatedAt, "updatedAt"));
  }
}

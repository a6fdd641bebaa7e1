package com.stagewise.history.record;

import java.time.Instant;
import java.util.Objects;

/**
 * Something done to the unit during a case.
 *
 * @param id stable id (UUID)
 * @param caseId the case it belongs to
 * @param at when it was done
 * @param kind part replaced, reflow, adjustment or other
 * @param part the part designator it concerns, e.g. {@code R2} or {@code U1} (may be empty)
 * @param oldValue the old value or part number, for a replacement (may be empty)
 * @param newValue the new value or part number, for a replacement (may be empty)
 * @param text free text (may be empty)
 * @param updatedAt when this record was last changed
 */
public record RepairAction(
    String id,
    String caseId,
    Instant at,
    ActionKind kind,
    String part,
    String oldValue,
    String newValue,
    String text,
    Instant updatedAt) {
  public RepairAction {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(caseId, "caseId");
    at = Times.millis(Objects.requireNonNull(at, "at"));
    Objects.requireNonNull(kind, "kind");
    Times.text(part, "part");
    Times.text(oldValue, "oldValue");
    Times.text(newValue, "newValue");
    Times.text(text, "text");
    updatedAt = Times.millis(Objects.requireNonNull(updatedAt, "updatedAt"));
  }
}

package com.stagewise.history.record;

import java.time.Instant;
import java.util.List;
import java.util.Objects;

/**
 * One repair of one unit: opened with a reported symptom, worked, and closed with an outcome.
 *
 * @param id stable id (UUID)
 * @param unitId the unit being repaired
 * @param openedAt when the case was opened
 * @param symptom the symptom as reported (free text)
 * @param status open or closed
 * @param closedAt when it was closed, or null while open
 * @param outcome how it ended, or null while open
 * @param confirmedFaults the fault ids found to be wrong at close-out (DESIGN.md grammar), in the
 *     order given; empty while open
 * @param updatedAt when this record was last changed
 */
public record RepairCase(
    String id,
    String unitId,
    Instant openedAt,
    String symptom,
    CaseStatus status,
    Instant closedAt,
    Outcome outcome,
    List<String> confirmedFaults,
    Instant updatedAt) {
  public RepairCase {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(unitId, "unitId");
    openedAt = Times.millis(Objects.requireNonNull(openedAt, "openedAt"));
    Times.text(symptom, "symptom");
    Objects.requireNonNull(status, "status");
    closedAt = Times.millis(closedAt);
    confirmedFaults = List.copyOf(confirmedFaults);
    updatedAt = Times.millis(Objects.requireNonNull(updatedAt, "updatedAt"));
  }
}

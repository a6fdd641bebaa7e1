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
 * @param stageSheetId the version of the board model's library stage the case is diagnosed with (a
 *     {@link StageSheetRecord} id), or null while none is chosen
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
    Instant updatedAt,
    String stageSheetId) {
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

  /** A case with no stage version chosen. */
  public RepairCase(
      String id,
      String unitId,
      Instant openedAt,
      String symptom,
      CaseStatus status,
      Instant closedAt,
      Outcome outcome,
      List<String> confirmedFaults,
      Instant updatedAt) {
    this(
        id, unitId, openedAt, symptom, status, closedAt, outcome, confirmedFaults, updatedAt, null);
  }

  /** Returns this case diagnosed with the stage version {@code sheetId}, changed at {@code at}. */
  public RepairCase withStageSheet(String sheetId, Instant at) {
    return new RepairCase(
        id, unitId, openedAt, symptom, status, closedAt, outcome, confirmedFaults, at, sheetId);
  }

  /** Returns this case with its unit known here by another id. */
  public RepairCase withUnit(String localUnitId) {
    return new RepairCase(
        id,
        localUnitId,
        openedAt,
        symptom,
        status,
        closedAt,
        outcome,
        confirmedFaults,
        updatedAt,
        stageSheetId);
  }
}

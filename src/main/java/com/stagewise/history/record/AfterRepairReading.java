package com.stagewise.history.record;

import java.time.Instant;
import java.util.Objects;

/**
 * A DC reading taken again after the repair, at a point read during the diagnosis, with the healthy
 * band it was checked against. It is kept apart from the readings of the fault and never enters a
 * diagnosis; like every reading it is never edited once stored.
 *
 * @param id stable id (UUID)
 * @param caseId the case it was taken in
 * @param at the test point: a net name or a package pin {@code PACKAGE.PIN}
 * @param value the volts read
 * @param meterText the meter it was read with (may be empty)
 * @param takenAt when it was taken
 * @param healthyLow the lower end of the healthy band in volts, or null when none is known
 * @param healthyHigh the upper end of the healthy band in volts, or null when none is known
 */
public record AfterRepairReading(
    String id,
    String caseId,
    String at,
    double value,
    String meterText,
    Instant takenAt,
    Double healthyLow,
    Double healthyHigh) {
  public AfterRepairReading {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(caseId, "caseId");
    Times.text(at, "at");
    Times.text(meterText, "meterText");
    takenAt = Times.millis(Objects.requireNonNull(takenAt, "takenAt"));
    if ((healthyLow == null) != (healthyHigh == null)) {
      throw new IllegalArgumentException("a healthy band has both ends or neither");
    }
  }

  /** Returns whether a healthy band was known for the point. */
  public boolean hasBand() {
    return healthyLow != null;
  }

  /** Returns whether the reading lies within its healthy band (false when none is known). */
  public boolean inside() {
    return hasBand() && value >= healthyLow && value <= healthyHigh;
  }

  /** Returns this reading belonging to the case known here by another id. */
  public AfterRepairReading withCase(String localCaseId) {
    return new AfterRepairReading(
        id, localCaseId, at, value, meterText, takenAt, healthyLow, healthyHigh);
  }
}

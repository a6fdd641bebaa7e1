package com.stagewise.history.record;

import java.time.Instant;
import java.util.Objects;

/**
 * One reading as taken during a case.
 *
 * @param id stable id (UUID)
 * @param caseId the case it was taken in
 * @param at the test point: a net name or a package pin {@code PACKAGE.PIN}
 * @param kind DC level, AC amplitude or ohms (power off)
 * @param value volts (DC level, or AC amplitude in the measure of the stage's input); for an ohms
 *     reading the resistance in ohms, {@link Double#POSITIVE_INFINITY} for the meter's over-range
 *     (OL)
 * @param hz the AC frequency in hertz, or null for DC
 * @param uncertainty the half-width in volts given with the reading, or null if the meter's
 * @param meterText the meter as described in the readings file (may be empty)
 * @param takenAt when it was taken (or stored)
 * @param to the second point of an ohms reading; empty for volts
 */
public record StoredReading(
    String id,
    String caseId,
    String at,
    ReadingKind kind,
    double value,
    Double hz,
    Double uncertainty,
    String meterText,
    Instant takenAt,
    String to) {
  public StoredReading {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(caseId, "caseId");
    Times.text(at, "at");
    Objects.requireNonNull(kind, "kind");
    Times.text(meterText, "meterText");
    takenAt = Times.millis(Objects.requireNonNull(takenAt, "takenAt"));
    Times.text(to, "to");
  }

  /** Returns a volts reading (DC or AC, no second point); see the record description. */
  public StoredReading(
      String id,
      String caseId,
      String at,
      ReadingKind kind,
      double value,
      Double hz,
      Double uncertainty,
      String meterText,
      Instant takenAt) {
    this(id, caseId, at, kind, value, hz, uncertainty, meterText, takenAt, "");
  }

  /** Returns whether this is an ohms reading that showed the meter's over-range (OL). */
  public boolean isOverRange() {
    return kind == ReadingKind.OHMS && value == Double.POSITIVE_INFINITY;
  }
}

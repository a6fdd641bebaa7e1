package com.stagewise.history.record;

import com.stagewise.circuit.BandFit;
import java.time.Instant;
import java.util.Objects;

/**
 * A reading taken again after the repair, at a point read during the diagnosis and in the same kind
 * (a DC level, an AC amplitude in the measure it was read in, or ohms between two points with the
 * power off), with the healthy band it was checked against. It is kept apart from the readings of
 * the fault and never enters a diagnosis; like every reading it is never edited once stored.
 *
 * @param id stable id (UUID)
 * @param caseId the case it was taken in
 * @param at the test point: a net name or a package pin {@code PACKAGE.PIN} (the first point of an
 *     ohms reading)
 * @param value the volts read (DC level, or AC amplitude in {@code measure}); for ohms the
 *     resistance, {@link Double#POSITIVE_INFINITY} for the meter's over-range (OL)
 * @param meterText the meter it was read with (may be empty)
 * @param takenAt when it was taken
 * @param healthyLow the lower end of the healthy band (in the reading's unit and measure), or null
 *     when none is known
 * @param healthyHigh the upper end of the healthy band, or null when none is known; +∞ where a
 *     healthy stage reads OL
 * @param kind DC volts, AC volts or ohms (every reading stored before kinds were kept is DC)
 * @param measure how an AC reading is stated: {@code rms}, {@code peak} or {@code pp}; null for DC
 *     and ohms
 * @param hz the test frequency of an AC reading in hertz; null for DC and ohms
 * @param to the second point of an ohms reading; empty for volts
 */
public record AfterRepairReading(
    String id,
    String caseId,
    String at,
    double value,
    String meterText,
    Instant takenAt,
    Double healthyLow,
    Double healthyHigh,
    ReadingKind kind,
    String measure,
    Double hz,
    String to) {
  public AfterRepairReading {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(caseId, "caseId");
    Times.text(at, "at");
    Times.text(meterText, "meterText");
    takenAt = Times.millis(Objects.requireNonNull(takenAt, "takenAt"));
    Objects.requireNonNull(kind, "kind");
    to = to == null ? "" : to;
    if ((healthyLow == null) != (healthyHigh == null)) {
      throw new IllegalArgumentException("a healthy band has both ends or neither");
    }
    if ((kind == ReadingKind.AC) != (measure != null && hz != null)
        || kind != ReadingKind.AC && (measure != null || hz != null)) {
      throw new IllegalArgumentException(
          "an ac reading after the repair has a measure and a frequency, a "
              + kind.word()
              + " reading neither");
    }
    if (measure != null && !StoredReading.MEASURES.contains(measure)) {
      throw new IllegalArgumentException("measure (" + measure + ") must be rms, peak or pp");
    }
    if ((kind == ReadingKind.OHMS) == to.isEmpty()) {
      throw new IllegalArgumentException(
          "an ohms reading after the repair has a second point, a volts reading none");
    }
  }

  /** Returns a DC reading (the only kind before kinds were kept); see the record description. */
  public AfterRepairReading(
      String id,
      String caseId,
      String at,
      double value,
      String meterText,
      Instant takenAt,
      Double healthyLow,
      Double healthyHigh) {
    this(
        id,
        caseId,
        at,
        value,
        meterText,
        takenAt,
        healthyLow,
        healthyHigh,
        ReadingKind.DC,
        null,
        null,
        "");
  }

  /** Returns whether a healthy band was known for the point. */
  public boolean hasBand() {
    return healthyLow != null;
  }

  /** Returns whether this is an ohms reading that showed the meter's over-range (OL). */
  public boolean isOverRange() {
    return kind == ReadingKind.OHMS && value == Double.POSITIVE_INFINITY;
  }

  /**
   * Returns whether the reading lies within its healthy band (false when none is known), by the
   * rule the readings screen judges the same kind of reading with ({@link BandFit}): a DC level
   * within the band, an AC amplitude within its own AC uncertainty of it, ohms within the meter's
   * ohms uncertainty and the test leads (OL where a healthy stage reads OL).
   */
  public boolean inside() {
    if (!hasBand()) {
      return false;
    }
    return switch (kind) {
      case DC -> BandFit.dc(healthyLow, healthyHigh, value);
      case AC -> BandFit.ac(healthyLow, healthyHigh, value);
      case OHMS -> BandFit.ohms(healthyLow, healthyHigh, value);
    };
  }

  /** Returns this reading belonging to the case known here by another id. */
  public AfterRepairReading withCase(String localCaseId) {
    return new AfterRepairReading(
        id,
        localCaseId,
        at,
        value,
        meterText,
        takenAt,
        healthyLow,
        healthyHigh,
        kind,
        measure,
        hz,
        to);
  }
}

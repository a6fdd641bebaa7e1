package com.stagewise.history.record;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Reading;
import java.time.Instant;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * One reading as taken during a case.
 *
 * <p>A reading is never deleted: one that was mistyped is struck out ({@code struckAt} says when),
 * stays in the history marked as struck, and is left out of every later diagnosis. A strike can be
 * undone (the reading stands again); {@code updatedAt} says when the reading was last struck or
 * restored, so that a strike travels between benches like any other change.
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
 * @param struckAt when it was struck out, or null while it stands
 * @param updatedAt when it was taken, struck out or restored, whichever came last
 * @param measure how an AC reading is stated: {@code rms} or {@code pp}; null for peak (the only
 *     measure before readings had one, so every AC reading stored earlier is a peak) and for DC and
 *     ohms
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
    String to,
    Instant struckAt,
    Instant updatedAt,
    String measure) {

  /** The words an AC reading's measure may be, as files and the database write them. */
  public static final List<String> MEASURES = List.of("rms", "peak", "pp");

  public StoredReading {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(caseId, "caseId");
    Times.text(at, "at");
    Objects.requireNonNull(kind, "kind");
    Times.text(meterText, "meterText");
    takenAt = Times.millis(Objects.requireNonNull(takenAt, "takenAt"));
    Times.text(to, "to");
    struckAt = Times.millis(struckAt);
    updatedAt = Times.millis(updatedAt == null ? takenAt : updatedAt);
    // Peak is stored as null, so that a peak reading is stored and sent exactly as before.
    measure = "peak".equals(measure) ? null : measure;
    if (measure != null && (kind != ReadingKind.AC || !MEASURES.contains(measure))) {
      throw new IllegalArgumentException(
          "measure (" + measure + ") must be rms, peak or pp, and only on an ac reading");
    }
  }

  /** Returns a reading stated in peak (or DC, or ohms); see the record description. */
  public StoredReading(
      String id,
      String caseId,
      String at,
      ReadingKind kind,
      double value,
      Double hz,
      Double uncertainty,
      String meterText,
      Instant takenAt,
      String to,
      Instant struckAt,
      Instant updatedAt) {
    this(
        id,
        caseId,
        at,
        kind,
        value,
        hz,
        uncertainty,
        meterText,
        takenAt,
        to,
        struckAt,
        updatedAt,
        null);
  }

  /** Returns the measure of an AC reading ({@code rms}, {@code peak} or {@code pp}); empty else. */
  public String measureWord() {
    return kind != ReadingKind.AC ? "" : measure == null ? "peak" : measure;
  }

  /**
   * Returns the reading this record stands for, as the diagnosis takes it: its kind, value, point
   * (and second point), its own uncertainty when one was given, and for AC its frequency and
   * measure (peak when the record names none).
   */
  public Reading reading() {
    Reading.Kind k =
        switch (kind) {
          case AC -> Reading.Kind.AC;
          case DC -> Reading.Kind.DC;
          case OHMS -> Reading.Kind.OHMS;
        };
    boolean ac = kind == ReadingKind.AC;
    return new Reading(
        at,
        k,
        value,
        ac && hz != null ? hz : 0,
        uncertainty == null ? OptionalDouble.empty() : OptionalDouble.of(uncertainty),
        to,
        ac ? AcMeasure.of(measureWord()) : Optional.empty());
  }

  /**
   * Returns a reading that stands (never struck out), last changed when it was taken; see the
   * record description.
   */
  public StoredReading(
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
    this(id, caseId, at, kind, value, hz, uncertainty, meterText, takenAt, to, null, takenAt);
  }

  /**
   * Returns a volts reading (DC or AC, no second point) that stands; see the record description.
   */
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

  /** Returns whether the reading has been struck out (and is left out of the diagnosis). */
  public boolean struck() {
    return struckAt != null;
  }

  /** Returns this reading struck out at {@code when}. */
  public StoredReading struckOut(Instant when) {
    Objects.requireNonNull(when, "when");
    return new StoredReading(
        id, caseId, at, kind, value, hz, uncertainty, meterText, takenAt, to, when, when, measure);
  }

  /** Returns this reading standing again (its strike undone) as of {@code when}. */
  public StoredReading restored(Instant when) {
    Objects.requireNonNull(when, "when");
    return new StoredReading(
        id, caseId, at, kind, value, hz, uncertainty, meterText, takenAt, to, null, when, measure);
  }

  /**
   * Returns whether {@code other} is the same reading as taken (every field but the strike and the
   * time of the last change), so that the two differ at most in whether it is struck out.
   */
  public boolean sameTaking(StoredReading other) {
    return id.equals(other.id)
        && caseId.equals(other.caseId)
        && at.equals(other.at)
        && to.equals(other.to)
        && kind == other.kind
        && Double.compare(value, other.value) == 0
        && Objects.equals(hz, other.hz)
        && Objects.equals(uncertainty, other.uncertainty)
        && Objects.equals(measure, other.measure)
        && meterText.equals(other.meterText)
        && takenAt.equals(other.takenAt);
  }
}

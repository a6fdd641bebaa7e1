package com.stagewise.circuit;

import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * One measurement the technician took: a DC level or an AC amplitude at a test point, or (power
 * off) the resistance between two points.
 *
 * @param at the test point: a net name (e.g. {@code OUT}) or a package pin {@code PACKAGE.PIN}
 *     (e.g. {@code U1.6})
 * @param kind whether the value is a DC level or an AC amplitude
 * @param value volts: the DC level, or the AC amplitude in {@code measure}
 * @param hz the frequency of an AC reading in hertz; 0 for a DC reading
 * @param uncertainty the half-width of the reading's uncertainty in volts, when the technician gave
 *     one; empty means "use the meter's (DC) or the scope's (AC)", see {@link
 *     ReadingSet#uncertainty(Reading)}; for an ohms reading, in ohms
 * @param to the second point of an ohms reading (a net, package pin or part lead); empty for volts
 * @param measure how an AC reading is stated (RMS, peak or peak-to-peak); empty means the same
 *     measure as the stage's AC input (version-1 behaviour, see {@link #measureIn(Stage)}); always
 *     empty for DC and ohms
 */
public record Reading(
    String at,
    Kind kind,
    double value,
    double hz,
    OptionalDouble uncertainty,
    String to,
    Optional<AcMeasure> measure) {

  /** What a reading measures. */
  public enum Kind {
    /** A DC level in volts. */
    DC,
    /** An AC amplitude in volts at one frequency. */
    AC,
    /**
     * A resistance in ohms between two points, taken with the power off; {@link
     * Double#POSITIVE_INFINITY} is the meter's over-range (OL).
     */
    OHMS;

    /** Returns the word used in files, {@code dc} or {@code ac}. */
    public String word() {
      return name().toLowerCase(Locale.ROOT);
    }
  }

  /** Checks the fields; see the record description. */
  public Reading {
    Part.requireName(at, "at");
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(uncertainty, "uncertainty");
    Objects.requireNonNull(measure, "measure");
    to = to == null ? "" : to;
    if (measure.isPresent() && kind != Kind.AC) {
      throw new InvalidInputException(
          "",
          "measure",
          "a "
              + kind.word()
              + " reading has no \"measure\" (expected \"measure\" only with \"ac\")");
    }
    if (kind == Kind.OHMS) {
      Part.requireName(to, "to");
      if (to.equals(at)) {
        throw new InvalidInputException(
            "", "to", "ohms reading from " + at + " to itself (expected two different points)");
      }
      if (Double.isNaN(value) || value < 0 || value == Double.NEGATIVE_INFINITY) {
        throw new InvalidInputException(
            "",
            "ohms",
            "ohms reading from "
                + at
                + " to "
                + to
                + " ("
                + value
                + ") must be 0 or more ohms, or \"OL\"");
      }
    } else if (!to.isEmpty()) {
      throw new InvalidInputException(
          "",
          "to",
          "a " + kind.word() + " reading has no \"to\" (expected \"to\" only with \"ohms\")");
    }
    if (kind == Kind.OHMS) {
      // The value is checked above; OL is the one non-finite value a reading may hold.
    } else if (!Double.isFinite(value)) {
      throw new InvalidInputException(
          "", kind.word(), "reading at " + at + " (" + value + ") must be a finite number");
    }
    if (kind == Kind.AC && value < 0) {
      throw new InvalidInputException(
          "", "ac", "ac reading at " + at + " (" + value + ") must be 0 or more");
    }
    if (kind == Kind.AC ? !(Double.isFinite(hz) && hz > 0) : hz != 0) {
      throw new InvalidInputException(
          "",
          "hz",
          "reading at "
              + at
              + " hz ("
              + hz
              + ") must be above 0 for an ac reading and absent for dc");
    }
    if (uncertainty.isPresent()
        && !(Double.isFinite(uncertainty.getAsDouble()) && uncertainty.getAsDouble() > 0)) {
      throw new InvalidInputException(
          "",
          "uncertainty",
          "reading at "
              + at
              + " uncertainty ("
              + uncertainty.getAsDouble()
              + ") must be above 0 volts");
    }
  }

  /** Returns a reading in the default measure; see the record description. */
  public Reading(
      String at, Kind kind, double value, double hz, OptionalDouble uncertainty, String to) {
    this(at, kind, value, hz, uncertainty, to, Optional.empty());
  }

  /** Returns a volts reading (no second point); see the record description. */
  public Reading(String at, Kind kind, double value, double hz, OptionalDouble uncertainty) {
    this(at, kind, value, hz, uncertainty, "");
  }

  /**
   * Returns an AC reading stated in {@code measure} (amplitude in volts at {@code hz}) with the
   * scope's uncertainty.
   */
  public static Reading ac(String at, double amplitude, double hz, AcMeasure measure) {
    return new Reading(
        at, Kind.AC, amplitude, hz, OptionalDouble.empty(), "", Optional.of(measure));
  }

  /**
   * Returns the measure this AC reading is stated in: its own, else that of the stage's AC input
   * (the first input with an AC amplitude; peak when the stage has none).
   */
  public AcMeasure measureIn(Stage stage) {
    return measure.isPresent() ? measure.get() : acMeasure(stage);
  }

  /** Returns the measure of the stage's first AC input, peak when it has none. */
  public static AcMeasure acMeasure(Stage stage) {
    for (TestInput input : stage.inputs()) {
      if (input.hasAc()) {
        return input.measure();
      }
    }
    return AcMeasure.PEAK;
  }

  /** Returns this reading as a peak amplitude in volts (AC), or its value unchanged (DC, ohms). */
  public double peakIn(Stage stage) {
    return kind == Kind.AC ? measureIn(stage).toPeak(value) : value;
  }

  /** Returns a copy of this volts reading taken at another point (same value, measure, …). */
  public Reading movedTo(String point) {
    return new Reading(point, kind, value, hz, uncertainty, to, measure);
  }

  /** Returns a copy with another value (and the same kind, point, measure and uncertainty). */
  public Reading withValue(double newValue) {
    return new Reading(at, kind, newValue, hz, uncertainty, to, measure);
  }

  /**
   * Returns an ohms reading between two points with the meter's ohms uncertainty; {@link
   * Double#POSITIVE_INFINITY} for OL.
   */
  public static Reading ohms(String at, String to, double ohms) {
    return new Reading(at, Kind.OHMS, ohms, 0, OptionalDouble.empty(), to);
  }

  /** Returns whether this is an ohms reading that showed the meter's over-range (OL). */
  public boolean isOverRange() {
    return kind == Kind.OHMS && value == Double.POSITIVE_INFINITY;
  }

  /** Returns a DC reading with the meter's uncertainty. */
  public static Reading dc(String at, double volts) {
    return new Reading(at, Kind.DC, volts, 0, OptionalDouble.empty());
  }

  /** Returns an AC reading (amplitude in volts at {@code hz}) with the scope's uncertainty. */
  public static Reading ac(String at, double amplitude, double hz) {
    return new Reading(at, Kind.AC, amplitude, hz, OptionalDouble.empty());
  }

  /** Returns whether the test point is a package pin ({@code PACKAGE.PIN}) rather than a net. */
  public boolean isPin(Stage stage) {
    return !stage.nets().contains(at) && at.lastIndexOf('.') > 0;
  }
}

package com.stagewise.circuit;

import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * One measurement the technician took: a DC level or an AC amplitude at a test point.
 *
 * @param at the test point: a net name (e.g. {@code OUT}) or a package pin {@code PACKAGE.PIN}
 *     (e.g. {@code U1.6})
 * @param kind whether the value is a DC level or an AC amplitude
 * @param value volts: the DC level, or the AC amplitude in the same measure (peak or RMS) as the
 *     stage's test input
 * @param hz the frequency of an AC reading in hertz; 0 for a DC reading
 * @param uncertainty the half-width of the reading's uncertainty in volts, when the technician gave
 *     one; empty means "use the meter's (DC) or the scope's (AC)", see {@link
 *     ReadingSet#uncertainty(Reading)}
 */
public record Reading(String at, Kind kind, double value, double hz, OptionalDouble uncertainty) {

  /** What a reading measures. */
  public enum Kind {
    /** A DC level in volts. */
    DC,
    /** An AC amplitude in volts at one frequency. */
    AC;

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
    if (!Double.isFinite(value)) {
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

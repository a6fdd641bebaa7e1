package com.stagewise.circuit;

import java.util.List;
import java.util.Objects;

/**
 * What the technician measured on one stage, with the meter used.
 *
 * @param meter the DC meter's accuracy ({@link MeterSpec#DEFAULT} when the file names none)
 * @param readings the readings in the order taken
 */
public record ReadingSet(MeterSpec meter, List<Reading> readings) {

  /**
   * The percentage part of a scope's AC amplitude uncertainty, ±(3 % of reading + 1 mV) (the
   * readings contract; typical of a bench scope's vertical accuracy, common practice).
   */
  public static final double SCOPE_PERCENT = 3.0;

  /**
   * The fixed part of a scope's AC amplitude uncertainty, in volts (see {@link #SCOPE_PERCENT}).
   */
  public static final double SCOPE_FLOOR_VOLTS = 1e-3;

  /** Copies the list; see the record description. */
  public ReadingSet {
    Objects.requireNonNull(meter, "meter");
    readings = List.copyOf(Objects.requireNonNull(readings, "readings"));
  }

  /**
   * Returns the half-width of a reading's uncertainty in volts (ohms for an ohms reading): the
   * technician's own figure when given, else the scope's for an AC reading, else the meter's (its
   * ohms spec for an ohms reading; infinite for OL).
   */
  public double uncertainty(Reading reading) {
    if (reading.uncertainty().isPresent()) {
      return reading.uncertainty().getAsDouble();
    }
    if (reading.kind() == Reading.Kind.OHMS) {
      return meter.ohmsUncertainty(reading.value());
    }
    if (reading.kind() == Reading.Kind.AC) {
      return SCOPE_PERCENT / 100 * Math.abs(reading.value()) + SCOPE_FLOOR_VOLTS;
    }
    return meter.uncertainty(reading.value());
  }
}

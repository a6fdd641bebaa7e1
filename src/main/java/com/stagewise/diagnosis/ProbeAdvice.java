package com.stagewise.diagnosis;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Reading;

/**
 * A test point worth reading next.
 *
 * @param at the test point: a net or a package pin
 * @param kind DC level, AC amplitude, or ohms with the power off
 * @param hz the frequency for an AC reading; 0 for DC and ohms
 * @param bits the expected information gain over the current suspect list, in bits
 * @param why which suspects the reading would tell apart (for ohms: power off and discharge first)
 * @param to the second point of an ohms check; empty otherwise
 * @param measure how an AC reading should be stated (the stage's AC input's measure); peak for DC
 *     and ohms, where it means nothing
 */
public record ProbeAdvice(
    String at,
    Reading.Kind kind,
    double hz,
    double bits,
    String why,
    String to,
    AcMeasure measure) {

  /** Checks the fields; see the record description. */
  public ProbeAdvice {
    java.util.Objects.requireNonNull(measure, "measure");
  }

  /** Returns a probe whose measure is peak (DC, ohms, or an AC probe of a peak stage). */
  public ProbeAdvice(String at, Reading.Kind kind, double hz, double bits, String why, String to) {
    this(at, kind, hz, bits, why, to, AcMeasure.PEAK);
  }

  /** Returns a volts probe (no second point). */
  public ProbeAdvice(String at, Reading.Kind kind, double hz, double bits, String why) {
    this(at, kind, hz, bits, why, "");
  }
}

package com.stagewise.diagnosis;

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
 */
public record ProbeAdvice(
    String at, Reading.Kind kind, double hz, double bits, String why, String to) {

  /** Returns a volts probe (no second point). */
  public ProbeAdvice(String at, Reading.Kind kind, double hz, double bits, String why) {
    this(at, kind, hz, bits, why, "");
  }
}

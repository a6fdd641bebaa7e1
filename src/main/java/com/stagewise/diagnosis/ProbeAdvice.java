package com.stagewise.diagnosis;

import com.stagewise.circuit.Reading;

/**
 * A test point worth reading next.
 *
 * @param at the test point: a net or a package pin
 * @param kind DC level or AC amplitude
 * @param hz the frequency for an AC reading; 0 for DC
 * @param bits the expected information gain over the current suspect list, in bits
 * @param why which suspects the reading would tell apart
 */
public record ProbeAdvice(String at, Reading.Kind kind, double hz, double bits, String why) {}

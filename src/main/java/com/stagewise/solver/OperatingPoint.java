package com.stagewise.solver;

import java.util.Map;

/**
 * The DC voltages of one consistent state of a stage.
 *
 * @param nets volts on every net, driven nets included, in the stage's net order
 * @param pins volts on every used package pin, keyed {@code PACKAGE.PIN}
 * @param states the state of every section, by designator, in the stage's order
 */
public record OperatingPoint(
    Map<String, Double> nets, Map<String, Double> pins, Map<String, SectionState> states) {

  /** Keeps the maps as given (the solver builds them in order and does not change them). */
  public OperatingPoint {
    nets = readOnly(nets);
    pins = readOnly(pins);
    states = readOnly(states);
  }

  private static <V> Map<String, V> readOnly(Map<String, V> map) {
    // The solver's own views over arrays are read-only already.
    return map instanceof Layout.ArrayMap<?> || map instanceof Layout.PinVolts
        ? map
        : java.util.Collections.unmodifiableMap(map);
  }

  /**
   * Returns the voltage at a test point: a net name or a package pin {@code PACKAGE.PIN}.
   *
   * @throws IllegalArgumentException if the stage has no such net or used pin
   */
  public double at(String testPoint) {
    if (nets instanceof Layout.NetVolts v) {
      Integer i = v.layout.netIndex.get(testPoint);
      if (i != null) {
        return v.volts[i];
      }
    }
    Double volts = nets.get(testPoint);
    if (volts == null) {
      volts = pins.get(testPoint);
    }
    if (volts == null) {
      throw new IllegalArgumentException("no net or used pin named " + testPoint);
    }
    return volts;
  }
}

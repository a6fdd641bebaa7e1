package com.stagewise.solver;

import java.util.List;
import java.util.Objects;

/**
 * What an ohmmeter should read between two points of a stage with the power off.
 *
 * <p>Resistances are in ohms; {@link Double#POSITIVE_INFINITY} stands for "nothing connects the two
 * points" (the meter shows OL). It is never printed or stored as a number: callers say "OL".
 *
 * @param nominal the resistance with every part at its marked value
 * @param low the lowest resistance any set of in-tolerance parts gives
 * @param high the highest resistance any set of in-tolerance parts gives
 * @param creep the capacitors that charge through the meter long enough to make the reading creep
 *     (largest first); empty when the reading settles at once
 */
public record OhmsPrediction(double nominal, double low, double high, List<Creep> creep) {

  /** Checks the fields; see the record description. */
  public OhmsPrediction {
    Objects.requireNonNull(creep, "creep");
    creep = List.copyOf(creep);
    if (!(low <= nominal && nominal <= high) || Double.isNaN(low) || low < 0) {
      throw new IllegalArgumentException(
          "ohms range (" + low + " … " + nominal + " … " + high + ") must be ordered, 0 or more");
    }
  }

  /** Returns whether anything connects the two points (false: the meter shows OL). */
  public boolean connected() {
    return Double.isFinite(nominal);
  }

  /**
   * A capacitor that makes a power-off reading creep while it charges through the meter.
   *
   * @param ref the capacitor's designator
   * @param farads its marked value
   * @param seconds about how long the reading takes to settle within 0.1 % (seven time constants of
   *     the capacitor and the resistance it sees)
   */
  public record Creep(String ref, double farads, double seconds) {}
}

package com.stagewise.circuit;

/**
 * A supply rail: a net held at a nominal voltage.
 *
 * @param net the rail's net, e.g. {@code VCC}
 * @param volts the nominal voltage against the stage's ground
 * @param tolerance the rail's tolerance as a fraction of {@code volts}, in [0, 1)
 */
public record Rail(String net, double volts, double tolerance) {

  /** Checks the fields; see the record description. */
  public Rail {
    Part.requireName(net, "net");
    if (!Double.isFinite(volts)) {
      throw new InvalidInputException(
          "", "volts", "rail " + net + " volts (" + volts + ") must be a finite number");
    }
    if (!Double.isFinite(tolerance) || tolerance < 0 || tolerance >= 1) {
      throw new InvalidInputException(
          "",
          "tolerance",
          "rail " + net + " tolerance (" + tolerance + ") must be between 0 and 1");
    }
  }
}

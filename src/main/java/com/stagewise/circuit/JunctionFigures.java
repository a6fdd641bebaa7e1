package com.stagewise.circuit;

/**
 * The figures of a pn junction in the Shockley diode equation with emission coefficient and series
 * resistance, {@code I = Is·(exp(Vj / (N·Vt)) − 1)} with {@code V = Vj + I·Rs}: the textbook
 * junction model that ngspice's {@code D} element also uses (its parameters IS, N, RS, BV, IBV).
 *
 * @param saturationAmps Is, amperes, above 0
 * @param emission N, the emission coefficient, above 0
 * @param seriesOhms Rs, ohms, 0 or more
 * @param breakdownVolts the junction's reverse breakdown voltage BV (volts, above 0), or {@code
 *     Double.POSITIVE_INFINITY} for a junction whose breakdown lies far outside the stage
 * @param breakdownAmps IBV, the reverse current at which the junction voltage is BV (amperes)
 */
public record JunctionFigures(
    double saturationAmps,
    double emission,
    double seriesOhms,
    double breakdownVolts,
    double breakdownAmps) {

  /**
   * The thermal voltage kT/q at 27 °C (300.15 K), the temperature at which ngspice evaluates its
   * models unless told otherwise: k = 1.38064852e-23 J/K and q = 1.6021766208e-19 C, the CODATA
   * 2014 values that ngspice's constants carry.
   */
  public static final double THERMAL_VOLTS = 1.38064852e-23 * 300.15 / 1.6021766208e-19;

  /** Checks the fields; see the record description. */
  public JunctionFigures {
    if (!(saturationAmps > 0) || !Double.isFinite(saturationAmps)) {
      throw new IllegalArgumentException("saturation current must be above 0");
    }
    if (!(emission > 0) || !(seriesOhms >= 0) || !(breakdownVolts > 0) || !(breakdownAmps > 0)) {
      throw new IllegalArgumentException("junction figures out of range");
    }
  }

  /** Returns whether the junction has a reverse breakdown (a zener). */
  public boolean breaksDown() {
    return Double.isFinite(breakdownVolts);
  }

  /**
   * Returns the forward voltage at {@code amps}, from the equation: {@code N·Vt·ln(I/Is + 1) +
   * I·Rs}.
   */
  public double forwardVolts(double amps) {
    return emission * THERMAL_VOLTS * Math.log1p(amps / saturationAmps) + amps * seriesOhms;
  }

  /** Returns a copy with a reverse breakdown whose terminal voltage at IBV is {@code volts}. */
  public JunctionFigures withBreakdownAt(double volts, double amps) {
    // The breakdown voltage BV is the junction's own; the series resistance adds I·Rs at the
    // terminals, so BV is set that much lower for the terminals to read the marked voltage.
    return new JunctionFigures(
        saturationAmps, emission, seriesOhms, Math.max(volts - amps * seriesOhms, 1e-3), amps);
  }

  /**
   * Returns figures whose forward voltage at {@code amps} is {@code volts}, for a given emission
   * coefficient and series resistance (Is solved from the equation).
   */
  static JunctionFigures forwardAt(double volts, double amps, double emission, double seriesOhms) {
    double junction = volts - amps * seriesOhms;
    double is = amps / Math.expm1(junction / (emission * THERMAL_VOLTS));
    return new JunctionFigures(is, emission, seriesOhms, Double.POSITIVE_INFINITY, 1e-3);
  }
}

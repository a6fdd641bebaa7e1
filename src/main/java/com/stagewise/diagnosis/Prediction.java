package com.stagewise.diagnosis;

import com.stagewise.solver.SectionState;
import java.util.Map;

/**
 * What one scenario of a hypothesis predicts at every test point: a mean and a spread (standard
 * deviation) from part tolerances, device parameter ranges and rail tolerances.
 *
 * @param weight the share of the hypothesis's prior
 * @param dcMean DC volts per test point
 * @param dcSd DC spread per test point, volts
 * @param ac the AC amplitude and spread per test point, worked out on first need, or null when the
 *     stage has no AC input
 * @param value the drifted part's value or low rail's volts for grid scenarios, else NaN
 * @param label a few words on the scenario, e.g. "in+ drifts to v+" (may be empty)
 * @param states each section's state in this scenario
 */
record Prediction(
    double weight,
    double[] dcMean,
    double[] dcSd,
    AcPart ac,
    double value,
    String label,
    Map<String, SectionState> states) {

  /** AC amplitude per test point, or null when the stage has no AC input. */
  double[] acMean() {
    return ac == null ? null : ac.mean();
  }

  /** AC spread per test point, or null. */
  double[] acSd() {
    return ac == null ? null : ac.sd();
  }

  Prediction withWeight(double w) {
    return new Prediction(w, dcMean, dcSd, ac, value, label, states);
  }

  /**
   * Returns a prediction a fraction t of the way from this one to {@code other} (same shape), its
   * AC part worked out under {@code lock} (the hypothesis's) when needed.
   */
  Prediction toward(Prediction other, double t, double w, double interpolatedValue, Object lock) {
    return new Prediction(
        w,
        AcPart.mix(dcMean, other.dcMean, t),
        AcPart.mix(dcSd, other.dcSd, t),
        AcPart.toward(lock, ac, other.ac, t),
        interpolatedValue,
        label,
        t < 0.5 ? states : other.states);
  }
}

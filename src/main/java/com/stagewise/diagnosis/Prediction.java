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
 * @param acMean AC amplitude per test point, or null when the stage has no AC input
 * @param acSd AC spread per test point, or null
 * @param value the drifted part's value or low rail's volts for grid scenarios, else NaN
 * @param label a few words on the scenario, e.g. "in+ drifts to v+" (may be empty)
 * @param states each section's state in this scenario
 */
record Prediction(
    double weight,
    double[] dcMean,
    double[] dcSd,
    double[] acMean,
    double[] acSd,
    double value,
    String label,
    Map<String, SectionState> states) {

  Prediction withWeight(double w) {
    return new Prediction(w, dcMean, dcSd, acMean, acSd, value, label, states);
  }

  /** Returns a prediction a fraction t of the way from this one to {@code other} (same shape). */
  Prediction toward(Prediction other, double t, double w, double interpolatedValue) {
    return new Prediction(
        w,
        mix(dcMean, other.dcMean, t),
        mix(dcSd, other.dcSd, t),
        mix(acMean, other.acMean, t),
        mix(acSd, other.acSd, t),
        interpolatedValue,
        label,
        t < 0.5 ? states : other.states);
  }

  private static double[] mix(double[] a, double[] b, double t) {
    if (a == null || b == null) {
      return a;
    }
    double[] out = new double[a.length];
    for (int i = 0; i < a.length; i++) {
      out[i] = a[i] + (b[i] - a[i]) * t;
    }
    return out;
  }
}

package com.stagewise.diagnosis;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.solver.OhmsPrediction;

/**
 * The expected information gain of an ohms check over the leading suspects, in bits: their entropy
 * less the expected entropy after the reading (the OL outcome, and three Gauss–Hermite points about
 * each connected suspect's nominal). Each suspect's OL chance and variance are worked out once per
 * check rather than once per outcome (the same expressions, so the same numbers).
 */
final class OhmsGain {
  private final double[] prior;
  private final double entropy;
  private final MeterSpec meter;

  OhmsGain(double[] prior, double entropy, MeterSpec meter) {
    this.prior = prior;
    this.entropy = entropy;
    this.meter = meter;
  }

  double of(OhmsPrediction[] predicted) {
    int n = predicted.length;
    double[] pOl = new double[n];
    double[] variance = new double[n];
    double[] norm = new double[n];
    for (int d = 0; d < n; d++) {
      pOl[d] = OhmsChecks.overRangeChance(predicted[d], meter);
      if (predicted[d].connected()) {
        variance[d] = OhmsChecks.variance(predicted[d], meter, OhmsChecks.none());
        norm[d] = Math.sqrt(2 * Math.PI * variance[d]);
      }
    }
    double expected = 0;
    double[] posterior = new double[n];
    // The OL outcome.
    double olTotal = 0;
    for (int d = 0; d < n; d++) {
      posterior[d] =
          prior[d]
              * Math.exp(
                  Math.log(
                      (1 - Evidence.MISREAD) * pOl[d] + Evidence.MISREAD * OhmsChecks.MISREAD_OL));
      olTotal += posterior[d];
    }
    if (olTotal > 0) {
      for (int d = 0; d < n; d++) {
        posterior[d] /= olTotal;
      }
      expected += olTotal * OhmsChecks.entropy(posterior);
    }
    // Numeric outcomes about each connected hypothesis's nominal (Gauss–Hermite, three points).
    double[] logs = new double[n];
    for (int c = 0; c < n; c++) {
      if (!predicted[c].connected()) {
        continue;
      }
      double shown = prior[c] * (1 - pOl[c]);
      double sd = Math.sqrt(variance[c]);
      for (int q = 0; q < OhmsChecks.NODES.length; q++) {
        double x = Math.max(0, predicted[c].nominal() + OhmsChecks.NODES[q] * sd);
        // As logLikelihood(predicted[d], false, x, meter, none()) has it.
        double tail =
            (1 - OhmsChecks.MISREAD_OL)
                / (Math.max(x, 0.1) * Math.log(10) * OhmsChecks.MISREAD_DECADES);
        double max = Double.NEGATIVE_INFINITY;
        for (int d = 0; d < n; d++) {
          double core = 0;
          if (predicted[d].connected()) {
            double dx = x - predicted[d].nominal();
            core = (1 - pOl[d]) * Math.exp(-dx * dx / (2 * variance[d])) / norm[d];
          }
          logs[d] = Math.log((1 - Evidence.MISREAD) * core + Evidence.MISREAD * tail);
          max = Math.max(max, logs[d]);
        }
        double total = 0;
        for (int d = 0; d < n; d++) {
          posterior[d] = prior[d] * Math.exp(logs[d] - max);
          total += posterior[d];
        }
        for (int d = 0; d < n; d++) {
          posterior[d] /= total;
        }
        expected += shown * OhmsChecks.NODE_WEIGHTS[q] * OhmsChecks.entropy(posterior);
      }
    }
    return Math.max(0, (entropy - expected) / Math.log(2));
  }
}

package com.stagewise.diagnosis;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import java.util.List;
import java.util.function.IntConsumer;

/**
 * Scores one hypothesis (by its place in the list) from its predictions' sums: its evidence, its
 * best-fitting prediction and its predictions' share of it (a class: a lambda spins one).
 */
final class ScoreOne implements IntConsumer {
  private final List<Diagnoser.Hypothesis> hypotheses;
  private final Likelihoods table;
  private final double[] sums;
  private final OhmsChecks ohmsChecks;
  private final List<Reading> ohms;
  private final MeterSpec meter;
  private final Diagnoser.Scored[] out;

  ScoreOne(
      List<Diagnoser.Hypothesis> hypotheses,
      Likelihoods table,
      double[] sums,
      OhmsChecks ohmsChecks,
      List<Reading> ohms,
      MeterSpec meter,
      Diagnoser.Scored[] out) {
    this.hypotheses = hypotheses;
    this.table = table;
    this.sums = sums;
    this.ohmsChecks = ohmsChecks;
    this.ohms = ohms;
    this.meter = meter;
    this.out = out;
  }

  @Override
  public void accept(int index) {
    Diagnoser.Hypothesis h = hypotheses.get(index);
    int at = table.first(index);
    int n = h.predictions.size();
    double[] logs = new double[n];
    double best = Double.NEGATIVE_INFINITY;
    int bestIndex = 0;
    for (int v = 0; v < n; v++) {
      double sum = sums[at + v];
      if (!ohms.isEmpty()) {
        sum += ohmsChecks.logLikelihood(h.fault, h.predictions.get(v).value(), ohms, meter);
      }
      logs[v] = sum;
      if (sum > best) {
        best = sum;
        bestIndex = v;
      }
    }
    double total = 0;
    for (int v = 0; v < n; v++) {
      logs[v] = Math.exp(logs[v] - best);
      total += logs[v];
    }
    for (int v = 0; v < n; v++) {
      logs[v] /= total;
    }
    double logEvidence = best + Math.log(total);
    out[index] = new Diagnoser.Scored(h, logEvidence, h.predictions.get(bestIndex), logs);
  }
}

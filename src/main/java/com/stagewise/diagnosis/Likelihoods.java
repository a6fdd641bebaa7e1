package com.stagewise.diagnosis;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Each reading's log-likelihood under every prediction of one list of hypotheses, kept per reading.
 * The predictions do not change when a reading is added, only the sum over the readings, so a
 * re-rank after one more reading computes only the new reading's figures; the others are looked up.
 * The most recently used readings are kept, up to {@link #MAX_FIGURES} numbers in all. Safe to call
 * from several threads.
 */
final class Likelihoods {
  /** Numbers kept at most (8 bytes each: 32 MB), beyond which the least recently used go. */
  private static final long MAX_FIGURES = 4_000_000;

  private final List<Diagnoser.Hypothesis> hypotheses;
  private final Evidence evidence;
  private final int[] first;
  private final int total;
  private final double[] logWeights;
  private final Map<Evidence.Bound, double[]> byReading = new LinkedHashMap<>(64, 0.75f, true);

  Likelihoods(List<Diagnoser.Hypothesis> hypotheses, Evidence evidence) {
    this.hypotheses = hypotheses;
    this.evidence = evidence;
    this.first = new int[hypotheses.size()];
    int count = 0;
    for (int h = 0; h < first.length; h++) {
      first[h] = count;
      count += hypotheses.get(h).predictions.size();
    }
    this.total = count;
    this.logWeights = new double[count];
    int i = 0;
    for (Diagnoser.Hypothesis h : hypotheses) {
      for (Prediction p : h.predictions) {
        logWeights[i++] = Math.log(p.weight());
      }
    }
  }

  /** Returns the number of predictions, all hypotheses together. */
  int total() {
    return total;
  }

  /**
   * Returns the logarithm of every prediction's weight within its hypothesis, in the order of
   * {@link #of}. The array is shared: do not change it.
   */
  double[] logWeights() {
    return logWeights;
  }

  /** Returns the index of hypothesis h's first prediction in the arrays of {@link #of}. */
  int first(int h) {
    return first[h];
  }

  /**
   * Returns the log-likelihood of a reading under every prediction, hypothesis by hypothesis in
   * list order, each hypothesis's predictions in their order ({@link Evidence#logLikelihood}). The
   * array is shared: do not change it.
   */
  synchronized double[] of(Evidence.Bound reading) {
    return of(List.of(reading))[0];
  }

  /**
   * Returns {@link #of(Evidence.Bound)} of each reading, in their order. The readings not yet kept
   * are worked out side by side ({@link EveryCore}), each on its own, so the numbers are the same
   * whatever the number of threads.
   */
  synchronized double[][] of(List<Evidence.Bound> readings) {
    double[][] out = new double[readings.size()][];
    List<Integer> missing = new ArrayList<>();
    for (int r = 0; r < out.length; r++) {
      out[r] = byReading.get(readings.get(r));
      if (out[r] == null) {
        missing.add(r);
      }
    }
    EveryCore.forEach(missing.size(), new ComputeMissing(readings, missing, out));
    for (int r : missing) {
      byReading.put(readings.get(r), out[r]);
    }
    var eldest = byReading.entrySet().iterator();
    while ((long) byReading.size() * total > MAX_FIGURES && byReading.size() > 1) {
      eldest.next();
      eldest.remove();
    }
    return out;
  }

  /** Works out the missing readings' figures, one task each (a class: a lambda spins one). */
  private final class ComputeMissing implements java.util.function.IntConsumer {
    private final List<Evidence.Bound> readings;
    private final List<Integer> missing;
    private final double[][] out;

    ComputeMissing(List<Evidence.Bound> readings, List<Integer> missing, double[][] out) {
      this.readings = readings;
      this.missing = missing;
      this.out = out;
    }

    @Override
    public void accept(int m) {
      out[missing.get(m)] = compute(readings.get(missing.get(m)));
    }
  }

  private double[] compute(Evidence.Bound reading) {
    double[] figures = new double[total];
    int i = 0;
    for (Diagnoser.Hypothesis h : hypotheses) {
      for (Prediction p : h.predictions) {
        figures[i++] = evidence.logLikelihood(p, reading);
      }
    }
    return figures;
  }
}

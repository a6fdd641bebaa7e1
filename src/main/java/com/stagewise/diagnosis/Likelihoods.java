package com.stagewise.diagnosis;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.IntConsumer;

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

  private final Evidence evidence;

  /** Every prediction, hypothesis by hypothesis in list order, in the order of {@link #sums}. */
  private final Prediction[] all;

  private final int[] first;
  private final int total;

  /** Every prediction's log weight, filled by the first run of {@link #sums}. */
  private final double[] logWeights;

  private boolean weighed;
  private final Map<Evidence.Bound, double[]> byReading = new LinkedHashMap<>(64, 0.75f, true);

  Likelihoods(List<Diagnoser.Hypothesis> hypotheses, Evidence evidence) {
    this.evidence = evidence;
    this.first = new int[hypotheses.size()];
    int count = 0;
    for (int h = 0; h < first.length; h++) {
      first[h] = count;
      count += hypotheses.get(h).predictions.size();
    }
    this.total = count;
    this.logWeights = new double[count];
    this.all = new Prediction[count];
    int i = 0;
    for (Diagnoser.Hypothesis h : hypotheses) {
      for (Prediction p : h.predictions) {
        all[i++] = p;
      }
    }
  }

  /** Returns the number of predictions, all hypotheses together. */
  int total() {
    return total;
  }

  /** Returns the index of hypothesis h's first prediction in the arrays of {@link #sums}. */
  int first(int h) {
    return first[h];
  }

  /**
   * Fills {@code sums} with, for every prediction (hypothesis by hypothesis in list order, each
   * hypothesis's predictions in their order), the logarithm of its weight plus each reading's
   * log-likelihood under it ({@link Evidence#logLikelihood}) times the reading's weight, added in
   * the readings' order; and calls {@code then} with each hypothesis's index once its sums are in.
   *
   * <p>Each hypothesis is a task of its own ({@link EveryCore}): the readings not yet kept are
   * worked out prediction by prediction, every missing reading under one prediction before the next
   * (its numbers are then at hand, where reading by reading would fetch every prediction once per
   * reading), then the sums, then {@code then}, all in one pass, so that the cores are woken once
   * for the whole ranking. Each figure and each sum is worked out on its own, in a fixed order, so
   * the numbers are the same whatever the number of threads.
   *
   * @param sums one number per prediction ({@link #total})
   * @param then called once per hypothesis, from any thread, after its sums are in
   */
  synchronized void sums(
      List<Evidence.Bound> readings, double[] weight, double[] sums, IntConsumer then) {
    double[][] figures = new double[readings.size()][];
    List<Integer> missing = new ArrayList<>();
    for (int r = 0; r < figures.length; r++) {
      figures[r] = byReading.get(readings.get(r));
      if (figures[r] == null) {
        missing.add(r);
      }
    }
    Evidence.Bound[] wanted = new Evidence.Bound[missing.size()];
    double[][] worked = new double[wanted.length][];
    for (int m = 0; m < wanted.length; m++) {
      wanted[m] = readings.get(missing.get(m));
      worked[m] = new double[total];
      figures[missing.get(m)] = worked[m];
    }
    EveryCore.forEach(first.length, new Run(!weighed, wanted, worked, figures, weight, sums, then));
    weighed = true;
    for (int m = 0; m < wanted.length; m++) {
      byReading.put(wanted[m], worked[m]);
    }
    var eldest = byReading.entrySet().iterator();
    while ((long) byReading.size() * total > MAX_FIGURES && byReading.size() > 1) {
      eldest.next();
      eldest.remove();
    }
  }

  /**
   * One hypothesis's predictions: their log weights when not yet known, the missing readings'
   * figures, the sums, then the caller's step (a class: a lambda spins one on first use).
   */
  private final class Run implements IntConsumer {
    private final boolean weigh;
    private final Evidence.Bound[] wanted;
    private final double[][] worked;
    private final double[][] figures;
    private final double[] weight;
    private final double[] sums;
    private final IntConsumer then;

    Run(
        boolean weigh,
        Evidence.Bound[] wanted,
        double[][] worked,
        double[][] figures,
        double[] weight,
        double[] sums,
        IntConsumer then) {
      this.weigh = weigh;
      this.wanted = wanted;
      this.worked = worked;
      this.figures = figures;
      this.weight = weight;
      this.sums = sums;
      this.then = then;
    }

    @Override
    public void accept(int h) {
      int end = h + 1 < first.length ? first[h + 1] : total;
      for (int i = first[h]; i < end; i++) {
        Prediction p = all[i];
        if (weigh) {
          logWeights[i] = Math.log(p.weight());
        }
        for (int m = 0; m < wanted.length; m++) {
          worked[m][i] = evidence.logLikelihood(p, wanted[m]);
        }
        double sum = logWeights[i];
        for (int r = 0; r < figures.length; r++) {
          sum += weight[r] * figures[r][i];
        }
        sums[i] = sum;
      }
      then.accept(h);
    }
  }
}

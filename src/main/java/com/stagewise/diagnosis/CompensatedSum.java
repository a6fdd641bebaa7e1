package com.stagewise.diagnosis;

/**
 * A running sum with the compensation (Kahan's) that {@code DoubleStream.sum()} applies in the JDK
 * this project builds on (17: {@code Collectors.sumWithCompensation} and {@code computeFinalSum}),
 * step for step, so that a loop gives the very bits the stream gave. A loop rather than a stream on
 * the diagnosis's path: each stream pipeline and lambda loads and spins classes on first use, which
 * a fresh command-line run pays for.
 */
final class CompensatedSum {
  private double sum;
  private double compensation;
  private double simple;

  /** Returns the suspects' summed probability. */
  static double probability(java.util.List<Diagnoser.Scored> suspects) {
    CompensatedSum sum = new CompensatedSum();
    for (Diagnoser.Scored s : suspects) {
      sum.add(s.probability);
    }
    return sum.total();
  }

  /** Adds a value. */
  void add(double value) {
    double tmp = value - compensation;
    double velvel = sum + tmp;
    compensation = (velvel - sum) - tmp;
    sum = velvel;
    simple += value;
  }

  /** Returns the sum (the simple one where the compensated one is NaN from infinite terms). */
  double total() {
    double tmp = sum - compensation;
    if (Double.isNaN(tmp) && Double.isInfinite(simple)) {
      return simple;
    }
    return tmp;
  }
}

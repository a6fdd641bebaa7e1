package com.stagewise.diagnosis;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;

/**
 * How well predictions fit readings: the likelihood of each reading given a prediction.
 *
 * <p>The core is a normal density whose variance adds the prediction's spread, the instrument's
 * uncertainty (its half-width taken as a uniform error, so its variance is u²/3) and a small model
 * floor. The tail is a uniform density over the whole span of the rails with weight {@link
 * #MISREAD}: a misread or mistyped value lowers a hypothesis but never eliminates it.
 */
final class Evidence {
  /** Chance that any one reading is a misread, wrong pin or typing slip (common practice). */
  static final double MISREAD = 0.01;

  /**
   * Model error that no parameter covers (wiring resistance, leakage, meter loading), volts. A
   * figure of common practice: half a millivolt, below a 6000-count meter's last digit on 6 V.
   */
  static final double FLOOR_VOLTS = 5e-4;

  /**
   * The predicted spread is widened by this factor: it is a linearisation about the operating
   * point, and uniform parameter ranges add up to tails a little heavier than the normal density's.
   * Chosen on the fault truth set (1.0, 1.5, 2, 2.5, 3 and 4 tried; 1.5 called the most healthy
   * units healthy and ranked the faults best).
   */
  static final double SPREAD_MARGIN = 1.5;

  /** Relative model floor for AC amplitudes (flat open-loop gain, ideal parts): 1 %. */
  static final double AC_FLOOR = 0.01;

  /**
   * One reading bound to its test point, with its uncertainty's variance. An AC reading is held as
   * a peak amplitude (the solver's measure), with the measure it was stated in kept for the texts.
   */
  record Bound(int point, boolean ac, double value, double variance, String at, AcMeasure measure) {
    Bound(int point, boolean ac, double value, double variance, String at) {
      this(point, ac, value, variance, at, AcMeasure.PEAK);
    }

    /** Returns a peak amplitude (or DC volts) in the measure this reading was stated in. */
    double stated(double volts) {
      return ac ? measure.fromPeak(volts) : volts;
    }

    // Equality and hash written out (the generated ones' rules), as in Part: the generated ones
    // are set up through method handles on first use, slow in a fresh command-line run.
    @Override
    public boolean equals(Object o) {
      return o instanceof Bound b
          && point == b.point
          && ac == b.ac
          && Double.compare(value, b.value) == 0
          && Double.compare(variance, b.variance) == 0
          && java.util.Objects.equals(at, b.at)
          && measure == b.measure;
    }

    @Override
    public int hashCode() {
      int h = Integer.hashCode(point);
      h = 31 * h + Boolean.hashCode(ac);
      h = 31 * h + Double.hashCode(value);
      h = 31 * h + Double.hashCode(variance);
      h = 31 * h + java.util.Objects.hashCode(at);
      return 31 * h + java.util.Objects.hashCode(measure);
    }
  }

  private final double tailDensity;

  /** The misread tail's part of every likelihood, {@code MISREAD · tailDensity}. */
  private final double misread;

  /** {@code log(misread)}: the log-likelihood of a reading far outside a prediction's core. */
  private final double logMisread;

  /**
   * An exponent of the normal core below which the core, added to {@link #misread}, is less than
   * half the spacing of doubles at {@code misread}: the sum rounds to {@code misread} itself, so
   * the log-likelihood is {@link #logMisread} to the last bit, and neither exp nor log is needed.
   * The bound takes the smallest variance a reading can have (the model floor alone) and one unit
   * of margin in the exponent for the rounding of exp, the square root and the products.
   */
  private final double farExponent;

  Evidence(double span) {
    // Uniform over [-1.2·span - 1, +1.2·span + 1] volts.
    this.tailDensity = 1 / (2 * (1.2 * span + 1));
    this.misread = MISREAD * tailDensity;
    this.logMisread = Math.log(misread);
    double smallestRoot = Math.sqrt(2 * Math.PI * FLOOR_VOLTS * FLOOR_VOLTS);
    this.farExponent = Math.log(Math.ulp(misread) / 2 * smallestRoot / (1 - MISREAD)) - 1;
  }

  /**
   * Binds a reading to its test point. An AC reading and its uncertainty (the scope's or meter's
   * figure on the value as stated) are turned into peak volts, the measure of the predictions.
   */
  static Bound bind(TestPoints points, ReadingSet set, Reading reading, Stage stage) {
    int point = points.index.get(reading.at());
    double u = set.uncertainty(reading);
    if (reading.kind() != Reading.Kind.AC) {
      return new Bound(point, false, reading.value(), u * u / 3, reading.at());
    }
    AcMeasure measure = reading.measureIn(stage);
    double peakU = measure.toPeak(u);
    return new Bound(
        point, true, measure.toPeak(reading.value()), peakU * peakU / 3, reading.at(), measure);
  }

  /** Returns the variance of the prediction's error at a reading: spread, instrument and floor. */
  static double variance(Prediction p, Bound r) {
    double sd = SPREAD_MARGIN * (r.ac() ? p.acSd()[r.point()] : p.dcSd()[r.point()]);
    double mean = mean(p, r);
    double floor = r.ac() ? AC_FLOOR * Math.abs(mean) + FLOOR_VOLTS : FLOOR_VOLTS;
    return sd * sd + r.variance() + floor * floor;
  }

  static double mean(Prediction p, Bound r) {
    if (r.ac()) {
      return p.acMean() == null ? 0 : p.acMean()[r.point()];
    }
    return p.dcMean()[r.point()];
  }

  /** Returns the log-likelihood of one reading under a prediction. */
  double logLikelihood(Prediction p, Bound r) {
    return logLikelihood(r.value(), mean(p, r), variance(p, r));
  }

  /** Returns the log-likelihood of a value given a predicted mean and total variance. */
  double logLikelihood(double value, double mean, double variance) {
    double d = value - mean;
    double exponent = -d * d / (2 * variance);
    if (exponent < farExponent) {
      // Far out in the tail (most readings under most wrong hypotheses): the same number as the
      // full formula gives, without computing it (see farExponent).
      return logMisread;
    }
    double core = Math.exp(exponent) / Math.sqrt(2 * Math.PI * variance);
    return Math.log((1 - MISREAD) * core + misread);
  }

  /** Returns how many standard deviations a reading lies from a prediction. */
  static double score(Prediction p, Bound r) {
    return Math.abs(r.value() - mean(p, r)) / Math.sqrt(variance(p, r));
  }
}

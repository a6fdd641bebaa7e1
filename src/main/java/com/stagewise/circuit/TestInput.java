package com.stagewise.circuit;

/**
 * A test input applied to a net: a DC level and optionally an AC amplitude at one frequency.
 *
 * @param net the driven net
 * @param dc the DC level in volts
 * @param ac the AC amplitude in volts, stated in {@code measure}; 0 when none
 * @param hz the AC frequency in hertz; 0 when there is no AC
 * @param measure how {@code ac} is stated: peak (the default), RMS or peak-to-peak
 */
public record TestInput(String net, double dc, double ac, double hz, AcMeasure measure) {

  /** Returns an input whose AC amplitude is a peak (the stage sheet's default). */
  public TestInput(String net, double dc, double ac, double hz) {
    this(net, dc, ac, hz, AcMeasure.PEAK);
  }

  /** Checks the fields; see the record description. */
  public TestInput {
    Part.requireName(net, "net");
    java.util.Objects.requireNonNull(measure, "measure");
    if (!Double.isFinite(dc)) {
      throw new InvalidInputException(
          "", "dc", "input " + net + " dc (" + dc + ") must be a finite number");
    }
    if (!Double.isFinite(ac) || ac < 0) {
      throw new InvalidInputException(
          "", "ac", "input " + net + " ac (" + ac + ") must be 0 or more");
    }
    if (!Double.isFinite(hz) || hz < 0) {
      throw new InvalidInputException(
          "", "hz", "input " + net + " hz (" + hz + ") must be 0 or more");
    }
    if (ac > 0 && hz <= 0) {
      throw new InvalidInputException(
          "", "hz", "input " + net + " has an ac amplitude, so hz must be above 0");
    }
  }

  /** Returns a DC-only input. */
  public static TestInput dc(String net, double volts) {
    return new TestInput(net, volts, 0, 0);
  }

  /** Returns whether the input carries an AC amplitude. */
  public boolean hasAc() {
    return ac > 0;
  }

  /** Returns the AC amplitude as a peak in volts, whatever the measure it is stated in. */
  public double peakAc() {
    return measure.toPeak(ac);
  }

  /** Returns a copy with another DC level. */
  public TestInput withDc(double volts) {
    return new TestInput(net, volts, ac, hz, measure);
  }

  /**
   * Returns a copy with the AC signal at another frequency (the same amplitude and measure): the
   * generator turned to {@code newHz}.
   *
   * @throws InvalidInputException if {@code newHz} is not above 0 while the input has AC
   */
  public TestInput withHz(double newHz) {
    return new TestInput(net, dc, ac, newHz, measure);
  }

  /** Returns a copy with the AC amplitude stated in another measure (the same signal). */
  public TestInput withMeasure(AcMeasure other) {
    return new TestInput(net, dc, other.fromPeak(peakAc()), hz, other);
  }
}

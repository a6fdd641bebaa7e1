package com.stagewise.circuit;

/**
 * The accuracy of the technician's DC meter: ±(percent of reading + counts of the last digit),
 * autoranging.
 *
 * <p>An autoranging meter of {@code displayCounts} counts has ranges whose full scale is {@code
 * displayCounts} times a resolution of 0.1 mV, 1 mV, 10 mV or 100 mV; for 6000 counts these are the
 * 0.6, 6, 60 and 600 V ranges. A reading uses the smallest range that holds it.
 *
 * @param percent the percentage of the reading, e.g. 0.5 for ±0.5 %, 0 or more
 * @param counts the number of counts of the last digit, 0 or more
 * @param displayCounts the counts of the display, e.g. 6000, above 0
 * @param ohms the accuracy of the resistance ranges ({@link OhmsSpec#DEFAULT} unless given)
 */
public record MeterSpec(double percent, int counts, int displayCounts, OhmsSpec ohms) {

  /**
   * A 6000-count handheld meter at ±(0.5 % of reading + 2 counts) (the default of the readings
   * contract; typical of a general-purpose handheld, common practice).
   */
  public static final MeterSpec DEFAULT = new MeterSpec(0.5, 2, 6000);

  /** The finest resolution of the lowest range, in volts (0.1 mV, common practice). */
  private static final double FINEST_RESOLUTION = 1e-4;

  /** Number of decade ranges (for 6000 counts: 0.6, 6, 60 and 600 V). */
  private static final int RANGES = 4;

  /** Returns a meter with the default ohms accuracy; see the record description. */
  public MeterSpec(double percent, int counts, int displayCounts) {
    this(percent, counts, displayCounts, OhmsSpec.DEFAULT);
  }

  /** Checks the fields; see the record description. */
  public MeterSpec {
    java.util.Objects.requireNonNull(ohms, "ohms");
    if (!Double.isFinite(percent) || percent < 0) {
      throw new InvalidInputException(
          "", "percent", "meter percent (" + percent + ") must be 0 or more");
    }
    if (counts < 0) {
      throw new InvalidInputException(
          "", "counts", "meter counts (" + counts + ") must be 0 or more");
    }
    if (displayCounts <= 0) {
      throw new InvalidInputException(
          "",
          "displayCounts",
          "meter displayCounts (" + displayCounts + ") must be above 0, e.g. 6000");
    }
  }

  /** Returns the resolution (one count) in volts of the range that shows {@code volts}. */
  public double resolution(double volts) {
    double resolution = FINEST_RESOLUTION;
    for (int range = 1; range < RANGES && Math.abs(volts) >= displayCounts * resolution; range++) {
      resolution *= 10;
    }
    return resolution;
  }

  /** Returns the half-width of the uncertainty of an ohms reading, in ohms. */
  public double ohmsUncertainty(double ohms) {
    return this.ohms.uncertainty(ohms, displayCounts);
  }

  /** Returns the largest resistance the meter shows before OL, in ohms. */
  public double ohmsOverRange() {
    return ohms.overRange(displayCounts);
  }

  /** Returns the half-width of the uncertainty of a DC reading of {@code volts}, in volts. */
  public double uncertainty(double volts) {
    return percent / 100 * Math.abs(volts) + counts * resolution(volts);
  }
}

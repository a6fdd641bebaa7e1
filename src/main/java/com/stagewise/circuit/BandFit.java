package com.stagewise.circuit;

/**
 * Whether a reading fits the healthy band of its point: the one rule for every place that says
 * "inside" or "outside" (the readings screen's cards and charts, the check after a repair, the
 * history and the report of that check), so that a value judged on one screen is judged the same
 * everywhere. Each band end is in the reading's own unit and measure.
 */
public final class BandFit {
  /** Test leads and their contact, ohms: a few tenths unless nulled (common practice). */
  public static final double LEADS_OHMS = 0.5;

  private BandFit() {}

  /**
   * Returns whether a DC level lies within its healthy band, ends included. False when the band or
   * the value is not a finite number.
   */
  public static boolean dc(double low, double high, double volts) {
    if (!Double.isFinite(low) || !Double.isFinite(high) || !Double.isFinite(volts)) {
      return false;
    }
    // A hair of rounding either side: a band of zero width (a rail held exactly) still fits it.
    return volts >= low - 1e-12 && volts <= high + 1e-12;
  }

  /**
   * Returns whether an AC amplitude fits a healthy range: within the range widened at each end by
   * the reading's own uncertainty as the diagnosis takes it for an AC reading without one, ±(3 % of
   * reading + 1 mV) ({@link ReadingSet#SCOPE_PERCENT}). False when the range is unknown (NaN).
   */
  public static boolean ac(double low, double high, double measured) {
    if (!Double.isFinite(low) || !Double.isFinite(high) || !Double.isFinite(measured)) {
      return false;
    }
    double u = ReadingSet.SCOPE_PERCENT / 100 * Math.abs(measured) + ReadingSet.SCOPE_FLOOR_VOLTS;
    return measured >= Math.min(low, high) - u && measured <= Math.max(low, high) + u;
  }

  /**
   * Returns whether an ohms reading fits a healthy range: within the range widened by the default
   * meter's ohms uncertainty at each end and {@link #LEADS_OHMS} for the test leads (common
   * practice), or OL (+∞) where a healthy stage reads OL or beyond the meter's top range. False
   * when the range is unknown (NaN).
   */
  public static boolean ohms(double low, double high, double measured) {
    if (Double.isNaN(low) || Double.isNaN(high) || Double.isNaN(measured)) {
      return false;
    }
    if (measured == Double.POSITIVE_INFINITY) {
      // OL: a healthy stage reads OL there, or beyond the meter's top range.
      return high > MeterSpec.DEFAULT.ohmsOverRange();
    }
    if (high == Double.POSITIVE_INFINITY) {
      return false;
    }
    return measured >= low - MeterSpec.DEFAULT.ohmsUncertainty(low) - LEADS_OHMS
        && measured <= high + MeterSpec.DEFAULT.ohmsUncertainty(high) + LEADS_OHMS;
  }
}

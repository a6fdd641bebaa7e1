package com.stagewise.circuit;

/**
 * The accuracy of the meter's resistance function: ±(percent of reading + counts of the last
 * digit), autoranging over decade ranges from 600 Ω to 60 MΩ (for a 6000-count display).
 *
 * <p>The lowest range resolves 0.1 Ω; each range up resolves ten times coarser; there are six (600
 * Ω, 6 kΩ, 60 kΩ, 600 kΩ, 6 MΩ, 60 MΩ for 6000 counts). A resistance beyond the top range shows the
 * over-range, OL.
 *
 * @param percent the percentage of the reading, e.g. 0.8 for ±0.8 %, 0 or more
 * @param counts the number of counts of the last digit, 0 or more
 */
public record OhmsSpec(double percent, int counts) {

  /**
   * ±(0.8 % of reading + 3 counts) (the default of the readings contract; typical of a
   * general-purpose handheld's resistance ranges, common practice).
   */
  public static final OhmsSpec DEFAULT = new OhmsSpec(0.8, 3);

  /** The resolution of the lowest range, in ohms (0.1 Ω, common practice). */
  private static final double FINEST_RESOLUTION = 0.1;

  /** Number of decade ranges (600 Ω … 60 MΩ for 6000 counts). */
  private static final int RANGES = 6;

  /** Checks the fields; see the record description. */
  public OhmsSpec {
    if (!Double.isFinite(percent) || percent < 0) {
      throw new InvalidInputException(
          "", "percent", "meter ohms percent (" + percent + ") must be 0 or more");
    }
    if (counts < 0) {
      throw new InvalidInputException(
          "", "counts", "meter ohms counts (" + counts + ") must be 0 or more");
    }
  }

  /** Returns the resolution (one count) in ohms of the range that shows {@code ohms}. */
  public double resolution(double ohms, int displayCounts) {
    double resolution = FINEST_RESOLUTION;
    for (int range = 1; range < RANGES && ohms >= displayCounts * resolution; range++) {
      resolution *= 10;
    }
    return resolution;
  }

  /** Returns the largest resistance the meter shows before OL (60 MΩ for 6000 counts), in ohms. */
  public double overRange(int displayCounts) {
    return displayCounts * FINEST_RESOLUTION * Math.pow(10, RANGES - 1);
  }

  /** Returns the half-width of the uncertainty of a reading of {@code ohms}, in ohms. */
  public double uncertainty(double ohms, int displayCounts) {
    return percent / 100 * Math.abs(ohms) + counts * resolution(ohms, displayCounts);
  }
}

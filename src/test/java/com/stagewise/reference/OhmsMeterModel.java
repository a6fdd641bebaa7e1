package com.stagewise.reference;

/**
 * The technician's ohmmeter as the truth generator models it, written here from the readings
 * contract of the design notes (not taken from the main code, so that the truth stays independent):
 * ±(percent of reading + counts of the last digit), autoranging over six decade ranges whose full
 * scale is {@code displayCounts} counts of 0.1 Ω, 1 Ω, … 10 kΩ (for 6000 counts: 600 Ω … 60 MΩ); a
 * resistance beyond the top range shows OL. A reading uses the smallest range that holds it.
 *
 * @param percent percent of the reading
 * @param counts counts of the last digit
 * @param displayCounts counts of the display
 */
record OhmsMeterModel(double percent, int counts, int displayCounts) {
  /**
   * A 6000-count handheld at ±(0.8 % + 3 counts): the readings contract's default ohms spec
   * (typical of a general-purpose handheld's resistance ranges, common practice).
   */
  static final OhmsMeterModel HANDHELD = new OhmsMeterModel(0.8, 3, 6000);

  private static final double FINEST = 0.1;

  private static final int RANGES = 6;

  /** Returns the resolution in ohms of the range that shows {@code ohms}. */
  double resolution(double ohms) {
    double resolution = FINEST;
    for (int range = 1; range < RANGES && ohms >= displayCounts * resolution; range++) {
      resolution *= 10;
    }
    return resolution;
  }

  /** Returns the largest reading before OL (60 MΩ for 6000 counts). */
  double overRange() {
    return displayCounts * FINEST * Math.pow(10, RANGES - 1);
  }

  /** Returns the half-width of the meter's error for a reading of {@code ohms}. */
  double uncertainty(double ohms) {
    return percent / 100 * ohms + counts * resolution(ohms);
  }
}

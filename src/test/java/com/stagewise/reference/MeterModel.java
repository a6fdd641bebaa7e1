package com.stagewise.reference;

/**
 * The technician's DC meter as the truth generator models it, written here from the readings
 * contract of the design notes (not taken from the main code, so that the truth stays independent):
 * ±(percent of reading + counts of the last digit), autoranging over decade ranges whose full scale
 * is {@code displayCounts} counts of 0.1 mV, 1 mV, 10 mV or 100 mV (for 6000 counts: the 0.6, 6, 60
 * and 600 V ranges). A reading uses the smallest range that holds it.
 *
 * @param percent percent of the reading
 * @param counts counts of the last digit
 * @param displayCounts counts of the display
 */
record MeterModel(double percent, int counts, int displayCounts) {
  /**
   * A 6000-count handheld at ±(0.5 % + 2 counts): the readings contract's default meter (typical of
   * a general-purpose handheld, common practice).
   */
  static final MeterModel HANDHELD = new MeterModel(0.5, 2, 6000);

  /** Returns the resolution in volts of the range that shows {@code volts}. */
  double resolution(double volts) {
    double resolution = 1e-4;
    for (int range = 1; range < 4 && Math.abs(volts) >= displayCounts * resolution; range++) {
      resolution *= 10;
    }
    return resolution;
  }

  /** Returns the half-width of the meter's error for a reading of {@code volts}. */
  double uncertainty(double volts) {
    return percent / 100 * Math.abs(volts) + counts * resolution(volts);
  }
}

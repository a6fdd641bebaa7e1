package com.stagewise.circuit.value;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/** Exact decimal helpers shared by the codes, so that 4k7 is the same double as 4700. */
final class Decimals {
  /**
   * Significant digits kept when a double is read back as a decimal: enough for any part value, few
   * enough to drop the binary noise of a computed value (4.99e3 computed as 4989.999999999999).
   */
  static final int CLEAN_DIGITS = 12;

  private Decimals() {}

  /** Returns the decimal that a finite double stands for, rounded to {@link #CLEAN_DIGITS}. */
  static BigDecimal clean(double value) {
    return new BigDecimal(Double.toString(value))
        .round(new MathContext(CLEAN_DIGITS, RoundingMode.HALF_EVEN))
        .stripTrailingZeros();
  }

  /** Returns {@code value} rounded to {@code digits} significant digits, half up, no trailing 0. */
  static BigDecimal round(double value, int digits) {
    return new BigDecimal(Double.toString(value))
        .round(new MathContext(digits, RoundingMode.HALF_UP))
        .stripTrailingZeros();
  }

  /** Returns the power of ten of the leading digit of a non-zero decimal (4700 gives 3). */
  static int leadingExponent(BigDecimal value) {
    return value.precision() - value.scale() - 1;
  }

  /** Returns {@code digits × 10^exponent} as the nearest double. */
  static double times10(long digits, int exponent) {
    return BigDecimal.valueOf(digits).scaleByPowerOfTen(exponent).doubleValue();
  }

  /**
   * Returns the plain decimal text of {@code value} with at least {@code minDigits} significant
   * digits, adding zeros after the point where needed (1 gives "1.0" for two digits).
   */
  static String plainWithDigits(BigDecimal value, int minDigits) {
    BigDecimal padded = value.stripTrailingZeros();
    if (padded.signum() != 0 && padded.precision() < minDigits) {
      padded = padded.setScale(padded.scale() + minDigits - padded.precision());
    }
    return padded.toPlainString();
  }
}

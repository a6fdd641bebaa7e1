package com.stagewise.interchange;

import java.math.BigDecimal;

/**
 * Prints part values in RKM code and tolerances as percentages for the files people read and edit
 * ({@code 4k7}, {@code 100n}, {@code 470R}, {@code 1%}).
 *
 * <p>Unlike the four-digit printing of {@link com.stagewise.circuit.value.SiValue}, this keeps
 * every digit, so that a value written and read back with {@code SiValue.parse} is the same double
 * (a stage sheet must round-trip exactly, whatever value the diagnosis or a form put in it).
 * Decimal arithmetic; nothing here depends on the machine's locale.
 */
final class ValueText {
  private ValueText() {}

  // Index 4 (no prefix) is a placeholder.
  private static final String PREFIXES = "pnum kMG";

  /**
   * Returns a value in RKM code for a human to read: {@code 4k7}, {@code 100n}, {@code 470R},
   * {@code 0R}, {@code 1M5}, {@code 2u2}.
   *
   * @param ohms whether the value is a resistance: values below 1 k then end in {@code R}
   */
  static String format(double value, boolean ohms) {
    if (value == 0) {
      return ohms ? "0R" : "0";
    }
    BigDecimal exact = BigDecimal.valueOf(Math.abs(value));
    int decade = (int) Math.floor(Math.log10(Math.abs(value)) / 3);
    decade = Math.max(-4, Math.min(3, decade));
    // Values below 1 (a fraction of an ohm, say) keep the R form; capacitors use p, n, u, m.
    if (ohms && decade < 0) {
      decade = 0;
    }
    // log10 may land a hair off an exact decade; the decimal mantissa settles it.
    if (decade < 3
        && exact.scaleByPowerOfTen(-3 * decade).compareTo(BigDecimal.valueOf(1000)) >= 0) {
      decade++;
    }
    if (decade > -4
        && exact.scaleByPowerOfTen(-3 * decade).compareTo(BigDecimal.ONE) < 0
        && !(ohms && decade == 0)) {
      decade--;
    }
    BigDecimal mantissa = exact.scaleByPowerOfTen(-3 * decade).stripTrailingZeros();
    String letter = decade == 0 ? (ohms ? "R" : "") : String.valueOf(PREFIXES.charAt(decade + 4));
    String digits = mantissa.toPlainString();
    String sign = value < 0 ? "-" : "";
    if (letter.isEmpty()) {
      return sign + digits;
    }
    int point = digits.indexOf('.');
    if (point < 0) {
      return sign + digits + letter;
    }
    String whole = digits.substring(0, point);
    return sign + (whole.isEmpty() ? "0" : whole) + letter + digits.substring(point + 1);
  }

  /** Returns a tolerance fraction as a percentage string, e.g. {@code 1%} or {@code 0.5%}. */
  static String formatTolerance(double fraction) {
    return BigDecimal.valueOf(fraction).scaleByPowerOfTen(2).stripTrailingZeros().toPlainString()
        + "%";
  }
}

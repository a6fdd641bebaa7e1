package com.stagewise.cli;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Locale;

/**
 * The columns of the diagnosis table, written as {@code String.format(Locale.ROOT, …)} writes them,
 * without a {@link java.util.Formatter}: a number through a formatter loads the JDK's locale data
 * (decimal symbols, the CLDR provider and its resource bundles) on first use, about 10 ms of a cold
 * command line (DEVELOPERS.md, "Start-up of the command line").
 */
final class TableText {

  private TableText() {}

  /** Returns {@code text} padded with spaces on the right to {@code width}, as {@code %-Ns}. */
  static String left(Object text, int width) {
    String s = String.valueOf(text);
    return s.length() >= width ? s : s + " ".repeat(width - s.length());
  }

  /** Returns {@code text} padded with spaces on the left to {@code width}, as {@code %Ns}. */
  static String right(Object text, int width) {
    String s = String.valueOf(text);
    return s.length() >= width ? s : " ".repeat(width - s.length()) + s;
  }

  /**
   * Returns {@code value} with {@code decimals} digits after the point, as {@code %.Nf} in {@code
   * Locale.ROOT}: the shortest decimal that reads back as the value ({@link Double#toString}),
   * rounded half up, which is how the JDK's formatter rounds. Negative, zero-signed and non-finite
   * values go through the formatter itself (its minus sign on a value that rounds to zero).
   */
  static String fixed(double value, int decimals) {
    boolean plain = value >= 0 && value < Double.POSITIVE_INFINITY && !isNegativeZero(value);
    if (!plain) {
      return String.format(Locale.ROOT, "%." + decimals + "f", value);
    }
    return new BigDecimal(Double.toString(value))
        .setScale(decimals, RoundingMode.HALF_UP)
        .toPlainString();
  }

  private static boolean isNegativeZero(double value) {
    return Double.doubleToRawLongBits(value) == Double.doubleToRawLongBits(-0.0);
  }
}

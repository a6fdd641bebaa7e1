package com.stagewise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The diagnosis table's columns written without a formatter give what the JDK's {@link
 * java.util.Formatter} gives for the same conversion in {@code Locale.ROOT} (its Javadoc: {@code
 * %.Nf} rounds the digits of {@link Double#toString} half up; {@code -} pads on the right).
 */
class TableTextTest {

  @ParameterizedTest
  @CsvSource({
    // Ties of the decimal digits, where half up and half even differ (Formatter Javadoc).
    "0.05, 1",
    "0.15, 1",
    "0.25, 1",
    "2.5, 0",
    "78.85, 1",
    "99.95, 1",
    "0.125, 2",
    "0.835, 2",
    "1.005, 2",
    "2.675, 2",
    // Small, large, whole, zero, and values Double.toString writes with an exponent.
    "0, 1",
    "0, 2",
    "100, 1",
    "1e-5, 1",
    "4.9e-324, 2",
    "1.0e7, 2",
    "1.7976931348623157e308, 1",
    "0.0001, 2",
    "0.00499999, 2",
    "0.005, 2",
    // Negative, negative zero and non-finite values go through the formatter itself.
    "-0.04, 1",
    "-0.0, 1",
    "-1.25, 1",
    "NaN, 2",
    "Infinity, 1",
    "-Infinity, 2"
  })
  void fixed_edgeValues_asFormatter(double value, int decimals) {
    assertEquals(
        String.format(Locale.ROOT, "%." + decimals + "f", value), TableText.fixed(value, decimals));
  }

  @Test
  void fixed_seededValuesOfBothColumns_asFormatter() {
    SplittableRandom random = new SplittableRandom(20261203L);
    for (int i = 0; i < 20_000; i++) {
      // Percentages (0 to 100, %5.1f) and bits (0 to about 4, %.2f), some cut to few digits so
      // that ties come up.
      double percent = 100 * random.nextDouble();
      double bits = 4 * random.nextDouble();
      if (i % 2 == 0) {
        percent = Math.round(percent * 100) / 100.0;
        bits = Math.round(bits * 1000) / 1000.0;
      }
      assertEquals(
          String.format(Locale.ROOT, "%5.1f", percent),
          TableText.right(TableText.fixed(percent, 1), 5),
          "percent " + percent);
      assertEquals(
          String.format(Locale.ROOT, "%.2f", bits), TableText.fixed(bits, 2), "bits " + bits);
    }
  }

  @ParameterizedTest
  @CsvSource({"'', 3", "ab, 3", "abc, 3", "abcd, 3", "U2.11, 10", "VEE:missing, 18"})
  void leftAndRight_asPaddedStrings(String text, int width) {
    assertEquals(String.format(Locale.ROOT, "%-" + width + "s", text), TableText.left(text, width));
    assertEquals(String.format(Locale.ROOT, "%" + width + "s", text), TableText.right(text, width));
  }

  @Test
  void right_ranks_asTwoDigitDecimal() {
    for (int rank = 1; rank <= 120; rank++) {
      assertEquals(String.format(Locale.ROOT, "%2d", rank), TableText.right(rank, 2));
    }
  }
}

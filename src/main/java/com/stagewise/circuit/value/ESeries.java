package com.stagewise.circuit.value;

import com.stagewise.circuit.InvalidInputException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * The preferred-number series of IEC 60063 (E3 to E192): the values in one decade from 1 to 10,
 * repeated in every decade.
 *
 * <p>The tables are written out as the standard prints them, not computed: E3 to E24 deviate from
 * the rounded geometric series (E24 has 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7 and 8.2 where rounding
 * 10^(i/24) gives 2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6 and 8.3), and E192 has 9.20 where rounding
 * gives 9.19. Tables from IEC 60063:2015, written from memory and cross-checked in the tests.
 */
public enum ESeries {
  E3(100, 220, 470),
  E6(100, 150, 220, 330, 470, 680),
  E12(100, 120, 150, 180, 220, 270, 330, 390, 470, 560, 680, 820),
  E24(
      100, 110, 120, 130, 150, 160, 180, 200, 220, 240, 270, 300, 330, 360, 390, 430, 470, 510, 560,
      620, 680, 750, 820, 910),
  E48(
      100, 105, 110, 115, 121, 127, 133, 140, 147, 154, 162, 169, 178, 187, 196, 205, 215, 226, 237,
      249, 261, 274, 287, 301, 316, 332, 348, 365, 383, 402, 422, 442, 464, 487, 511, 536, 562, 590,
      619, 649, 681, 715, 750, 787, 825, 866, 909, 953),
  E96(
      100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150, 154,
      158, 162, 165, 169, 174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243,
      249, 255, 261, 267, 274, 280, 287, 294, 301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383,
      392, 402, 412, 422, 432, 442, 453, 464, 475, 487, 499, 511, 523, 536, 549, 562, 576, 590, 604,
      619, 634, 649, 665, 681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887, 909, 931, 953,
      976),
  E192(
      100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120, 121, 123, 124,
      126, 127, 129, 130, 132, 133, 135, 137, 138, 140, 142, 143, 145, 147, 149, 150, 152, 154, 156,
      158, 160, 162, 164, 165, 167, 169, 172, 174, 176, 178, 180, 182, 184, 187, 189, 191, 193, 196,
      198, 200, 203, 205, 208, 210, 213, 215, 218, 221, 223, 226, 229, 232, 234, 237, 240, 243, 246,
      249, 252, 255, 258, 261, 264, 267, 271, 274, 277, 280, 284, 287, 291, 294, 298, 301, 305, 309,
      312, 316, 320, 324, 328, 332, 336, 340, 344, 348, 352, 357, 361, 365, 370, 374, 379, 383, 388,
      392, 397, 402, 407, 412, 417, 422, 427, 432, 437, 442, 448, 453, 459, 464, 470, 475, 481, 487,
      493, 499, 505, 511, 517, 523, 530, 536, 542, 549, 556, 562, 569, 576, 583, 590, 597, 604, 612,
      619, 626, 634, 642, 649, 657, 665, 673, 681, 690, 698, 706, 715, 723, 732, 741, 750, 759, 768,
      777, 787, 796, 806, 816, 825, 835, 845, 856, 866, 876, 887, 898, 909, 920, 931, 942, 953, 965,
      976, 988);

  /** Relative difference within which a value counts as equal to a preferred value. */
  static final double MATCH = 1e-9;

  // Hundredths of the decade mantissa: 470 is 4.70. Integers keep 4.7 × 10^3 exact.
  private final int[] hundredths;

  ESeries(int... hundredths) {
    this.hundredths = hundredths;
  }

  /** The preferred values on either side of a value: {@code below < value < above}. */
  public record Neighbours(double below, double above) {}

  /** Returns the number of values per decade (24 for E24). */
  public int count() {
    return hundredths.length;
  }

  /** Returns the values of the decade from 1 (inclusive) to 10 (exclusive), ascending. */
  public List<Double> decade() {
    List<Double> values = new ArrayList<>(hundredths.length);
    for (int h : hundredths) {
      values.add(Decimals.times10(h, -2));
    }
    return List.copyOf(values);
  }

  /**
   * Returns the preferred value nearest to {@code value} in the logarithmic sense: the one with the
   * smallest ratio max(a/b, b/a), which is how tolerances spread. Any decade; 9.6 in E12 gives 10.
   * Exactly halfway (in log) goes to the larger value.
   *
   * @throws IllegalArgumentException if {@code value} is not a positive finite number
   */
  public double nearest(double value) {
    requirePositive(value);
    double best = Double.NaN;
    double bestDistance = Double.POSITIVE_INFINITY;
    for (double candidate : around(value)) {
      double distance = Math.abs(Math.log(candidate / value));
      if (distance <= bestDistance) {
        best = candidate;
        bestDistance = distance;
      }
    }
    return best;
  }

  /**
   * Returns whether {@code value} is a value of this series in some decade, within a relative 1e-9
   * (so that 4.7e3 computed with rounding error still counts). Zero, negatives and non-finite
   * values are not preferred.
   */
  public boolean isPreferred(double value) {
    if (!(value > 0) || Double.isInfinite(value)) {
      return false;
    }
    return Math.abs(nearest(value) / value - 1) <= MATCH;
  }

  /**
   * Returns the preferred values just below and just above {@code value}; a preferred value itself
   * is skipped (within a relative 1e-9), so 4.7k in E12 gives 3.9k and 5.6k.
   *
   * @throws IllegalArgumentException if {@code value} is not a positive finite number
   */
  public Neighbours neighbours(double value) {
    requirePositive(value);
    double below = Double.NaN;
    double above = Double.NaN;
    for (double candidate : around(value)) {
      if (candidate < value * (1 - MATCH)) {
        below = candidate;
      } else if (candidate > value * (1 + MATCH) && Double.isNaN(above)) {
        above = candidate;
      }
    }
    return new Neighbours(below, above);
  }

  /**
   * Returns the series named by {@code name}, e.g. {@code "E24"} (case and blanks ignored).
   *
   * @throws InvalidInputException naming the text and the series expected
   */
  public static ESeries parse(String name) {
    String cleaned = name == null ? "" : name.strip().toUpperCase(Locale.ROOT);
    for (ESeries series : values()) {
      if (series.name().equals(cleaned)) {
        return series;
      }
    }
    throw new InvalidInputException(
        "series \""
            + (name == null ? "" : name)
            + "\" is not an E-series; expected one of "
            + Arrays.toString(values()).replace("[", "").replace("]", ""));
  }

  /** Returns the preferred values of the decade of {@code value} and of the decades either side. */
  private List<Double> around(double value) {
    int decade = (int) Math.floor(Math.log10(value));
    List<Double> values = new ArrayList<>(3 * hundredths.length);
    for (int d = decade - 1; d <= decade + 1; d++) {
      for (int h : hundredths) {
        values.add(Decimals.times10(h, d - 2));
      }
    }
    return values;
  }

  private static void requirePositive(double value) {
    if (!(value > 0) || Double.isInfinite(value)) {
      throw new IllegalArgumentException(
          "a preferred value needs a positive finite number, not " + value);
    }
  }
}

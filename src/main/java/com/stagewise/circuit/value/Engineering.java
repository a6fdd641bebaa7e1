package com.stagewise.circuit.value;

import com.stagewise.circuit.MeterSpec;
import java.math.BigDecimal;
import java.math.RoundingMode;

/**
 * Prints volts (and other quantities) for people: engineering units (µ, m, none, k), one real minus
 * sign (U+2212), a no-break space (U+00A0) between the number and the unit, so that a line never
 * breaks between them, and no minus on a value that rounds to zero.
 *
 * <p>Two kinds of numbers:
 *
 * <ul>
 *   <li>{@link #reading(double, MeterSpec)}: what a meter shows, with the digits of the range the
 *       autoranging meter picks (6000 counts: {@code −1.8 mV}, {@code 2.498 V}, {@code 11.90 V},
 *       {@code 230.5 V}), trailing zeros kept, because they are digits the meter gave;
 *   <li>{@link #volts(double)}: a computed value (an expectation, a band edge, a prediction), to
 *       the same resolution as a 6000-count meter would show it, but at least three significant
 *       digits down to microvolts, trailing zeros dropped ({@code −4.7 V}, {@code 2.498 V}, {@code
 *       20 µV}).
 * </ul>
 *
 * <p>Text here is for screens and reports; files keep plain numbers.
 */
public final class Engineering {
  /** The minus sign used in every printed number (U+2212 MINUS SIGN). */
  public static final char MINUS = '\u2212';

  /** The space between a number and its unit (U+00A0 NO-BREAK SPACE). */
  public static final char SPACE = '\u00a0';

  /** Plus-minus sign (U+00B1). */
  public static final char PLUS_MINUS = '\u00b1';

  /** Significant digits that a computed value keeps at least. */
  private static final int MIN_SIGNIFICANT = 3;

  private Engineering() {}

  /**
   * Returns a reading of {@code volts} as an autoranging meter of the given spec shows it: the
   * smallest range that holds the value, rounded to that range's resolution, with the range's
   * digits (trailing zeros kept). The lowest range (below one tenth of the display's counts times 1
   * mV) shows millivolts: 6000 counts give {@code 0.0 mV} … {@code 599.9 mV}, {@code 0.600 V} …
   * {@code 5.999 V}, {@code 6.00 V} … {@code 59.99 V}, {@code 60.0 V} and above.
   *
   * @throws IllegalArgumentException if {@code volts} is NaN or infinite
   */
  public static String reading(double volts, MeterSpec meter) {
    requireFinite(volts);
    int stepExponent = (int) Math.round(Math.log10(meter.resolution(volts)));
    BigDecimal rounded =
        BigDecimal.valueOf(Math.abs(volts)).setScale(-stepExponent, RoundingMode.HALF_UP);
    // The first range shows millivolts, as a meter's display does (599.9 mV rather than 0.5999 V).
    boolean millivolts = stepExponent < -3 && rounded.compareTo(BigDecimal.ONE) < 0;
    BigDecimal shown = millivolts ? rounded.movePointRight(3) : rounded;
    String unit = millivolts ? "mV" : "V";
    return sign(volts, shown) + shown.toPlainString() + SPACE + unit;
  }

  /**
   * Returns a computed voltage in engineering units: to the resolution a 6000-count meter shows at
   * that size, but at least three significant digits (so that microvolts stay visible), trailing
   * zeros dropped: {@code −4.7 V}, {@code 2.498 V}, {@code 11.9 V}, {@code −1.8 mV}, {@code 20 µV},
   * {@code 0 V}.
   *
   * @throws IllegalArgumentException if {@code volts} is NaN or infinite
   */
  public static String volts(double volts) {
    requireFinite(volts);
    double size = Math.abs(volts);
    if (size == 0) {
      return "0" + SPACE + "V";
    }
    int meterStep = (int) Math.round(Math.log10(MeterSpec.DEFAULT.resolution(volts)));
    int threeDigits = Decimals.leadingExponent(BigDecimal.valueOf(size)) - (MIN_SIGNIFICANT - 1);
    // Below 10 nV nothing on a bench resolves a voltage: the floor of the printed steps.
    int stepExponent = Math.max(Math.min(meterStep, threeDigits), -8);
    BigDecimal rounded = BigDecimal.valueOf(size).setScale(-stepExponent, RoundingMode.HALF_UP);
    return quantity(volts < 0 ? rounded.negate() : rounded, "V");
  }

  /**
   * Returns a quantity with an engineering prefix, rounded to {@code significantDigits}, trailing
   * zeros dropped: {@code (0.0047, "F", 3)} gives {@code 4.7 mF}, {@code (-230.46, "V", 4)} gives
   * {@code −230.5 V}.
   *
   * @throws IllegalArgumentException if {@code value} is NaN or infinite, or the digits are not
   *     between 1 and 15
   */
  public static String of(double value, String unit, int significantDigits) {
    requireFinite(value);
    if (significantDigits < 1 || significantDigits > 15) {
      throw new IllegalArgumentException(
          "significant digits (" + significantDigits + ") must be between 1 and 15");
    }
    if (value == 0) {
      return "0" + SPACE + unit;
    }
    BigDecimal rounded = Decimals.round(Math.abs(value), significantDigits);
    return quantity(value < 0 ? rounded.negate() : rounded, unit);
  }

  /**
   * Returns a range of computed volts: {@code ±5 mV} when it is centred on zero, else {@code 2.495
   * V to 2.505 V} (each end as {@link #volts(double)} prints it).
   *
   * @throws IllegalArgumentException if an end is NaN or infinite
   */
  public static String band(double low, double high) {
    String lowText = volts(low);
    String highText = volts(high);
    if (low < 0 && high > 0 && lowText.equals(MINUS + highText)) {
      return PLUS_MINUS + highText;
    }
    return lowText + " to " + highText;
  }

  /** Returns {@code value} with a prefix chosen for its size; {@code value} is already rounded. */
  private static String quantity(BigDecimal value, String unit) {
    BigDecimal size = value.abs();
    if (size.signum() == 0) {
      return "0" + SPACE + unit;
    }
    int exponent = Math.floorDiv(Decimals.leadingExponent(size), 3) * 3;
    exponent = Math.max(Prefix.smallestExponent(), Math.min(Prefix.largestExponent(), exponent));
    String mantissa = size.movePointLeft(exponent).stripTrailingZeros().toPlainString();
    String prefix = Prefix.ofExponent(exponent).symbol();
    return (value.signum() < 0 ? String.valueOf(MINUS) : "") + mantissa + SPACE + prefix + unit;
  }

  private static String sign(double value, BigDecimal shownSize) {
    return value < 0 && shownSize.signum() != 0 ? String.valueOf(MINUS) : "";
  }

  private static void requireFinite(double value) {
    if (!Double.isFinite(value)) {
      throw new IllegalArgumentException("cannot print a value that is not finite: " + value);
    }
  }
}

package com.stagewise.circuit.value;

import com.stagewise.circuit.InvalidInputException;
import java.math.BigDecimal;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads and prints part values with SI prefixes and the RKM code of IEC 60062.
 *
 * <p>Accepted text (surrounding blanks ignored):
 *
 * <ul>
 *   <li>a plain number: {@code 1000}, {@code 1e3}, {@code -2.5}, {@code .5}, {@code 0.01};
 *   <li>a number and an SI prefix, optionally after a space: {@code 10k}, {@code 1.5M}, {@code
 *       100n}, {@code 22p}, {@code 4.7u}, {@code 4.7 µ}; prefixes f p n u/µ m k/K M G T, where
 *       {@code m} is milli and {@code M} mega;
 *   <li>the RKM code: {@code 4k7}, {@code 4K7}, {@code 4R7}, {@code R47}, {@code 470R}, {@code 0R},
 *       {@code 2u2}, {@code 1M5}, {@code 6n8}, {@code p47} (see {@link RkmCode});
 *   <li>either of these followed by a unit: Ω (or the ohm sign U+2126), {@code ohm}, {@code ohms},
 *       {@code F}, {@code V}, {@code A}, {@code Hz}, as in {@code 10kΩ}, {@code 100nF}, {@code 4k7
 *       ohm}; or a bare {@code R} after a number without prefix ({@code 4.7R}, {@code 470R}).
 * </ul>
 *
 * <p>The unit is accepted and not checked against the field. A decimal comma is refused with a
 * hint, whatever the machine's locale: the files are shared between countries.
 */
public final class SiValue {
  /** The unit words accepted after a value, as a regular expression. */
  static final String UNITS = "\u03a9|\u2126|(?i:ohms?)|F|V|A|(?i:hz)";

  /** Significant digits that {@link #format(double, String)} prints at most. */
  public static final int DEFAULT_DIGITS = 4;

  private static final String EXAMPLES = "(examples: 4k7, 470R, 100n, 2u2)";

  private static final Pattern NUMBER =
      Pattern.compile(
          "([+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?)"
              + "(?:\\s*(?:(["
              + Prefix.LETTERS
              + "])?\\s*("
              + UNITS
              + ")?|R))?");

  private SiValue() {}

  /**
   * Returns the value of {@code text} in SI units (ohms, farads, volts, hertz): {@code "4k7"} gives
   * 4700.0, {@code "100nF"} gives 1.0e-7.
   *
   * <p>The result is the double nearest to the decimal value written, so {@code "4k7"}, {@code
   * "4.7k"} and {@code "4700"} give the same double.
   *
   * @throws InvalidInputException if {@code text} is null, empty, not a value in one of the forms
   *     above, or too large or too small for a double (the message quotes the text)
   */
  public static double parse(String text) {
    if (text == null) {
      throw new InvalidInputException(
          "value is missing; expected a number with an SI prefix or RKM code " + EXAMPLES);
    }
    String cleaned = clean(text);
    if (cleaned.isEmpty()) {
      throw new InvalidInputException(
          "value \""
              + text
              + "\" is empty; expected a number with an SI prefix or RKM code "
              + EXAMPLES);
    }
    // Plain tests rather than Optional.or and orElseThrow: a command-line run parses every part
    // value once, in a fresh JVM, where each lambda costs a spun class.
    Optional<BigDecimal> number = readNumber(cleaned);
    if (number.isEmpty()) {
      number = RkmCode.parse(cleaned);
    }
    if (number.isEmpty()) {
      throw notAValue(text, cleaned);
    }
    BigDecimal exact = number.get();
    double value = exact.doubleValue();
    if (Double.isInfinite(value)) {
      throw new InvalidInputException(
          "value \"" + text + "\" is too large; expected a finite number " + EXAMPLES);
    }
    if (value == 0 && exact.signum() != 0) {
      throw new InvalidInputException(
          "value \"" + text + "\" is too small to be stored; expected a part value " + EXAMPLES);
    }
    return value;
  }

  /**
   * Returns {@code value} in engineering notation with an SI prefix and the unit, rounded to four
   * significant digits with trailing zeros dropped: {@code format(4700, "Ω")} gives {@code "4.7
   * kΩ"}, {@code format(1e-7, "F")} gives {@code "100 nF"}, {@code format(0, "V")} gives {@code "0
   * V"}.
   *
   * <p>The text reads back with {@link #parse(String)} when the unit is one it accepts (or empty).
   * Values beyond the prefixes print with femto or tera ({@code "0.001 fF"}, {@code "1000 TΩ"}).
   *
   * @param unit the unit symbol to append, e.g. "Ω", "F", "V", "Hz"; empty or null for none
   * @throws IllegalArgumentException if {@code value} is NaN or infinite
   */
  public static String format(double value, String unit) {
    return format(value, unit, DEFAULT_DIGITS);
  }

  /**
   * Returns {@code value} like {@link #format(double, String)}, rounded half up to at most {@code
   * significantDigits} significant digits.
   *
   * @throws IllegalArgumentException if {@code value} is not finite or {@code significantDigits} is
   *     not between 1 and 15
   */
  public static String format(double value, String unit, int significantDigits) {
    if (!Double.isFinite(value)) {
      throw new IllegalArgumentException("cannot print a value that is not finite: " + value);
    }
    if (significantDigits < 1 || significantDigits > 15) {
      throw new IllegalArgumentException(
          "significant digits (" + significantDigits + ") must be between 1 and 15");
    }
    String unitText = unit == null ? "" : unit;
    if (value == 0) {
      return unitText.isEmpty() ? "0" : "0 " + unitText;
    }
    // Round first, then pick the prefix, so that 999.96 prints as 1 k and not as 1000.
    BigDecimal rounded = Decimals.round(Math.abs(value), significantDigits);
    int exponent = Math.floorDiv(Decimals.leadingExponent(rounded), 3) * 3;
    exponent = Math.max(Prefix.smallestExponent(), Math.min(Prefix.largestExponent(), exponent));
    String mantissa = rounded.movePointLeft(exponent).stripTrailingZeros().toPlainString();
    String suffix = Prefix.ofExponent(exponent).symbol() + unitText;
    String sign = value < 0 ? "-" : "";
    return suffix.isEmpty() ? sign + mantissa : sign + mantissa + " " + suffix;
  }

  /**
   * Returns the RKM code of a resistance per IEC 60062, rounded to four significant digits: capital
   * K, M, G, T for the powers of a thousand and R for the ohm decimal point, at least two digits
   * ({@code 4K7}, {@code 470R}, {@code 1K0}, {@code 10K}, {@code R47}, {@code 0R}).
   *
   * @throws IllegalArgumentException if {@code ohms} is negative, NaN or infinite
   */
  public static String rkm(double ohms) {
    return RkmCode.ohms(ohms);
  }

  /**
   * Returns the RKM code of a capacitance, rounded to four significant digits: p, n, u, m and F as
   * the decimal point, at least two digits ({@code 2u2}, {@code 100n}, {@code 6n8}, {@code 1n0},
   * {@code p47}). The ASCII {@code u} stands for micro, as on most parts lists.
   *
   * @throws IllegalArgumentException if {@code farads} is negative, NaN or infinite
   */
  public static String rkmFarads(double farads) {
    return RkmCode.farads(farads);
  }

  private static String clean(String text) {
    // Unicode minus and the no-break spaces that word processors put between number and unit.
    return text.replace('\u2212', '-').replace('\u00a0', ' ').replace('\u202f', ' ').strip();
  }

  private static Optional<BigDecimal> readNumber(String text) {
    Matcher m = NUMBER.matcher(text);
    if (!m.matches()) {
      return Optional.empty();
    }
    int exponent =
        m.group(2) == null ? 0 : Prefix.ofLetter(m.group(2).charAt(0)).orElseThrow().exponent();
    try {
      return Optional.of(new BigDecimal(m.group(1)).scaleByPowerOfTen(exponent));
    } catch (NumberFormatException | ArithmeticException e) {
      return Optional.empty(); // an exponent beyond the int range: no part value
    }
  }

  private static InvalidInputException notAValue(String text, String cleaned) {
    if (cleaned.matches("[+-]?\\d*,\\d+.*")) {
      return new InvalidInputException(
          "value \""
              + text
              + "\" has a decimal comma; write a decimal point (4.7k) or the RKM"
              + " code (4k7)");
    }
    return new InvalidInputException(
        "value \"" + text + "\" is not a number with an SI prefix or RKM code " + EXAMPLES);
  }
}

package com.stagewise.circuit.value;

import com.stagewise.circuit.InvalidInputException;
import java.math.BigDecimal;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads and prints tolerances as fractions: {@code "1%"}, {@code "0.5 %"}, {@code "±5%"} and {@code
 * "0.01"} all read as fractions (0.01, 0.005, 0.05, 0.01).
 *
 * <p>A tolerance is a half-width relative to the nominal value, between 0 (inclusive) and 1
 * (exclusive): a part cannot be allowed to reach zero or twice its value.
 */
public final class Tolerance {
  private static final Pattern TEXT =
      Pattern.compile("(?:\u00b1|\\+/-|\\+-)?\\s*([+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+))\\s*(%)?");

  private Tolerance() {}

  /**
   * Returns the tolerance written in {@code text} as a fraction: a number followed by {@code %} is
   * a percentage, a bare number is already a fraction. A leading {@code ±} or {@code +/-} is
   * allowed.
   *
   * @throws InvalidInputException if {@code text} is null, empty, not a number or percentage, or
   *     the fraction is not at least 0 and below 1 (the message quotes the text)
   */
  public static double parse(String text) {
    if (text == null || text.isBlank()) {
      throw new InvalidInputException(
          "tolerance \""
              + (text == null ? "" : text)
              + "\" is empty; expected a percentage such"
              + " as 1% or a fraction such as 0.01");
    }
    Matcher m = TEXT.matcher(text.replace('\u2212', '-').replace('\u00a0', ' ').strip());
    if (!m.matches()) {
      throw new InvalidInputException(
          "tolerance \"" + text + "\" is not a percentage such as 1% or a fraction such as 0.01");
    }
    boolean percent = m.group(2) != null;
    BigDecimal number = new BigDecimal(m.group(1));
    // Exact decimal arithmetic, so that "0.1%" is the same double as 0.001.
    double fraction = (percent ? number.movePointLeft(2) : number).doubleValue();
    if (!(fraction >= 0 && fraction < 1)) {
      String hint = !percent && fraction >= 1 ? "; write " + m.group(1) + "% for a percentage" : "";
      throw new InvalidInputException(
          "tolerance \""
              + text
              + "\" ("
              + fraction
              + ") must be at least 0 and below 1 (100 %)"
              + hint);
    }
    return fraction;
  }

  /**
   * Returns {@code fraction} unchanged if it is a valid tolerance (at least 0 and below 1).
   *
   * @param role what the number is, for the message (e.g. "tolerance of R2")
   * @throws InvalidInputException naming the role and the value otherwise (also for NaN)
   */
  public static double check(double fraction, String role) {
    if (!(fraction >= 0 && fraction < 1)) {
      throw new InvalidInputException(role + " (" + fraction + ") must be at least 0 and below 1");
    }
    return fraction;
  }

  /**
   * Returns {@code fraction} as a percentage with up to four significant digits and no trailing
   * zeros: 0.01 gives {@code "1%"}, 0.005 gives {@code "0.5%"}, 0 gives {@code "0%"}.
   *
   * @throws IllegalArgumentException if {@code fraction} is not finite
   */
  public static String format(double fraction) {
    if (!Double.isFinite(fraction)) {
      throw new IllegalArgumentException(
          "cannot print a tolerance that is not finite: " + fraction);
    }
    if (fraction == 0) {
      return "0%";
    }
    return Decimals.round(fraction, 4).movePointRight(2).stripTrailingZeros().toPlainString() + "%";
  }
}

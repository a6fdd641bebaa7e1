package com.stagewise.interchange;

import java.math.BigDecimal;
import java.util.OptionalDouble;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads and prints component values with SI prefixes and RKM code ({@code 10k}, {@code 4k7},
 * {@code 470R}, {@code 0R}, {@code 100n}, {@code 2u2}, {@code 1.5M}, {@code 22p}) and tolerances
 * ({@code "1%"} or {@code 0.01}).
 *
 * <p>Decimal arithmetic keeps the round trip exact: printing a value and reading it back gives the
 * same double. Nothing here depends on the machine's locale.
 */
final class ValueText {
  private ValueText() {}

  /** RKM code: the prefix letter (or R for ×1) stands for the decimal point (IEC 60062). */
  private static final Pattern RKM = Pattern.compile("([0-9]+)([pnuµmkKMGR])([0-9]*)");

  private static final Pattern PLAIN =
      Pattern.compile("([+-]?(?:[0-9]+\\.?[0-9]*|\\.[0-9]+)(?:[eE][+-]?[0-9]+)?)([pnuµmkKMG]?)");

  private static final Pattern NUMBER = Pattern.compile("[+-]?(?:[0-9]+\\.?[0-9]*|\\.[0-9]+)(?:[eE][+-]?[0-9]+)?");

  // Index 4 (no prefix) is a placeholder.
  private static final String PREFIXES = "pnum kMG";

  /**
   * Returns the value of a string such as {@code 4k7}, {@code 100n} or {@code -15}, or empty when
   * it is not a value. A unit symbol after the value ({@code Ω}, {@code ohm}, {@code F}, {@code V},
   * {@code Hz}) is allowed and ignored.
   */
  static OptionalDouble parse(String text) {
    String s = stripUnit(text.strip());
    Matcher rkm = RKM.matcher(s);
    if (rkm.matches()) {
      String digits = rkm.group(1) + "." + (rkm.group(3).isEmpty() ? "0" : rkm.group(3));
      return OptionalDouble.of(new BigDecimal(digits).scaleByPowerOfTen(exponent(rkm.group(2))).doubleValue());
    }
    Matcher plain = PLAIN.matcher(s);
    if (plain.matches()) {
      String prefix = plain.group(2);
      int exponent = prefix.isEmpty() ? 0 : exponent(prefix);
      double value = new BigDecimal(plain.group(1)).scaleByPowerOfTen(exponent).doubleValue();
      return Double.isFinite(value) ? OptionalDouble.of(value) : OptionalDouble.empty();
    }
    return OptionalDouble.empty();
  }

  /**
   * Returns a tolerance as a fraction from {@code "1%"} (a percentage) or {@code "0.01"} (a
   * fraction), or empty when the text is neither.
   */
  static OptionalDouble parseTolerance(String text) {
    String s = text.strip();
    boolean percent = s.endsWith("%");
    if (percent) {
      s = s.substring(0, s.length() - 1).strip();
    }
    if (!NUMBER.matcher(s).matches()) {
      return OptionalDouble.empty();
    }
    BigDecimal number = new BigDecimal(s);
    return OptionalDouble.of((percent ? number.scaleByPowerOfTen(-2) : number).doubleValue());
  }

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
    if (decade < 3 && exact.scaleByPowerOfTen(-3 * decade).compareTo(BigDecimal.valueOf(1000)) >= 0) {
      decade++;
    }
    if (decade > -4 && exact.scaleByPowerOfTen(-3 * decade).compareTo(BigDecimal.ONE) < 0 && !(ohms && decade == 0)) {
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
    return BigDecimal.valueOf(fraction).scaleByPowerOfTen(2).stripTrailingZeros().toPlainString() + "%";
  }

  private static int exponent(String prefix) {
    return switch (prefix) {
      case "p" -> -12;
      case "n" -> -9;
      case "u", "µ" -> -6;
      case "m" -> -3;
      case "R" -> 0;
      case "k", "K" -> 3;
      case "M" -> 6;
      case "G" -> 9;
      default -> throw new IllegalArgumentException("prefix " + prefix);
    };
  }

  private static String stripUnit(String s) {
    for (String unit : new String[] {"ohms", "ohm", "Ω", "Hz", "F", "V"}) {
      if (s.endsWith(unit) && s.length() > unit.length()) {
        return s.substring(0, s.length() - unit.length()).strip();
      }
    }
    return s;
  }
}

package com.stagewise.circuit.value;

import com.stagewise.circuit.InvalidInputException;
import java.math.BigDecimal;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A zener diode's voltage as it is marked on the part and in parts lists: a V in place of the
 * decimal point ({@code 5V1} = 5.1 V, {@code 3V3} = 3.3 V), or a V after the number ({@code 12V},
 * {@code 3.3V}), or a plain number of volts ({@code 5.1}). Common practice on zener bodies and
 * parts lists, like the RKM code of IEC 60062 for resistors.
 */
public final class ZenerMarking {
  /** The largest zener voltage accepted: small zeners are made up to about 200 V (from memory). */
  public static final double MAX_VOLTS = 400;

  private static final Pattern MARKING =
      Pattern.compile("(\\d+)\\s*[Vv]\\s*(\\d*)|(\\d+(?:\\.\\d+)?|\\.\\d+)\\s*[Vv]?");

  private ZenerMarking() {}

  /**
   * Returns the volts of a zener marking.
   *
   * @throws InvalidInputException if the text is not a marking, or the voltage is 0 or above {@link
   *     #MAX_VOLTS}; the message quotes the text and gives examples
   */
  public static double parse(String text) {
    String t = text == null ? "" : text.trim();
    Matcher m = MARKING.matcher(t);
    if (!m.matches()) {
      throw new InvalidInputException(
          "",
          "value",
          "\""
              + t
              + "\" is not a zener voltage (expected a marking such as 5V1, 12V or 3.3V, or a number of volts)");
    }
    BigDecimal volts =
        m.group(1) != null
            ? new BigDecimal(m.group(1) + (m.group(2).isEmpty() ? "" : "." + m.group(2)))
            : new BigDecimal(m.group(3));
    double value = volts.doubleValue();
    if (!(value > 0) || value > MAX_VOLTS) {
      throw new InvalidInputException(
          "",
          "value",
          "a zener voltage of "
              + volts.toPlainString()
              + " V is not possible (expected above 0 and at most "
              + (int) MAX_VOLTS
              + " V, e.g. 5V1)");
    }
    return value;
  }

  /**
   * Returns the marking of a zener voltage: {@code 5V1}, {@code 12V}, {@code 3V3}; every digit is
   * kept, so that {@link #parse} gives back the same double.
   *
   * @throws IllegalArgumentException if the voltage is not finite or not above 0
   */
  public static String format(double volts) {
    if (!Double.isFinite(volts) || volts <= 0) {
      throw new IllegalArgumentException("zener voltage must be finite and above 0: " + volts);
    }
    String digits = BigDecimal.valueOf(volts).stripTrailingZeros().toPlainString();
    int point = digits.indexOf('.');
    if (point < 0) {
      return digits + "V";
    }
    return digits.substring(0, point) + "V" + digits.substring(point + 1);
  }
}

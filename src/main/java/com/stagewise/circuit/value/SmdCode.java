package com.stagewise.circuit.value;

import com.stagewise.circuit.InvalidInputException;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads and writes the value markings printed on SMD resistors.
 *
 * <ul>
 *   <li>3-digit code: two digits and a power of ten, {@code 472} = 4.7 kΩ, {@code 100} = 10 Ω;
 *   <li>4-digit code: three digits and a power of ten, {@code 4702} = 47 kΩ, {@code 1003} = 100 kΩ;
 *   <li>R as the decimal point, 3 or 4 characters: {@code 4R7} = 4.7 Ω, {@code R47} = 0.47 Ω,
 *       {@code 49R9} = 49.9 Ω;
 *   <li>EIA-96: the index 01 to 96 of the value in the E96 series and a multiplier letter, {@code
 *       01C} = 100 × 100 Ω = 10 kΩ, {@code 68X} = 499 × 0.1 Ω = 49.9 Ω;
 *   <li>{@code 0}, {@code 000} or {@code 0000}: a zero-ohm link (common practice).
 * </ul>
 *
 * <p>A third character R after two digits is the EIA-96 letter for ×0.01 ({@code 10R} = 1.24 Ω), as
 * the EIA-96 table has it; 10 Ω is {@code 100} or {@code 10R0}. The multiplier digits 8 and 9 are
 * refused: no resistor code uses them, and capacitor codes give them other meanings (×0.01 and
 * ×0.1, from memory).
 */
public final class SmdCode {
  /** EIA-96 multiplier letters and their powers of ten; R, S and H are alternative letters. */
  private static final Map<Character, Integer> EIA_LETTERS =
      Map.ofEntries(
          Map.entry('Z', -3),
          Map.entry('Y', -2),
          Map.entry('R', -2),
          Map.entry('X', -1),
          Map.entry('S', -1),
          Map.entry('A', 0),
          Map.entry('B', 1),
          Map.entry('H', 1),
          Map.entry('C', 2),
          Map.entry('D', 3),
          Map.entry('E', 4),
          Map.entry('F', 5));

  /** The letters written when encoding, indexed by power of ten + 3. */
  private static final String EIA_WRITTEN = "ZYXABCDEF";

  private static final int HIGHEST_POWER = 7;

  private static final Pattern DIGITS = Pattern.compile("(\\d{2,3})(\\d)");
  private static final Pattern R_DECIMAL = Pattern.compile("(\\d*)R(\\d*)");
  private static final Pattern EIA96 = Pattern.compile("(\\d{2})([A-Z])");

  private static final String EXPECTED =
      "expected a 3-digit (472), 4-digit (4702), R (4R7, R47) or EIA-96 (01C) code";

  private SmdCode() {}

  /**
   * Returns the resistance in ohms that an SMD marking stands for (case and blanks ignored).
   *
   * @throws InvalidInputException naming the code and the forms expected
   */
  public static double decode(String code) {
    String text = code == null ? "" : code.strip().toUpperCase(Locale.ROOT);
    if (text.matches("0{1,4}")) {
      return 0;
    }
    Matcher eia = EIA96.matcher(text);
    if (eia.matches() && EIA_LETTERS.containsKey(eia.group(2).charAt(0))) {
      int index = Integer.parseInt(eia.group(1));
      if (index < 1 || index > ESeries.E96.count()) {
        throw bad(code, "its EIA-96 index " + eia.group(1) + " is not between 01 and 96");
      }
      double mantissa = ESeries.E96.decade().get(index - 1) * 100;
      return Decimals.times10(Math.round(mantissa), EIA_LETTERS.get(eia.group(2).charAt(0)));
    }
    Matcher digits = DIGITS.matcher(text);
    if (digits.matches()) {
      int power = digits.group(2).charAt(0) - '0';
      if (power > HIGHEST_POWER) {
        throw bad(code, "its multiplier digit " + power + " is not used on resistors");
      }
      return Decimals.times10(Long.parseLong(digits.group(1)), power);
    }
    Matcher decimal = R_DECIMAL.matcher(text);
    if (decimal.matches() && (text.length() == 3 || text.length() == 4)) {
      String whole = decimal.group(1).isEmpty() ? "0" : decimal.group(1);
      String fraction = decimal.group(2).isEmpty() ? "" : "." + decimal.group(2);
      return new BigDecimal(whole + fraction).doubleValue();
    }
    throw bad(code, "it is not one of the SMD resistor codes");
  }

  /**
   * Returns the 3-digit code of a resistance: {@code 472} for 4.7 kΩ, {@code 4R7} for 4.7 Ω, {@code
   * R47} for 0.47 Ω, {@code 000} for 0 Ω.
   *
   * @throws InvalidInputException if the value needs more than two significant digits, is below
   *     0.01 Ω, above 99 × 10^7 Ω, negative or not finite
   */
  public static String encodeThreeDigit(double ohms) {
    return encodeDigits(ohms, 2);
  }

  /**
   * Returns the 4-digit code of a resistance: {@code 4702} for 47 kΩ, {@code 49R9} for 49.9 Ω,
   * {@code R100} for 0.1 Ω, {@code 0000} for 0 Ω.
   *
   * @throws InvalidInputException if the value needs more than three significant digits, is below
   *     0.001 Ω, above 999 × 10^7 Ω, negative or not finite
   */
  public static String encodeFourDigit(double ohms) {
    return encodeDigits(ohms, 3);
  }

  /**
   * Returns the EIA-96 code of an E96 resistance from 0.1 Ω to 97.6 MΩ, with the letters Z Y X A B
   * C D E F: {@code 01C} for 10 kΩ, {@code 68X} for 49.9 Ω.
   *
   * @throws InvalidInputException if the value is not an E96 value in that range (the message names
   *     the nearest E96 value)
   */
  public static String encodeEia96(double ohms) {
    requireResistance(ohms);
    if (ohms == 0 || !ESeries.E96.isPreferred(ohms)) {
      String nearest =
          ohms > 0
              ? "; the nearest E96 value is " + SiValue.format(ESeries.E96.nearest(ohms), "Ω")
              : "";
      throw new InvalidInputException(
          "resistance "
              + SiValue.format(ohms, "Ω", 12)
              + " is not an E96 value, so it has no"
              + " EIA-96 code"
              + nearest);
    }
    BigDecimal value = Decimals.clean(ESeries.E96.nearest(ohms));
    int power = Decimals.leadingExponent(value) - 2;
    if (power < -3 || power > 5) {
      throw new InvalidInputException(
          "resistance "
              + SiValue.format(ohms, "Ω")
              + " is outside the EIA-96 range 0.1 Ω to"
              + " 97.6 MΩ");
    }
    int hundreds = value.movePointLeft(power).intValueExact();
    int index = ESeries.E96.decade().indexOf(Decimals.times10(hundreds, -2)) + 1;
    return String.format(Locale.ROOT, "%02d%c", index, EIA_WRITTEN.charAt(power + 3));
  }

  private static String encodeDigits(double ohms, int significant) {
    requireResistance(ohms);
    int length = significant + 1;
    if (ohms == 0) {
      return "0".repeat(length);
    }
    BigDecimal value = Decimals.clean(ohms);
    int lead = Decimals.leadingExponent(value);
    String form = length + "-digit code";
    if (lead < significant - 1) {
      // Below 10 (3-digit) or 100 (4-digit): R as the decimal point, one character for it.
      int scale = significant - 1 - Math.max(lead, -1);
      BigDecimal fixed;
      try {
        fixed = value.setScale(scale, RoundingMode.UNNECESSARY);
      } catch (ArithmeticException e) {
        throw tooManyDigits(ohms, form, significant);
      }
      String text = fixed.toPlainString();
      return (text.startsWith("0.") ? text.substring(1) : text).replace('.', 'R');
    }
    int power = lead - (significant - 1);
    BigDecimal mantissa = value.movePointLeft(power).stripTrailingZeros();
    if (mantissa.scale() > 0) {
      throw tooManyDigits(ohms, form, significant);
    }
    if (power > HIGHEST_POWER) {
      throw new InvalidInputException(
          "resistance " + SiValue.format(ohms, "Ω") + " is too large for the " + form);
    }
    return mantissa.toBigInteger().toString() + power;
  }

  private static void requireResistance(double ohms) {
    if (!(ohms >= 0) || Double.isInfinite(ohms)) {
      throw new InvalidInputException(
          "resistance " + ohms + " Ω has no SMD code; expected a finite value of 0 or more");
    }
  }

  private static InvalidInputException tooManyDigits(double ohms, String form, int significant) {
    return new InvalidInputException(
        "resistance "
            + Decimals.clean(ohms).toPlainString()
            + " Ω needs more than "
            + significant
            + " significant digits (or is too small) for the "
            + form);
  }

  private static InvalidInputException bad(String code, String why) {
    return new InvalidInputException(
        "SMD code \"" + (code == null ? "" : code) + "\" cannot be read: " + why + "; " + EXPECTED);
  }
}

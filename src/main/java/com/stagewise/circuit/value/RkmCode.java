package com.stagewise.circuit.value;

import java.math.BigDecimal;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The RKM code of IEC 60062: a letter in place of the decimal point that also gives the power of
 * ten ({@code 4K7} = 4.7 kΩ, {@code R47} = 0.47 Ω, {@code 2u2} = 2.2 µF, {@code p47} = 0.47 pF).
 *
 * <p>Reading accepts R (or r) for ×1, F for ×1 (farads), and every SI prefix letter of {@link
 * Prefix}. An E as decimal marker ({@code 4E7}) is not accepted: it reads as an exponent.
 */
final class RkmCode {
  /** Significant digits printed; enough for every E192 value. */
  static final int DIGITS = 4;

  private static final Pattern CODE =
      Pattern.compile(
          "([+-]?)(\\d*)([RrF" + Prefix.LETTERS + "])(\\d*)(?:\\s*(" + SiValue.UNITS + "))?");

  private static final Marker[] OHMS = {
    new Marker("R", 0),
    new Marker("K", 3),
    new Marker("M", 6),
    new Marker("G", 9),
    new Marker("T", 12)
  };
  // ASCII u for micro: common practice on parts lists and schematics; IEC 60062 prints µ.
  private static final Marker[] FARADS = {
    new Marker("p", -12),
    new Marker("n", -9),
    new Marker("u", -6),
    new Marker("m", -3),
    new Marker("F", 0)
  };

  private record Marker(String letter, int exponent) {}

  private RkmCode() {}

  /** Returns the exact value of an RKM code, or empty if {@code text} is not one. */
  static Optional<BigDecimal> parse(String text) {
    Matcher m = CODE.matcher(text);
    if (!m.matches() || (m.group(2).isEmpty() && m.group(4).isEmpty())) {
      return Optional.empty();
    }
    char marker = m.group(3).charAt(0);
    boolean plainMarker = marker == 'R' || marker == 'r' || marker == 'F';
    if (plainMarker && m.group(5) != null) {
      return Optional.empty(); // "4R7Ω" would name the unit twice
    }
    int exponent = plainMarker ? 0 : Prefix.ofLetter(marker).orElseThrow().exponent();
    String whole = m.group(2).isEmpty() ? "0" : m.group(2);
    String fraction = m.group(4).isEmpty() ? "" : "." + m.group(4);
    BigDecimal value = new BigDecimal(whole + fraction).scaleByPowerOfTen(exponent);
    return Optional.of(m.group(1).equals("-") ? value.negate() : value);
  }

  /** Returns the resistance code (markers R, K, M, G, T), e.g. 4K7, 470R, R47, 1M0. */
  static String ohms(double ohms) {
    return encode(ohms, OHMS, "resistance");
  }

  /** Returns the capacitance code (markers p, n, u, m, F), e.g. 2u2, 100n, 6n8, p47. */
  static String farads(double farads) {
    return encode(farads, FARADS, "capacitance");
  }

  private static String encode(double value, Marker[] markers, String quantity) {
    if (!Double.isFinite(value) || value < 0) {
      throw new IllegalArgumentException(
          "an RKM code needs a finite, non-negative " + quantity + ", not " + value);
    }
    BigDecimal rounded = Decimals.round(value, DIGITS);
    Marker base = markers[0];
    for (Marker marker : markers) {
      if (marker.exponent() == 0) {
        base = marker;
      }
    }
    if (rounded.signum() == 0) {
      return "0" + base.letter();
    }
    int lead = Decimals.leadingExponent(rounded);
    Marker chosen = markers[0];
    for (Marker marker : markers) {
      if (marker.exponent() <= lead) {
        chosen = marker;
      }
    }
    // Two digits at least, as IEC 60062 writes 1K0 and R10 rather than 1K and R1.
    String text = Decimals.plainWithDigits(rounded.movePointLeft(chosen.exponent()), 2);
    if (text.startsWith("0.")) {
      text = text.substring(1);
    }
    return text.contains(".") ? text.replace(".", chosen.letter()) : text + chosen.letter();
  }
}

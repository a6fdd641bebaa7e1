package com.stagewise.circuit.value;

import com.stagewise.circuit.InvalidInputException;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;
import java.util.function.Predicate;
import java.util.stream.Collectors;

/**
 * Reads and writes resistor colour bands per IEC 60062, in reading order (the tolerance band last,
 * usually set apart):
 *
 * <ul>
 *   <li>3 bands: 2 digits, multiplier; no tolerance band means ±20 %;
 *   <li>4 bands: 2 digits, multiplier, tolerance;
 *   <li>5 bands: 3 digits, multiplier, tolerance;
 *   <li>6 bands: 3 digits, multiplier, tolerance, temperature coefficient.
 * </ul>
 *
 * <p>Writing picks four bands when the value has at most two significant digits and the tolerance
 * is 2 % or wider (the E6 to E24 parts), and five bands otherwise: common practice is that 1 % and
 * tighter resistors carry three digits.
 */
public final class ColourCode {
  private static final Set<Colour> ALL = EnumSet.allOf(Colour.class);
  private static final int LOWEST_MULTIPLIER = -3;
  private static final int HIGHEST_MULTIPLIER = 9;

  private ColourCode() {}

  /**
   * Returns the value, tolerance and temperature coefficient that colour bands stand for. Names are
   * English, case ignored; grey/gray and violet/purple both work; {@code none} is a missing
   * tolerance band.
   *
   * @throws InvalidInputException if there are not 3 to 6 bands or a band's colour cannot stand in
   *     its position (the message gives the band's number, counted from 1, and its colour)
   */
  public static BandedValue decode(List<String> bands) {
    if (bands == null || bands.size() < 3 || bands.size() > 6) {
      int count = bands == null ? 0 : bands.size();
      throw new InvalidInputException(
          "a colour code has 3 to 6 bands, but "
              + count
              + " were given"
              + (count == 0 ? "" : " (" + String.join(" ", bands) + ")"));
    }
    List<Colour> colours = new ArrayList<>();
    for (int i = 0; i < bands.size(); i++) {
      String name = bands.get(i) == null ? "" : bands.get(i);
      int position = i + 1;
      colours.add(
          Colour.ofName(name)
              .orElseThrow(() -> bandError(position, name, "is not a band colour", c -> true)));
    }
    int digitCount = colours.size() <= 4 ? 2 : 3;
    long digits = 0;
    for (int i = 0; i < digitCount; i++) {
      Colour band = colours.get(i);
      if (band.digit().isEmpty()) {
        InvalidInputException error =
            bandError(i + 1, bands.get(i), "cannot be a digit", c -> c.digit().isPresent());
        if (i == 0 && band.tolerance().isPresent()) {
          // A tolerance colour first is almost always a resistor read from the wrong end.
          throw new InvalidInputException(
              error.getMessage() + "; a tolerance band comes last: read from the other end");
        }
        throw error;
      }
      digits = digits * 10 + band.digit().getAsInt();
    }
    Colour multiplier = colours.get(digitCount);
    if (multiplier.multiplierExponent().isEmpty()) {
      throw bandError(
          digitCount + 1,
          bands.get(digitCount),
          "cannot be a multiplier",
          c -> c.multiplierExponent().isPresent());
    }
    double tolerance = Colour.NONE.tolerance().getAsDouble();
    if (colours.size() > 3) {
      Colour band = colours.get(digitCount + 1);
      if (band.tolerance().isEmpty()) {
        throw bandError(
            digitCount + 2,
            bands.get(digitCount + 1),
            "cannot be a tolerance",
            c -> c.tolerance().isPresent());
      }
      tolerance = band.tolerance().getAsDouble();
    }
    OptionalInt tempco = OptionalInt.empty();
    if (colours.size() == 6) {
      tempco = colours.get(5).ppmPerKelvin();
      if (tempco.isEmpty()) {
        throw bandError(
            6,
            bands.get(5),
            "cannot be a temperature coefficient",
            c -> c.ppmPerKelvin().isPresent());
      }
    }
    double ohms = Decimals.times10(digits, multiplier.multiplierExponent().getAsInt());
    return new BandedValue(ohms, tolerance, tempco);
  }

  /**
   * Returns what the bands in {@code text} stand for; bands are separated by blanks, commas,
   * hyphens or slashes ({@code "yellow violet red gold"}, {@code "brown-black-black-red-brown"}).
   *
   * @throws InvalidInputException as {@link #decode(List)}
   */
  public static BandedValue decode(String text) {
    String cleaned = text == null ? "" : text.strip();
    return decode(cleaned.isEmpty() ? List.of() : List.of(cleaned.split("[\\s,;/-]+")));
  }

  /**
   * Returns the four or five bands for a resistance and tolerance (see the class comment for the
   * choice): 4700 Ω at 5 % gives yellow violet red gold; 10 kΩ at 1 % gives brown black black red
   * brown.
   *
   * @param ohms the resistance, at most 3 significant digits, from 0.001 Ω (pink) upwards
   * @param tolerance a tolerance that has a colour (0.2, 0.1, 0.05, 0.02, 0.01, 0.005, 0.0025,
   *     0.001, 0.0005, 0.0002, 0.0001)
   * @throws InvalidInputException if the value or tolerance cannot be shown in colours
   */
  public static List<Colour> encode(double ohms, double tolerance) {
    Colour toleranceBand = toleranceColour(tolerance);
    int digitCount = tolerance >= 0.02 && place(ohms, 2).isPresent() ? 2 : 3;
    List<Colour> bands = digitsAndMultiplier(ohms, digitCount);
    bands.add(toleranceBand);
    return List.copyOf(bands);
  }

  /**
   * Returns the six bands for a resistance, tolerance and temperature coefficient: three digits,
   * multiplier, tolerance and temperature coefficient.
   *
   * @param ppmPerKelvin one of 250, 100, 50, 25, 20, 15, 10, 5, 1
   * @throws InvalidInputException if the value, tolerance or coefficient cannot be shown in colours
   */
  public static List<Colour> encode(double ohms, double tolerance, int ppmPerKelvin) {
    Colour toleranceBand = toleranceColour(tolerance);
    Colour tempcoBand =
        ALL.stream()
            .filter(c -> c.ppmPerKelvin().equals(OptionalInt.of(ppmPerKelvin)))
            .findFirst()
            .orElseThrow(
                () ->
                    new InvalidInputException(
                        "temperature coefficient "
                            + ppmPerKelvin
                            + " ppm/K has no colour;"
                            + " expected one of "
                            + tempcoList()));
    List<Colour> bands = digitsAndMultiplier(ohms, 3);
    bands.add(toleranceBand);
    bands.add(tempcoBand);
    return List.copyOf(bands);
  }

  /** A resistance written as {@code mantissa × 10^exponent} with a given number of digits. */
  private record Placement(long mantissa, int exponent) {}

  private static List<Colour> digitsAndMultiplier(double ohms, int digitCount) {
    if (!(ohms > 0) || Double.isInfinite(ohms)) {
      throw new InvalidInputException(
          "resistance " + ohms + " Ω cannot be colour-coded; expected a positive value");
    }
    Placement placement =
        place(ohms, digitCount)
            .orElseThrow(
                () ->
                    new InvalidInputException(
                        "resistance "
                            + Decimals.clean(ohms).toPlainString()
                            + " Ω cannot be"
                            + " colour-coded with "
                            + digitCount
                            + " digits and a multiplier from"
                            + " pink (×0.001) to white (×10^9)"));
    String digits = String.valueOf(placement.mantissa());
    digits = "0".repeat(digitCount - digits.length()) + digits;
    List<Colour> bands = new ArrayList<>();
    for (char c : digits.toCharArray()) {
      bands.add(Colour.values()[c - '0']); // BLACK..WHITE are declared in digit order
    }
    bands.add(
        ALL.stream()
            .filter(c -> c.multiplierExponent().equals(OptionalInt.of(placement.exponent())))
            .findFirst()
            .orElseThrow());
    return bands;
  }

  /** Returns the digits and multiplier for {@code ohms}, using leading zeros only below pink. */
  private static Optional<Placement> place(double ohms, int digitCount) {
    if (!(ohms > 0) || Double.isInfinite(ohms)) {
      return Optional.empty();
    }
    BigDecimal value = Decimals.clean(ohms);
    int exponent = Decimals.leadingExponent(value) - (digitCount - 1);
    exponent = Math.max(exponent, LOWEST_MULTIPLIER);
    if (exponent > HIGHEST_MULTIPLIER) {
      return Optional.empty();
    }
    BigDecimal mantissa = value.movePointLeft(exponent).stripTrailingZeros();
    if (mantissa.scale() > 0 || mantissa.precision() - mantissa.scale() > digitCount) {
      return Optional.empty();
    }
    return Optional.of(new Placement(mantissa.longValueExact(), exponent));
  }

  private static Colour toleranceColour(double tolerance) {
    for (Colour colour : Colour.values()) {
      if (colour.tolerance().isPresent()
          && Math.abs(colour.tolerance().getAsDouble() - tolerance) <= 1e-9 * tolerance) {
        return colour;
      }
    }
    throw new InvalidInputException(
        "tolerance "
            + tolerance
            + " has no colour; expected one of "
            + ALL.stream()
                .filter(c -> c.tolerance().isPresent())
                .map(c -> Tolerance.format(c.tolerance().getAsDouble()))
                .collect(Collectors.joining(", ")));
  }

  private static String tempcoList() {
    return ALL.stream()
            .filter(c -> c.ppmPerKelvin().isPresent())
            .map(c -> String.valueOf(c.ppmPerKelvin().getAsInt()))
            .collect(Collectors.joining(", "))
        + " ppm/K";
  }

  private static InvalidInputException bandError(
      int position, String given, String problem, Predicate<Colour> fits) {
    String expected =
        ALL.stream().filter(fits).map(Colour::displayName).collect(Collectors.joining(", "));
    return new InvalidInputException(
        "band " + position + " (\"" + given + "\") " + problem + "; expected one of " + expected);
  }
}

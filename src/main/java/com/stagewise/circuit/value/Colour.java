package com.stagewise.circuit.value;

import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * The colours of resistor bands with what each means in each position, per IEC 60062:2016 (the
 * tolerances of orange, yellow and grey and the temperature coefficients are from that edition,
 * from memory).
 *
 * <p>{@link #NONE} is the missing tolerance band of a ±20 % resistor.
 */
public enum Colour {
  BLACK(0, 0, null, 250),
  BROWN(1, 1, 0.01, 100),
  RED(2, 2, 0.02, 50),
  ORANGE(3, 3, 0.0005, 15),
  YELLOW(4, 4, 0.0002, 25),
  GREEN(5, 5, 0.005, 20),
  BLUE(6, 6, 0.0025, 10),
  VIOLET(7, 7, 0.001, 5),
  GREY(8, 8, 0.0001, 1),
  WHITE(9, 9, null, null),
  GOLD(null, -1, 0.05, null),
  SILVER(null, -2, 0.10, null),
  PINK(null, -3, null, null),
  NONE(null, null, 0.20, null);

  private final Integer digit;
  private final Integer multiplierExponent;
  private final Double tolerance;
  private final Integer tempco;

  Colour(Integer digit, Integer multiplierExponent, Double tolerance, Integer tempco) {
    this.digit = digit;
    this.multiplierExponent = multiplierExponent;
    this.tolerance = tolerance;
    this.tempco = tempco;
  }

  /** Returns the digit this colour stands for in a digit band (0 to 9), if any. */
  public OptionalInt digit() {
    return digit == null ? OptionalInt.empty() : OptionalInt.of(digit);
  }

  /** Returns the power of ten of the multiplier band (-3 for pink to 9 for white), if any. */
  public OptionalInt multiplierExponent() {
    return multiplierExponent == null ? OptionalInt.empty() : OptionalInt.of(multiplierExponent);
  }

  /** Returns the tolerance as a fraction (0.05 for gold), if this colour has one. */
  public OptionalDouble tolerance() {
    return tolerance == null ? OptionalDouble.empty() : OptionalDouble.of(tolerance);
  }

  /** Returns the temperature coefficient in ppm/K of the sixth band, if this colour has one. */
  public OptionalInt ppmPerKelvin() {
    return tempco == null ? OptionalInt.empty() : OptionalInt.of(tempco);
  }

  /** Returns the English name in lower case, as printed and read ("violet", "grey", "none"). */
  public String displayName() {
    return name().toLowerCase(Locale.ROOT);
  }

  /** Returns the colour an English name stands for (case ignored; gray, purple accepted). */
  static Optional<Colour> ofName(String name) {
    String key = name.strip().toLowerCase(Locale.ROOT);
    switch (key) {
      case "gray":
        return Optional.of(GREY);
      case "purple":
        return Optional.of(VIOLET);
      default:
        for (Colour colour : values()) {
          if (colour.displayName().equals(key)) {
            return Optional.of(colour);
          }
        }
        return Optional.empty();
    }
  }
}

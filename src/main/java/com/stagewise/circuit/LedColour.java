package com.stagewise.circuit;

import java.util.Locale;

/**
 * LED colours with their typical forward voltage at 10 mA. Figures from memory (typical of
 * indicator LEDs: red about 1.8 V … blue and white about 3 V), not from any one part's data sheet.
 */
public enum LedColour {
  RED("red", 1.8),
  ORANGE("orange", 1.9),
  YELLOW("yellow", 2.0),
  GREEN("green", 2.1),
  BLUE("blue", 3.0),
  WHITE("white", 3.0);

  private final String word;
  private final double forwardVolts;

  LedColour(String word, double forwardVolts) {
    this.word = word;
    this.forwardVolts = forwardVolts;
  }

  /** Returns the word used in stage sheets. */
  public String word() {
    return word;
  }

  /** Returns the typical forward voltage at 10 mA (volts, from memory). */
  public double forwardVolts() {
    return forwardVolts;
  }

  /** Returns the colour words, for messages. */
  public static String words() {
    return "red, orange, yellow, green, blue or white";
  }

  /**
   * Returns the colour named by {@code word}, ignoring case.
   *
   * @throws InvalidInputException if the word names no colour
   */
  public static LedColour of(String word) {
    for (LedColour c : values()) {
      if (c.word.equals(word == null ? "" : word.toLowerCase(Locale.ROOT))) {
        return c;
      }
    }
    throw new InvalidInputException(
        "", "colour", "\"" + word + "\" is not an LED colour (expected " + words() + ")");
  }
}

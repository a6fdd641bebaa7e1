package com.stagewise.circuit;

import java.util.Locale;

/** The kinds of two-terminal part a stage sheet may hold. */
public enum PartKind {
  RESISTOR("resistor", "Ω"),
  CAPACITOR("capacitor", "F");

  private final String word;
  private final String unit;

  PartKind(String word, String unit) {
    this.word = word;
    this.unit = unit;
  }

  /** Returns the word used in stage sheets ({@code resistor}, {@code capacitor}). */
  public String word() {
    return word;
  }

  /** Returns the unit symbol of the part's value (Ω or F). */
  public String unit() {
    return unit;
  }

  /**
   * Returns the kind named by {@code word}, ignoring case.
   *
   * @throws InvalidInputException if the word names no kind
   */
  public static PartKind of(String word) {
    for (PartKind kind : values()) {
      if (kind.word.equals(word == null ? "" : word.toLowerCase(Locale.ROOT))) {
        return kind;
      }
    }
    throw new InvalidInputException(
        "", "kind", "\"" + word + "\" is not a part kind (expected resistor or capacitor)");
  }
}

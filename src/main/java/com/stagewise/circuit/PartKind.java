package com.stagewise.circuit;

import java.util.Locale;

/**
 * The kinds of part a stage sheet may hold: resistors and capacitors (stage sheet version 1), and
 * diodes, zener diodes, LEDs, trimmers and potentiometers (version 2).
 */
public enum PartKind {
  RESISTOR("resistor", "Ω", 1),
  CAPACITOR("capacitor", "F", 1),
  DIODE("diode", "", 2),
  ZENER("zener", "V", 2),
  LED("led", "", 2),
  TRIMMER("trimmer", "Ω", 2),
  POTENTIOMETER("potentiometer", "Ω", 2);

  private final String word;
  private final String unit;
  private final int sheetVersion;

  PartKind(String word, String unit, int sheetVersion) {
    this.word = word;
    this.unit = unit;
    this.sheetVersion = sheetVersion;
  }

  /** Returns the word used in stage sheets ({@code resistor}, {@code zener}, …). */
  public String word() {
    return word;
  }

  /** Returns the unit symbol of the part's value (Ω, F, V for a zener; empty for a diode). */
  public String unit() {
    return unit;
  }

  /** Returns the first stage sheet version that knows this kind. */
  public int sheetVersion() {
    return sheetVersion;
  }

  /** Returns whether the part is a pn junction between an anode and a cathode net. */
  public boolean isJunction() {
    return this == DIODE || this == ZENER || this == LED;
  }

  /** Returns whether the part is a three-terminal track with a wiper (trimmer, potentiometer). */
  public boolean isTrimmer() {
    return this == TRIMMER || this == POTENTIOMETER;
  }

  /** Returns whether the part's value is in ohms (resistors, trimmers, potentiometers). */
  public boolean isOhms() {
    return this == RESISTOR || isTrimmer();
  }

  /** Returns the kind words of every kind, for messages. */
  public static String words() {
    StringBuilder text = new StringBuilder();
    PartKind[] all = values();
    for (int i = 0; i < all.length; i++) {
      text.append(i == 0 ? "" : i == all.length - 1 ? " or " : ", ").append(all[i].word);
    }
    return text.toString();
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
        "", "kind", "\"" + word + "\" is not a part kind (expected " + words() + ")");
  }
}

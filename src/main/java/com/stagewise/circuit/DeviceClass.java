package com.stagewise.circuit;

import java.util.Locale;

/**
 * The classes of op-amp Stagewise models, with typical parameters and the ranges a working part may
 * show.
 *
 * <p>The figures are typical values from memory and common practice for each family of parts, not
 * taken from any one data sheet. Headroom is how close the output can swing to the voltage at the
 * section's own supply pin; the limits clamp the internal source behind the output resistance.
 */
public enum DeviceClass {
  /** Bipolar parts of the classic kind: about 1.5 V of headroom at each rail. */
  CLASSIC_BIPOLAR(
      "classic-bipolar",
      // Open-loop gain 2e5 typical, at least 2e4 on a working part (from memory, common practice).
      new Range(2e5, 2e4, 1e6),
      new Range(1.5, 1.0, 2.5),
      new Range(1.5, 1.0, 2.5),
      Range.plusMinus(5e-3),
      // Input bias current up to about 500 nA for the classic family (from memory).
      new Range(0, 0, 500e-9),
      50),
  /** Single-supply parts whose output reaches the negative rail within tens of millivolts. */
  GROUND_SENSING(
      "ground-sensing",
      new Range(1e5, 1e4, 1e6),
      new Range(0.02, 0.0, 0.1),
      new Range(1.5, 1.0, 2.0),
      Range.plusMinus(7e-3),
      // Up to about 250 nA for the common ground-sensing duals and quads (from memory).
      new Range(0, 0, 250e-9),
      50),
  /** Parts whose output swings within tens of millivolts of either rail. */
  RAIL_TO_RAIL(
      "rail-to-rail",
      new Range(1e5, 1e4, 1e6),
      new Range(0.05, 0.01, 0.2),
      new Range(0.05, 0.01, 0.2),
      Range.plusMinus(3e-3),
      // CMOS inputs: picoamps at room temperature; 1 nA covers warm parts (from memory).
      new Range(0, 0, 1e-9),
      50);

  private final String word;
  private final Range openLoopGain;
  private final Range headroomLow;
  private final Range headroomHigh;
  private final Range offset;
  private final Range biasCurrent;
  private final double outputResistance;

  DeviceClass(
      String word,
      Range openLoopGain,
      Range headroomLow,
      Range headroomHigh,
      Range offset,
      Range biasCurrent,
      double outputResistance) {
    this.word = word;
    this.openLoopGain = openLoopGain;
    this.headroomLow = headroomLow;
    this.headroomHigh = headroomHigh;
    this.offset = offset;
    this.biasCurrent = biasCurrent;
    this.outputResistance = outputResistance;
  }

  /** Returns the word used in stage sheets, e.g. {@code classic-bipolar}. */
  public String word() {
    return word;
  }

  /** Returns the open-loop DC gain (volts per volt). */
  public Range openLoopGain() {
    return openLoopGain;
  }

  /** Returns how far above the v- pin voltage the output can go, in volts. */
  public Range headroomLow() {
    return headroomLow;
  }

  /** Returns how far below the v+ pin voltage the output can go, in volts. */
  public Range headroomHigh() {
    return headroomHigh;
  }

  /** Returns the input offset voltage, in volts (nominal 0). */
  public Range offset() {
    return offset;
  }

  /** Returns the input bias current into each input, in amperes (nominal 0). */
  public Range biasCurrent() {
    return biasCurrent;
  }

  /** Returns the output resistance in ohms. */
  public double outputResistance() {
    return outputResistance;
  }

  /**
   * Returns the class named by {@code word}, e.g. {@code rail-to-rail}.
   *
   * @throws InvalidInputException if the word names no class
   */
  public static DeviceClass of(String word) {
    for (DeviceClass type : values()) {
      if (type.word.equals(word == null ? "" : word.toLowerCase(Locale.ROOT))) {
        return type;
      }
    }
    throw new InvalidInputException(
        "",
        "class",
        "\""
            + word
            + "\" is not a device class (expected classic-bipolar, ground-sensing or rail-to-rail)");
  }
}

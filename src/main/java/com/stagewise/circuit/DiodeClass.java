package com.stagewise.circuit;

import java.util.Locale;

/**
 * Diode classes (our names) with their typical junction figures.
 *
 * <p>Typical figures from memory, not from any one part's data sheet: a small-signal silicon diode
 * drops about 0.6–0.7 V at 1 mA, a small Schottky diode about 0.3 V; an LED's colour fixes its
 * forward voltage ({@link LedColour}). Each figure is a named constant with that note.
 */
public enum DiodeClass {
  SILICON("silicon"),
  SCHOTTKY("schottky"),
  LED("led");

  /** Silicon small-signal: Is = 2 nA (from memory, typical of small-signal switching diodes). */
  public static final double SILICON_SATURATION_AMPS = 2e-9;

  /** Silicon small-signal: emission coefficient 1.9 (from memory, typical of the same diodes). */
  public static final double SILICON_EMISSION = 1.9;

  /** Silicon small-signal: series resistance 0.6 Ω (from memory). */
  public static final double SILICON_SERIES_OHMS = 0.6;

  /** Small Schottky: Is = 15 nA (from memory; gives about 0.30 V at 1 mA). */
  public static final double SCHOTTKY_SATURATION_AMPS = 15e-9;

  /** Small Schottky: emission coefficient 1.05 (from memory). */
  public static final double SCHOTTKY_EMISSION = 1.05;

  /** Small Schottky: series resistance 2 Ω (from memory). */
  public static final double SCHOTTKY_SERIES_OHMS = 2;

  /** Indicator LED: emission coefficient 2 (from memory, typical of LED junctions). */
  public static final double LED_EMISSION = 2.0;

  /** Indicator LED: series resistance 5 Ω (from memory). */
  public static final double LED_SERIES_OHMS = 5;

  /** The current at which an LED's forward voltage is quoted: 10 mA (common practice). */
  public static final double LED_RATED_AMPS = 10e-3;

  /**
   * The current at which a small zener's marked voltage holds: 5 mA (from memory: the usual test
   * current of small 0.4–0.5 W zeners up to about 24 V).
   */
  public static final double ZENER_TEST_AMPS = 5e-3;

  /**
   * A small zener's series resistance: 5 Ω (from memory; with the junction's own slope it gives the
   * zener a dynamic resistance of about 15 Ω at its test current).
   */
  public static final double ZENER_SERIES_OHMS = 5;

  private final String word;

  DiodeClass(String word) {
    this.word = word;
  }

  /** Returns the word used in stage sheets. */
  public String word() {
    return word;
  }

  /**
   * Returns the junction figures of this class; an LED's depend on its colour.
   *
   * @param colour the LED's colour (ignored for other classes; required for {@link #LED})
   */
  public JunctionFigures figures(LedColour colour) {
    return switch (this) {
      case SILICON ->
          new JunctionFigures(
              SILICON_SATURATION_AMPS,
              SILICON_EMISSION,
              SILICON_SERIES_OHMS,
              Double.POSITIVE_INFINITY,
              1e-3);
      case SCHOTTKY ->
          new JunctionFigures(
              SCHOTTKY_SATURATION_AMPS,
              SCHOTTKY_EMISSION,
              SCHOTTKY_SERIES_OHMS,
              Double.POSITIVE_INFINITY,
              1e-3);
      case LED ->
          JunctionFigures.forwardAt(
              colour.forwardVolts(), LED_RATED_AMPS, LED_EMISSION, LED_SERIES_OHMS);
    };
  }

  /** Returns the figures of a zener marked {@code volts}: silicon forward, breakdown at volts. */
  public static JunctionFigures zener(double volts) {
    return new JunctionFigures(
            SILICON_SATURATION_AMPS,
            SILICON_EMISSION,
            ZENER_SERIES_OHMS,
            Double.POSITIVE_INFINITY,
            1e-3)
        .withBreakdownAt(volts, ZENER_TEST_AMPS);
  }

  /**
   * Returns the class named by {@code word}, ignoring case.
   *
   * @throws InvalidInputException if the word names no class
   */
  public static DiodeClass of(String word) {
    for (DiodeClass c : values()) {
      if (c.word.equals(word == null ? "" : word.toLowerCase(Locale.ROOT))) {
        return c;
      }
    }
    throw new InvalidInputException(
        "", "class", "\"" + word + "\" is not a diode class (expected silicon or schottky)");
  }
}

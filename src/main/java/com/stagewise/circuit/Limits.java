package com.stagewise.circuit;

import com.stagewise.circuit.value.SiValue;
import java.util.Locale;

/**
 * The plausible range of every physical quantity a stage or a set of readings may hold, and the
 * largest size of every list and name: the one place that says what is absurd.
 *
 * <p>A value outside its range is almost always a typing mistake (a missing prefix, a stray
 * exponent) and, left in, would drive the solver to numbers that mean nothing or are not finite.
 * The ranges are generous bench figures (common practice, not from any one standard): they refuse
 * what no op-amp stage on a service bench holds, not what is merely unusual. The sizes keep every
 * computation bounded: the diagnosis grows with the number of parts, nets and sections, so a sheet
 * beyond them is refused with a message that says what was too large.
 *
 * <p>{@link StageRules} and {@link ReadingRules} apply these limits to what a user gives (a sheet,
 * a template's values, a screen); the records check only what every stage needs (finite numbers,
 * tolerances in range), so that the fault models may still build a drifted part far beyond its
 * plausible range.
 */
public final class Limits {
  private Limits() {}

  /**
   * A closed range of plausible values of one quantity.
   *
   * @param what the quantity in words, e.g. "a rail's voltage"
   * @param unit the unit symbol, e.g. "V" (empty for a plain number)
   * @param min the lowest plausible value
   * @param max the highest plausible value
   */
  public record Span(String what, String unit, double min, double max) {
    /** Returns whether {@code value} is finite and within the range, ends included. */
    public boolean contains(double value) {
      return Double.isFinite(value) && value >= min && value <= max;
    }

    /** Returns the range in words, e.g. {@code -1 kV … 1 kV}. */
    public String text() {
      return shown(min, unit) + " … " + shown(max, unit);
    }

    /**
     * Returns the complaint about a value outside the range, naming the subject, the value and the
     * range: {@code R2's value (1e+200 Ω) is outside the plausible range 1 mΩ … 1 TΩ}.
     */
    public String problem(String subject, double value) {
      return subject
          + " ("
          + shown(value, unit)
          + ") is outside the plausible range "
          + text()
          + " for "
          + what
          + " (check the prefix, the decimal point and the unit)";
    }
  }

  /** A rail's nominal voltage: within ±1 kV (no op-amp stage runs nearer to mains peaks). */
  public static final Span RAIL_VOLTS = new Span("a rail's voltage", "V", -1000, 1000);

  /** A test input's DC level: within ±1 kV, as a rail. */
  public static final Span INPUT_DC_VOLTS = new Span("an input's DC level", "V", -1000, 1000);

  /** A test input's AC amplitude: 0 to 1 kV. */
  public static final Span INPUT_AC_VOLTS = new Span("an input's AC amplitude", "V", 0, 1000);

  /**
   * An AC frequency (of an input or a reading): 0.01 Hz to 100 MHz, from the slowest signal a bench
   * generator makes to well beyond any op-amp stage's bandwidth.
   */
  public static final Span FREQUENCY_HZ = new Span("a frequency", "Hz", 0.01, 1e8);

  /**
   * A resistor: 1 mΩ (a current-sense shunt) to 1 TΩ (an electrometer's feedback resistor). A value
   * of exactly 0 Ω is a link ({@code 0R}) and is allowed beside this range.
   */
  public static final Span RESISTOR_OHMS = new Span("a resistor", "Ω", 1e-3, 1e12);

  /** A capacitor: 0.1 pF (a stray or a trimming capacitor) to 1 F (a super-capacitor). */
  public static final Span CAPACITOR_FARADS = new Span("a capacitor", "F", 1e-13, 1);

  /**
   * A trimmer's or potentiometer's end-to-end value: as a resistor, 1 mΩ to 1 TΩ (its track
   * sections may be smaller at the ends).
   */
  public static final Span TRIMMER_OHMS = new Span("a trimmer's track", "Ω", 1e-3, 1e12);

  /**
   * A zener's marked voltage: 0.5 V to 1 kV (marked zeners run from about 1.8 V to a few hundred
   * volts; the range is wider on purpose, common practice).
   */
  public static final Span ZENER_VOLTS = new Span("a zener's voltage", "V", 0.5, 1000);

  /**
   * Returns the plausible range of a part's value; empty for a kind whose value is not given (a
   * diode or an LED: its class or colour fixes its figures).
   */
  public static java.util.Optional<Span> of(PartKind kind) {
    return switch (kind) {
      case RESISTOR -> java.util.Optional.of(RESISTOR_OHMS);
      case CAPACITOR -> java.util.Optional.of(CAPACITOR_FARADS);
      case TRIMMER, POTENTIOMETER -> java.util.Optional.of(TRIMMER_OHMS);
      case ZENER -> java.util.Optional.of(ZENER_VOLTS);
      case DIODE, LED -> java.util.Optional.empty();
    };
  }

  /** A tolerance as a fraction: 0 up to 0.99 (a marked tolerance of 100 % means nothing). */
  public static final Span TOLERANCE = new Span("a tolerance", "", 0, 0.99);

  /** A meter's percentage of reading: 0 % to 20 % (a handheld's AC range is about 1–3 %). */
  public static final Span METER_PERCENT = new Span("a meter's percent of reading", "%", 0, 20);

  /** A meter's counts of the last digit: 0 to 1000. */
  public static final Span METER_COUNTS = new Span("a meter's counts", "", 0, 1000);

  /**
   * A meter's display counts: 100 (a crude panel meter) to 2,000,000 (beyond a 6½-digit bench
   * meter's 1,200,000).
   */
  public static final Span METER_DISPLAY_COUNTS =
      new Span("a meter's display counts", "", 100, 2_000_000);

  /** A reading's own uncertainty (half-width): above 0, at most 1 kV. */
  public static final Span UNCERTAINTY_VOLTS = new Span("a reading's uncertainty", "V", 1e-9, 1000);

  /**
   * A power-off reading: 0 Ω to 1 TΩ, the span of {@link #RESISTOR_OHMS} (a handheld's top range is
   * tens of MΩ, an insulation tester's reaches into TΩ; common practice). Beyond it a meter shows
   * its over-range, written "OL", which a reading may always be.
   */
  public static final Span READING_OHMS = new Span("an ohms reading", "Ω", 0, 1e12);

  /** An ohms reading's own uncertainty (half-width): above 0, at most 1 TΩ. */
  public static final Span UNCERTAINTY_OHMS =
      new Span("an ohms reading's uncertainty", "Ω", 1e-9, 1e12);

  /**
   * A reading may lie this many times beyond the largest driven voltage of the stage (rail or
   * input) plus {@link #READING_MARGIN_VOLTS}; beyond that it is a typing mistake (a dropped
   * decimal point, a wrong prefix).
   */
  public static final double READING_RAIL_FACTOR = 2;

  /**
   * An AC reading may lie this many times beyond the largest driven voltage plus {@link
   * #READING_MARGIN_VOLTS}: a peak-to-peak reading of an output swinging between a positive and a
   * negative rail spans up to four times the larger rail.
   */
  public static final double READING_AC_FACTOR = 4;

  /** The volts added to the reading limit, so that a stage with small rails still reads noise. */
  public static final double READING_MARGIN_VOLTS = 1;

  /**
   * The most op-amp sections of one stage: three quad packages (the bounded saturation search
   * solves a 12-section chain; see DEVELOPERS.md).
   */
  public static final int MAX_SECTIONS = 12;

  /** The most two-terminal parts of one stage. */
  public static final int MAX_PARTS = 100;

  /** The most rails of one stage. */
  public static final int MAX_RAILS = 8;

  /** The most test inputs of one stage. */
  public static final int MAX_INPUTS = 8;

  /** The most nets of one stage. */
  public static final int MAX_NETS = 100;

  /** The most readings in one set. */
  public static final int MAX_READINGS = 500;

  /** The longest name (a net, a designator, a test point), in characters. */
  public static final int MAX_NAME_LENGTH = 40;

  /** The longest free text of a stage (title, board), in characters. */
  public static final int MAX_TEXT_LENGTH = 200;

  /** The largest stage sheet or readings file, in bytes (a full 100-part sheet is about 15 kB). */
  public static final long MAX_FILE_BYTES = 1 << 20;

  /**
   * Returns the readings limit of a stage in volts: {@link #READING_RAIL_FACTOR} times the largest
   * driven voltage (a rail, or an input's DC level plus its AC amplitude) plus {@link
   * #READING_MARGIN_VOLTS}.
   */
  public static double readingVolts(Stage stage) {
    return READING_RAIL_FACTOR * largestDrivenVolts(stage) + READING_MARGIN_VOLTS;
  }

  /**
   * Returns the AC readings limit of a stage in volts: {@link #READING_AC_FACTOR} times the largest
   * driven voltage plus {@link #READING_MARGIN_VOLTS}.
   */
  public static double acReadingVolts(Stage stage) {
    return READING_AC_FACTOR * largestDrivenVolts(stage) + READING_MARGIN_VOLTS;
  }

  /** Returns the largest magnitude of a rail or an input (DC level plus AC amplitude), in volts. */
  public static double largestDrivenVolts(Stage stage) {
    double largest = 0;
    for (Rail rail : stage.rails()) {
      largest = Math.max(largest, Math.abs(rail.volts()));
    }
    for (TestInput input : stage.inputs()) {
      largest = Math.max(largest, Math.abs(input.dc()) + input.peakAc());
    }
    return largest;
  }

  /** Returns the complaint about a list that is too long, e.g. {@code 120 parts}. */
  public static String tooMany(int found, int max, String things) {
    return found
        + " "
        + things
        + " is more than this program takes for one stage (at most "
        + max
        + "): split the circuit into stages";
  }

  /** Returns whether the text holds an ISO control character (a tab, a line break, NUL, …). */
  static boolean hasControlCharacter(String text) {
    for (int i = 0; i < text.length(); i++) {
      if (Character.isISOControl(text.charAt(i))) {
        return true;
      }
    }
    return false;
  }

  /** Returns the complaint about a name or text that is too long. */
  public static String tooLong(String role, int length, int max) {
    return role + " is " + length + " characters long (expected at most " + max + ")";
  }

  /**
   * Returns a value with its unit for messages: with an SI prefix where one fits ({@code 4.7 kΩ}),
   * else in scientific notation ({@code 1.000e+200 Ω}), never with hundreds of digits; {@code "not
   * a number"} for NaN and infinities.
   */
  public static String shown(double value, String unit) {
    if (!Double.isFinite(value)) {
      return "not a finite number";
    }
    double magnitude = Math.abs(value);
    if (value == 0 || (magnitude >= 1e-15 && magnitude < 1e15)) {
      return SiValue.format(value, unit);
    }
    String number = String.format(Locale.ROOT, "%.3e", value);
    return unit.isEmpty() ? number : number + " " + unit;
  }
}

package com.stagewise.ui.widget;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.value.ESeries;
import com.stagewise.circuit.value.Engineering;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.ZenerMarking;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;

/**
 * The on-screen value pad: digits, a decimal point, SI prefixes and the RKM code ({@code 4k7}),
 * with the value read back as it is typed and, for parts, the nearest preferred value.
 */
public final class ValuePadModel {
  /** Key that deletes the last character. */
  public static final String BACK = "⌫";

  /** Key that clears the entry. */
  public static final String CLEAR = "Clear";

  /** What an AC amplitude is called where the pad refuses a sign for it. */
  public static final String AC_AMPLITUDE = "An AC amplitude (RMS, peak or peak-to-peak)";

  /** Key that changes the sign (volts only, and not while the pad is unsigned). */
  public static final String SIGN = "±";

  /** Key for the ohmmeter's over-range, "OL" (ohms readings only): the value is +∞. */
  public static final String OVER_RANGE = "OL";

  /** What the pad is for: it sets the unit, the prefixes offered and the hint. */
  public enum Quantity {
    // The largest plausible entries: 1000 V is the top range of a usual handheld meter (CAT III
    // 1000 V, common practice); fixed resistors end near 1 GΩ and bench capacitors near 1 F
    // (parts catalogues, from memory); a larger entry is a slipped prefix or decimal point.
    OHMS("Ω", "R", 1e10, "a resistor on a board (up to 10 GΩ)"),
    FARADS("F", "", 1.0, "a capacitor on a board (up to 1 F)"),
    VOLTS("V", "", 1000, "a bench meter reads (up to 1000 V)"),
    // Zener markings: 5V1, 12V, 3.3V (the V stands for the decimal point); small zeners end near
    // 200 V (parts catalogues, from memory), ZenerMarking takes up to 400 V.
    ZENER("V", "V", ZenerMarking.MAX_VOLTS, "a zener's marking (up to 400 V)"),
    // A trimmer's wiper: the share of its travel from end 1, 0 to 1.
    POSITION("", "", 1, "a wiper's travel (0 to 1)"),
    // What an ohmmeter shows with the power off: up to 1 TΩ (the span of a resistor, as the
    // readings contract takes it), or OL, its over-range.
    METER_OHMS("Ω", "R", 1e12, "an ohms reading may be (up to 1 TΩ; tap OL for over-range)");

    private final String unit;
    private final String rkmLetter;
    private final double largest;
    private final String largestWords;

    Quantity(String unit, String rkmLetter, double largest, String largestWords) {
      this.unit = unit;
      this.rkmLetter = rkmLetter;
      this.largest = largest;
      this.largestWords = largestWords;
    }

    /** Returns the unit symbol. */
    public String unit() {
      return unit;
    }

    /** Returns the prefix keys for this quantity, smallest first. */
    public java.util.List<String> prefixKeys() {
      return switch (this) {
        case OHMS, METER_OHMS -> java.util.List.of("R", "k", "M");
        case FARADS -> java.util.List.of("p", "n", "u");
        case VOLTS -> java.util.List.of("u", "m");
        case ZENER -> java.util.List.of("V");
        case POSITION -> java.util.List.of();
      };
    }

    String rkmLetter() {
      return rkmLetter;
    }
  }

  private final StringProperty text = new SimpleStringProperty("");
  private final ObjectProperty<Quantity> quantity = new SimpleObjectProperty<>(Quantity.VOLTS);
  private final ReadOnlyObjectWrapper<Double> value = new ReadOnlyObjectWrapper<>();
  private final ReadOnlyStringWrapper reading = new ReadOnlyStringWrapper("");
  private final ReadOnlyStringWrapper hint = new ReadOnlyStringWrapper("");
  private final ReadOnlyStringWrapper problem = new ReadOnlyStringWrapper("");
  private final StringProperty unsigned = new SimpleStringProperty("");
  private Double refusedNegative;

  /** Creates an empty pad for volts. */
  public ValuePadModel() {
    text.addListener((obs, old, now) -> update());
    quantity.addListener((obs, old, now) -> update());
    unsigned.addListener((obs, old, now) -> update());
  }

  /** Creates an empty pad for a quantity. */
  public ValuePadModel(Quantity quantity) {
    this();
    this.quantity.set(quantity);
  }

  public StringProperty textProperty() {
    return text;
  }

  public ObjectProperty<Quantity> quantityProperty() {
    return quantity;
  }

  /** Returns the value typed, in SI units, or null while the entry is empty or not a value. */
  public ReadOnlyObjectProperty<Double> valueProperty() {
    return value.getReadOnlyProperty();
  }

  /** Returns the value read back with its unit, e.g. "= 4.7 kΩ" (empty when not a value). */
  public ReadOnlyStringProperty readingProperty() {
    return reading.getReadOnlyProperty();
  }

  /** Returns the nearest preferred value for a part, e.g. "Nearest E24 value: 4.7 kΩ". */
  public ReadOnlyStringProperty hintProperty() {
    return hint.getReadOnlyProperty();
  }

  /** Returns why the entry is not a value yet (empty when it is, or when nothing is typed). */
  public ReadOnlyStringProperty problemProperty() {
    return problem.getReadOnlyProperty();
  }

  /**
   * Returns what the pad takes that is never negative while it takes volts, e.g. {@link
   * #AC_AMPLITUDE}; empty (the default) while a sign may be typed. While it is set the sign key
   * does nothing and a negative entry is no value: the preview says what to fix, and what was typed
   * stays. (An ohms reading is never negative whatever this says.)
   */
  public StringProperty unsignedProperty() {
    return unsigned;
  }

  /** Returns the negative number typed that the unsigned pad refuses, if that is the entry. */
  public java.util.OptionalDouble refusedNegative() {
    return refusedNegative == null
        ? java.util.OptionalDouble.empty()
        : java.util.OptionalDouble.of(refusedNegative);
  }

  /** Returns whether the entry is a value. */
  public boolean hasValue() {
    return value.get() != null;
  }

  /**
   * Applies one key of the pad: a digit, ".", a prefix letter, {@link #BACK}, {@link #CLEAR},
   * {@link #SIGN}.
   */
  public void press(String key) {
    String now = text.get() == null ? "" : text.get();
    switch (key) {
      case BACK -> text.set(now.isEmpty() ? "" : now.substring(0, now.length() - 1));
      case CLEAR -> text.set("");
      case SIGN -> {
        if (isSigned()) {
          text.set(now.startsWith("-") ? now.substring(1) : "-" + now);
        }
      }
      case OVER_RANGE -> text.set(OVER_RANGE);
      default -> text.set(isOverRange(now) ? key : now + key);
    }
  }

  private boolean isSigned() {
    return quantity.get() == Quantity.VOLTS && (unsigned.get() == null || unsigned.get().isEmpty());
  }

  private static boolean isOverRange(String typed) {
    return typed.strip().equalsIgnoreCase(OVER_RANGE);
  }

  /** Sets the entry to a value (e.g. from the colour-code decoder); +∞ of an ohms reading is OL. */
  public void setValue(double si) {
    if (quantity.get() == Quantity.METER_OHMS && si == Double.POSITIVE_INFINITY) {
      text.set(OVER_RANGE);
      return;
    }
    text.set(
        switch (quantity.get()) {
          case OHMS, METER_OHMS -> SiValue.rkm(si);
          case ZENER -> ZenerMarking.format(si);
          case POSITION -> share(si);
          default -> plain(SiValue.format(si, ""));
        });
  }

  /** A wiper position as a plain decimal ("0.82", never "820m"), independent of the locale. */
  private static String share(double position) {
    return java.math.BigDecimal.valueOf(position).stripTrailingZeros().toPlainString();
  }

  private static String plain(String formatted) {
    return formatted.replace(" ", "").replace("µ", "u");
  }

  private void update() {
    refusedNegative = null;
    String now = text.get() == null ? "" : text.get().strip();
    if (now.isEmpty()) {
      value.set(null);
      reading.set("");
      hint.set("");
      problem.set("");
      return;
    }
    if (isOverRange(now) && quantity.get() == Quantity.METER_OHMS) {
      value.set(Double.POSITIVE_INFINITY);
      problem.set("");
      hint.set("");
      reading.set("= OL, over range: nothing the meter can measure connects the two points");
      return;
    }
    double parsed;
    try {
      parsed = quantity.get() == Quantity.ZENER ? ZenerMarking.parse(now) : SiValue.parse(now);
    } catch (InvalidInputException e) {
      value.set(null);
      reading.set("");
      hint.set("");
      problem.set("Not a value yet. Examples: " + examples());
      return;
    }
    Quantity q = quantity.get();
    if (q == Quantity.VOLTS && !isSigned() && parsed < 0) {
      // Keep what was typed: the technician takes the minus sign away, nothing else is lost.
      refusedNegative = parsed;
      value.set(null);
      reading.set("");
      hint.set("");
      problem.set(unsigned.get() + " cannot be negative: type it without the minus sign.");
      return;
    }
    if (q != Quantity.VOLTS && parsed < 0) {
      value.set(null);
      reading.set("");
      hint.set("");
      problem.set(
          q == Quantity.METER_OHMS
              ? "An ohms reading cannot be negative: check the leads and the meter's range."
              : "A part value cannot be negative.");
      return;
    }
    if (q == Quantity.POSITION && parsed > 1) {
      value.set(null);
      reading.set("");
      hint.set("");
      problem.set(
          "A wiper position is from 0 (end 1) to 1 (end 2); "
              + now
              + " is beyond the track. Check the decimal point.");
      return;
    }
    if (Math.abs(parsed) > q.largest) {
      // Keep what was typed: the technician corrects the prefix or the point, nothing is lost.
      value.set(null);
      reading.set("");
      hint.set("");
      problem.set(
          Engineering.of(parsed, q.unit(), SiValue.DEFAULT_DIGITS)
              + " is more than "
              + q.largestWords
              + ". Check the decimal point and the prefix.");
      return;
    }
    value.set(parsed);
    problem.set("");
    reading.set(
        switch (q) {
          case ZENER ->
              "= " + Engineering.of(parsed, q.unit(), SiValue.DEFAULT_DIGITS) + " zener voltage";
          case POSITION -> "= " + share(parsed) + " of the travel from end 1";
          default -> "= " + Engineering.of(parsed, q.unit(), SiValue.DEFAULT_DIGITS);
        });
    hint.set(preferredHint(q, parsed));
  }

  private String examples() {
    return switch (quantity.get()) {
      case OHMS -> "4k7, 470R, 10k, 1M5";
      case METER_OHMS -> "46k8, 0.4, 120R, 1M2 or OL";
      case FARADS -> "100n, 2u2, 47p";
      case VOLTS -> "14.96, -0.62, 350m";
      case ZENER -> "5V1, 12V, 3.3V";
      case POSITION -> "0.5, 0.82, 0";
    };
  }

  /** Returns the nearest E24 (resistors) or E12 (capacitors) value when the value is not one. */
  static String preferredHint(Quantity q, double parsed) {
    if (q == Quantity.VOLTS
        || q == Quantity.ZENER
        || q == Quantity.POSITION
        || q == Quantity.METER_OHMS
        || parsed <= 0) {
      return "";
    }
    ESeries series = q == Quantity.OHMS ? ESeries.E24 : ESeries.E12;
    if (series.isPreferred(parsed)) {
      return "A preferred " + series.name() + " value.";
    }
    double nearest = series.nearest(parsed);
    String text = "Nearest " + series.name() + " value: " + SiValue.format(nearest, q.unit());
    if (q == Quantity.OHMS) {
      text += " (E96: " + SiValue.format(ESeries.E96.nearest(parsed), q.unit()) + ")";
    }
    return text;
  }
}

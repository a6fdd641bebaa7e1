package com.stagewise.ui.words;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.value.Engineering;
import com.stagewise.diagnosis.Wording;
import com.stagewise.history.Checks;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairAction;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;

/** Text the screens share: dates, volts, outcomes and the usual "what to do" lines. */
public final class Words {
  /** What to do when the history file cannot be read or written. */
  public static final String CHECK_DATABASE =
      "Check that the disk is not full and that no other program holds the history file, then try again.";

  private static final DateTimeFormatter DATE =
      DateTimeFormatter.ofPattern("yyyy-MM-dd", Locale.ROOT).withZone(ZoneId.systemDefault());
  private static final DateTimeFormatter DATE_TIME =
      DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm", Locale.ROOT).withZone(ZoneId.systemDefault());

  private Words() {}

  /** Returns a date as {@code 2026-03-14} in the machine's time zone. */
  public static String date(Instant at) {
    return at == null ? "" : DATE.format(at);
  }

  /** Returns a time as {@code 2026-03-14 09:30} in the machine's time zone. */
  public static String dateTime(Instant at) {
    return at == null ? "" : DATE_TIME.format(at);
  }

  /** Returns an outcome in plain words. */
  public static String outcome(Outcome outcome) {
    if (outcome == null) {
      return "open";
    }
    return switch (outcome) {
      case FIXED -> "fixed";
      case NOT_FIXED -> "not fixed";
      case RETURNED -> "returned unrepaired";
    };
  }

  /**
   * Returns computed volts (an expectation, a prediction) in engineering units, e.g. {@code −4.7
   * V}, {@code −1.8 mV}, {@code 20 µV}; "—" for a value that is not a number.
   */
  public static String volts(double volts) {
    return Double.isFinite(volts) ? Engineering.volts(volts) : "—";
  }

  /**
   * Returns volts as the meter showed them, with its range's digits, e.g. {@code 11.90 V}, {@code
   * −1.8 mV}; "—" for a value that is not a number.
   */
  public static String measured(double volts) {
    return Double.isFinite(volts) ? Engineering.reading(volts, MeterSpec.DEFAULT) : "—";
  }

  /**
   * Returns ohms as the meter showed them, e.g. {@code 46.8 kΩ}, {@code 0.4 Ω}; {@code OL} for the
   * over-range (+∞); "—" for NaN.
   */
  public static String ohms(double ohms) {
    if (ohms == Double.POSITIVE_INFINITY) {
      return "OL";
    }
    return Double.isFinite(ohms) ? Engineering.of(ohms, "Ω", 4) : "—";
  }

  /** Returns a healthy band, e.g. {@code ±5 mV} or {@code 2.495 V to 2.505 V}. */
  public static String band(double low, double high) {
    return Double.isFinite(low) && Double.isFinite(high) ? Engineering.band(low, high) : "—";
  }

  /**
   * Returns a healthy band of ohms as the ohms cards print it, e.g. {@code 46.5 kΩ to 47.5 kΩ};
   * {@code OL} where a healthy stage reads OL, {@code 46.5 kΩ to OL} for a band that reaches it;
   * "—" when unknown (NaN).
   */
  public static String ohmsBand(double low, double high) {
    if (Double.isNaN(low) || Double.isNaN(high)) {
      return "—";
    }
    String lowText = ohmsRounded(low);
    String highText = ohmsRounded(high);
    return lowText.equals(highText) ? lowText : lowText + " to " + highText;
  }

  private static String ohmsRounded(double ohms) {
    return ohms == Double.POSITIVE_INFINITY ? "OL" : Engineering.of(ohms, "Ω", 3);
  }

  /**
   * Returns what an AC reading is, as the value pad's switch says it: "AC volts RMS at 1 kHz"
   * ({@code measure} a file word: rms, peak or pp).
   */
  public static String acVolts(String measure, double hz) {
    return "AC volts " + measure(measure) + " at " + hertz(hz);
  }

  /** Returns a frequency, e.g. {@code 1 kHz}, {@code 50 Hz}. */
  public static String hertz(double hz) {
    return Double.isFinite(hz) ? Engineering.of(hz, "Hz", 4) : "—";
  }

  /** Returns a probability as a whole percentage, {@code <1 %} for small ones. */
  public static String percent(double probability) {
    double p = probability * 100;
    if (p > 0 && p < 1) {
      return "<1" + Engineering.SPACE + "%";
    }
    return String.format(Locale.ROOT, "%.0f", p) + Engineering.SPACE + "%";
  }

  /** Returns a fault id in a technician's words ({@link Wording#fault(String)}). */
  public static String fault(String id) {
    return Wording.fault(id);
  }

  /** Returns a test point in words: {@code U1.8} gives "U1 pin 8", a net gives its name. */
  public static String pin(String at) {
    return Wording.point(at);
  }

  /** Returns an action in one line, e.g. "Replaced R2: open → 4.7 kΩ". */
  public static String actionLine(RepairAction a) {
    StringBuilder line = new StringBuilder(actionKind(a.kind()));
    if (!a.part().isEmpty()) {
      line.append(' ').append(a.part());
    }
    if (!a.oldValue().isEmpty() || !a.newValue().isEmpty()) {
      line.append(": ")
          .append(a.oldValue().isEmpty() ? "?" : a.oldValue())
          .append(" → ")
          .append(a.newValue().isEmpty() ? "?" : a.newValue());
    }
    if (!a.text().isEmpty()) {
      line.append(" — ").append(a.text());
    }
    return line.toString();
  }

  /**
   * Returns a photo of the board in one line, e.g. "board top.jpg — 4000 × 3000, 3.1 MB, attached 4
   * Mar 2026 10:15 by Ann".
   */
  public static String photoLine(CasePhoto p) {
    return p.fileName()
        + " — "
        + p.width()
        + " × "
        + p.height()
        + ", "
        + size(p.bytes())
        + ", attached "
        + dateTime(p.attachedAt())
        + (p.attachedBy().isBlank() ? "" : " by " + p.attachedBy());
  }

  /** Returns a file's size for people: whole kB below 1 MB, else MB with one decimal. */
  public static String size(long bytes) {
    return bytes < 1024 * 1024
        ? Math.max(1, Math.round(bytes / 1024.0)) + "\u00a0kB"
        : Checks.megabytes(bytes).replace(' ', '\u00a0');
  }

  /** Returns the kind of an action in a word. */
  public static String actionKind(ActionKind kind) {
    return switch (kind) {
      case PART_REPLACED -> "Replaced";
      case REFLOW -> "Reflow";
      case ADJUSTMENT -> "Adjusted";
      case OTHER -> "Other";
    };
  }

  /**
   * Returns an AC measure's file word in words: {@code RMS}, {@code peak}, {@code peak-to-peak}.
   */
  public static String measure(String word) {
    return AcMeasure.of(word).map(AcMeasure::words).orElse(word);
  }
}

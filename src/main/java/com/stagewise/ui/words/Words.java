package com.stagewise.ui.words;

import com.stagewise.circuit.Reading;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.StoredReading;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;
import java.util.OptionalDouble;

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

  /** Returns volts with a sign and three decimals, e.g. {@code +14.960 V} (no locale). */
  public static String volts(double volts) {
    if (!Double.isFinite(volts)) {
      return "—";
    }
    double shown = Math.abs(volts) < 0.0005 ? 0.0 : volts;
    return String.format(Locale.ROOT, "%+.3f V", shown);
  }

  /** Returns volts briefly, e.g. {@code 14.96 V}, {@code -4.7 V}, {@code 0 V}. */
  public static String voltsShort(double volts) {
    if (!Double.isFinite(volts)) {
      return "—";
    }
    double shown = Math.abs(volts) < 0.005 ? 0.0 : volts;
    String text = String.format(Locale.ROOT, "%.2f", shown);
    text = text.replaceAll("0+$", "").replaceAll("\\.$", "");
    return ("-0".equals(text) ? "0" : text) + " V";
  }

  /** Returns a probability as a whole percentage, {@code <1 %} for small ones. */
  public static String percent(double probability) {
    double p = probability * 100;
    if (p > 0 && p < 1) {
      return "<1 %";
    }
    return String.format(Locale.ROOT, "%.0f %%", p);
  }

  /**
   * Returns a fault id in a technician's words: {@code R2:open} gives "R2 open", {@code
   * U1.6-7:bridge} gives "Solder bridge U1 pins 6–7".
   */
  public static String fault(String id) {
    if (id == null || id.isEmpty()) {
      return "";
    }
    if (id.equals("healthy")) {
      return "Nothing wrong (healthy stage)";
    }
    int colon = id.lastIndexOf(':');
    if (colon < 0) {
      return id;
    }
    String what = id.substring(0, colon);
    String kind = id.substring(colon + 1);
    return switch (kind) {
      case "open" -> what + " open";
      case "short" -> what + " shorted";
      case "high" -> what + " drifted high";
      case "low" ->
          what.matches("[A-Za-z]+\\d*[A-Za-z]*") && !what.matches("[RC]\\d+.*")
              ? "Rail " + what + " low"
              : what + " drifted low";
      case "stuck-high" -> what + " output stuck high";
      case "stuck-low" -> what + " output stuck low";
      case "dead" -> what + " output dead (not driving)";
      case "lifted" -> pin(what) + " lifted (open joint)";
      case "bridge" -> "Solder bridge " + pin(what).replace("pin ", "pins ").replace("-", "–");
      case "missing" -> "Rail " + what + " missing";
      default -> what + " " + kind;
    };
  }

  /** Returns a test point in words: {@code U1.8} gives "U1 pin 8", a net gives its name. */
  public static String pin(String at) {
    int dot = at.lastIndexOf('.');
    if (dot > 0 && dot < at.length() - 1 && Character.isDigit(at.charAt(dot + 1))) {
      return at.substring(0, dot) + " pin " + at.substring(dot + 1);
    }
    return at;
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

  /** Returns the kind of an action in a word. */
  public static String actionKind(ActionKind kind) {
    return switch (kind) {
      case PART_REPLACED -> "Replaced";
      case REFLOW -> "Reflow";
      case ADJUSTMENT -> "Adjusted";
      case OTHER -> "Other";
    };
  }

  /** Returns the reading a stored reading stands for. */
  public static Reading reading(StoredReading stored) {
    Reading.Kind kind = stored.kind() == ReadingKind.AC ? Reading.Kind.AC : Reading.Kind.DC;
    double hz = kind == Reading.Kind.AC && stored.hz() != null ? stored.hz() : 0;
    OptionalDouble uncertainty =
        stored.uncertainty() == null
            ? OptionalDouble.empty()
            : OptionalDouble.of(stored.uncertainty());
    return new Reading(stored.at(), kind, stored.value(), hz, uncertainty);
  }
}

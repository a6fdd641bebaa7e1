package com.stagewise.history;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The limits and shapes of what the history accepts, checked on every write and every import by
 * every store.
 *
 * <p>Limits keep a hostile or broken import from filling the disk or the screen; they are far above
 * what a bench ever writes.
 */
public final class Checks {
  /** Serial numbers, names, part designators, values, test points: one line of text. */
  public static final int MAX_SHORT = 200;

  /** Symptoms, notes, explanations: free text. */
  public static final int MAX_TEXT = 50_000;

  /** A stage sheet's JSON text. */
  public static final int MAX_SHEET = 2_000_000;

  /** Suspects in one stored suspect list, and faults in one group or one close-out. */
  public static final int MAX_LIST = 1_000;

  /**
   * The largest photo a case takes: 20 MB (20 × 1024 × 1024 bytes), several times what a phone's
   * photo of a board takes, so that a bundle of a busy shop stays a file one can carry.
   */
  public static final long MAX_PHOTO_BYTES = 20L * 1024 * 1024;

  private static final Pattern UUID_SHAPE =
      Pattern.compile("[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}");

  /**
   * A fault id in the DESIGN.md grammar: {@code healthy}, or a target and a fault word, where the
   * target is a designator ({@code R2}, {@code U1A}, a rail net such as {@code VCC}, {@code +15V}
   * or {@code -15V}: rails are named by their nets, which may start with a sign or a digit) or a
   * package pin or pin pair ({@code U1.3}, {@code U1.6-7}).
   */
  private static final Pattern FAULT_ID =
      Pattern.compile("healthy|[A-Za-z0-9_+\\-]+(\\.[0-9]+(-[0-9]+)?)?:[a-z][a-z\\-]*");

  /** An op-amp section designator: a package designator and a section letter ({@code U1A}). */
  private static final Pattern SECTION = Pattern.compile("([A-Za-z]+[0-9]+)([A-Za-z])");

  private Checks() {}

  public static String id(String source, String field, String value) {
    if (value == null || !UUID_SHAPE.matcher(value).matches()) {
      throw new InvalidInputException(
          source, field, "expected an id such as 3f1c…-… (a lower-case UUID), got " + quote(value));
    }
    return value;
  }

  public static String shortText(String source, String field, String value, boolean required) {
    text(source, field, value, MAX_SHORT);
    if (value.indexOf('\n') >= 0 || value.indexOf('\r') >= 0) {
      throw new InvalidInputException(source, field, "expected one line of text, got a line break");
    }
    if (required && value.isBlank()) {
      throw new InvalidInputException(source, field, "must not be empty");
    }
    return value;
  }

  public static String text(String source, String field, String value, int max) {
    if (value == null) {
      throw new InvalidInputException(source, field, "is missing");
    }
    if (value.length() > max) {
      throw new InvalidInputException(
          source,
          field,
          "is too long (" + value.length() + " characters; at most " + max + " are accepted)");
    }
    if (value.indexOf('\0') >= 0) {
      throw new InvalidInputException(source, field, "contains a NUL character");
    }
    return value;
  }

  public static String faultId(String source, String field, String value) {
    if (value == null || value.length() > MAX_SHORT || !FAULT_ID.matcher(value).matches()) {
      throw new InvalidInputException(
          source,
          field,
          "expected a fault id such as R2:open, U1A:stuck-high, U1.6-7:bridge or healthy, got "
              + quote(value));
    }
    return value;
  }

  public static double finite(String source, String field, double value) {
    if (!Double.isFinite(value)) {
      throw new InvalidInputException(source, field, "expected a finite number, got " + value);
    }
    return value;
  }

  public static <T> List<T> list(String source, String field, List<T> values) {
    if (values.size() > MAX_LIST) {
      throw new InvalidInputException(
          source,
          field,
          "has " + values.size() + " entries; at most " + MAX_LIST + " are accepted");
    }
    return values;
  }

  /** Checks a reading before it is stored; {@code field} names it in messages. */
  public static void reading(String source, String field, StoredReading r) {
    shortText(source, field + ".at", r.at(), true);
    if (r.kind() == ReadingKind.OHMS) {
      // A power-off reading: two points, 0 ohms or more, or the meter's over-range (OL).
      shortText(source, field + ".to", r.to(), true);
      if (!r.isOverRange()) {
        finite(source, field + ".value", r.value());
        if (r.value() < 0) {
          throw new InvalidInputException(
              source, field + ".value", "expected 0 ohms or more, or OL, got " + r.value());
        }
      }
      if (r.hz() != null) {
        throw new InvalidInputException(
            source, field + ".hz", "an ohms reading has no frequency (expected none)");
      }
    } else {
      if (!r.to().isEmpty()) {
        throw new InvalidInputException(
            source,
            field + ".to",
            "a "
                + r.kind().word()
                + " reading has no second point (expected \"to\" only with"
                + " ohms)");
      }
      finite(source, field + ".value", r.value());
    }
    if (r.hz() != null) {
      finite(source, field + ".hz", r.hz());
    }
    if (r.uncertainty() != null) {
      finite(source, field + ".uncertainty", r.uncertainty());
    }
    text(source, field + ".meter", r.meterText(), MAX_TEXT);
  }

  /**
   * Checks a photo before it is stored: its file name, a PNG or JPEG picture whose kind and size in
   * pixels are what the record says, at most {@link #MAX_PHOTO_BYTES}; {@code field} names it in
   * messages.
   */
  public static void photo(String source, String field, StoredPhoto p) {
    CasePhoto about = p.photo();
    shortText(source, field + ".fileName", about.fileName(), true);
    shortText(source, field + ".attachedBy", about.attachedBy(), false);
    if (p.image().length > MAX_PHOTO_BYTES) {
      throw new InvalidInputException(
          source,
          field + ".image",
          "the photo is "
              + megabytes(p.image().length)
              + "; at most "
              + megabytes(MAX_PHOTO_BYTES)
              + " are accepted");
    }
    PhotoFormat.Picture picture =
        PhotoFormat.of(p.image())
            .orElseThrow(
                () ->
                    new InvalidInputException(
                        source, field + ".image", "expected a PNG or JPEG picture"));
    if (!picture.mediaType().equals(about.mediaType())
        || picture.width() != about.width()
        || picture.height() != about.height()) {
      throw new InvalidInputException(
          source,
          field,
          "the picture is a "
              + picture.mediaType()
              + " of "
              + picture.width()
              + " × "
              + picture.height()
              + " pixels, but the photo says "
              + quote(about.mediaType())
              + " of "
              + about.width()
              + " × "
              + about.height());
    }
  }

  /**
   * Checks a reading taken after the repair; {@code field} names it in messages. A volts reading's
   * value and band are finite numbers (an AC amplitude and its band 0 or more, at a finite
   * frequency above 0); an ohms reading's are 0 ohms or more, or OL (+∞), and it names its second
   * point.
   */
  public static void afterRepair(String source, String field, AfterRepairReading r) {
    shortText(source, field + ".at", r.at(), true);
    boolean ohms = r.kind() == ReadingKind.OHMS;
    if (ohms) {
      shortText(source, field + ".to", r.to(), true);
      ohmsValue(source, field + ".value", r.value());
    } else {
      finite(source, field + ".value", r.value());
    }
    if (r.kind() == ReadingKind.AC) {
      finite(source, field + ".hz", r.hz());
      if (r.hz() <= 0) {
        throw new InvalidInputException(
            source, field + ".hz", "expected a frequency above 0 Hz, got " + r.hz());
      }
      if (r.value() < 0) {
        throw new InvalidInputException(
            source, field + ".value", "expected an AC amplitude of 0 V or more, got " + r.value());
      }
    }
    text(source, field + ".meter", r.meterText(), MAX_TEXT);
    if (r.hasBand()) {
      if (ohms) {
        ohmsValue(source, field + ".healthyLow", r.healthyLow());
        ohmsValue(source, field + ".healthyHigh", r.healthyHigh());
      } else {
        finite(source, field + ".healthyLow", r.healthyLow());
        finite(source, field + ".healthyHigh", r.healthyHigh());
      }
      if (r.healthyLow() > r.healthyHigh()) {
        throw new InvalidInputException(
            source,
            field + ".healthyLow",
            "the healthy band's low end ("
                + r.healthyLow()
                + ") is above its high end ("
                + r.healthyHigh()
                + ")");
      }
    }
  }

  /** Checks ohms: 0 or more, or the meter's over-range (+∞, OL). */
  private static void ohmsValue(String source, String field, double ohms) {
    if (ohms != Double.POSITIVE_INFINITY) {
      finite(source, field, ohms);
      if (ohms < 0) {
        throw new InvalidInputException(
            source, field, "expected 0 ohms or more, or OL, got " + ohms);
      }
    }
  }

  /** Returns a size in bytes as megabytes with one decimal, the same in every locale: 20.0 MB. */
  public static String megabytes(long bytes) {
    long tenths = Math.round(bytes / (1024.0 * 1024.0) * 10);
    return (tenths / 10) + "." + (tenths % 10) + " MB";
  }

  /** Checks a suspect list before it is stored; {@code field} names it in messages. */
  public static void suspectList(String source, String field, SuspectListRecord list) {
    shortText(source, field + ".programVersion", list.programVersion(), false);
    shortText(source, field + ".verdict", list.verdict(), true);
    text(source, field + ".nextProbes", list.nextProbes(), MAX_TEXT);
    list(source, field + ".suspects", list.suspects());
    for (int i = 0; i < list.suspects().size(); i++) {
      StoredSuspect s = list.suspects().get(i);
      String at = field + ".suspects[" + i + "]";
      faultId(source, at + ".fault", s.fault());
      finite(source, at + ".probability", s.probability());
      list(source, at + ".group", s.group());
      for (String member : s.group()) {
        faultId(source, at + ".group", member);
      }
      text(source, at + ".why", s.why(), MAX_TEXT);
    }
  }

  /** Checks an action's texts before it is stored; {@code field} names it in messages. */
  public static void action(
      String source, String field, String part, String oldValue, String newValue, String text) {
    shortText(source, field + "part", part, false);
    shortText(source, field + "oldValue", oldValue, false);
    shortText(source, field + "newValue", newValue, false);
    text(source, field + "text", text, MAX_TEXT);
  }

  /**
   * Returns the part designators that a fault id or an action's part field names, for search:
   * {@code R2:open} gives R2; {@code U1A:dead} gives U1A and U1; {@code U1.6-7:bridge} gives U1;
   * {@code R2, R3} gives R2 and R3.
   */
  public static List<String> parts(String faultOrPart) {
    List<String> parts = new ArrayList<>();
    String text = faultOrPart.strip();
    if (text.equals("healthy")) {
      return parts;
    }
    int colon = text.indexOf(':');
    if (colon >= 0) {
      text = text.substring(0, colon);
    }
    for (String token : text.split("[,;\\s]+")) {
      if (token.isEmpty()) {
        continue;
      }
      int dot = token.indexOf('.');
      String part = (dot > 0 ? token.substring(0, dot) : token).toUpperCase(Locale.ROOT);
      if (part.length() > MAX_SHORT) {
        continue;
      }
      addOnce(parts, part);
      Matcher section = SECTION.matcher(part);
      if (section.matches()) {
        addOnce(parts, section.group(1));
      }
    }
    return parts;
  }

  private static void addOnce(List<String> parts, String part) {
    if (!parts.contains(part)) {
      parts.add(part);
    }
  }

  public static String quote(String value) {
    if (value == null) {
      return "nothing";
    }
    String shown = value.length() > 60 ? value.substring(0, 60) + "…" : value;
    return "'" + shown + "'";
  }
}

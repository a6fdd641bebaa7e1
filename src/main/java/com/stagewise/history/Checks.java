package com.stagewise.history;

import com.stagewise.circuit.InvalidInputException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The limits and shapes of what the history accepts, checked on every write and every import.
 *
 * <p>Limits keep a hostile or broken import from filling the disk or the screen; they are far above
 * what a bench ever writes.
 */
final class Checks {
  /** Serial numbers, names, part designators, values, test points: one line of text. */
  static final int MAX_SHORT = 200;

  /** Symptoms, notes, explanations: free text. */
  static final int MAX_TEXT = 50_000;

  /** A stage sheet's JSON text. */
  static final int MAX_SHEET = 2_000_000;

  /** Suspects in one stored suspect list, and faults in one group or one close-out. */
  static final int MAX_LIST = 1_000;

  private static final Pattern UUID_SHAPE =
      Pattern.compile("[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}");

  /**
   * A fault id in the DESIGN.md grammar: {@code healthy}, or a target and a fault word, where the
   * target is a designator ({@code R2}, {@code U1A}, a rail net such as {@code VCC}) or a package
   * pin or pin pair ({@code U1.3}, {@code U1.6-7}).
   */
  private static final Pattern FAULT_ID =
      Pattern.compile("healthy|[A-Za-z_][A-Za-z0-9_+\\-]*(\\.[0-9]+(-[0-9]+)?)?:[a-z][a-z\\-]*");

  /** An op-amp section designator: a package designator and a section letter ({@code U1A}). */
  private static final Pattern SECTION = Pattern.compile("([A-Za-z]+[0-9]+)([A-Za-z])");

  private Checks() {}

  static String id(String source, String field, String value) {
    if (value == null || !UUID_SHAPE.matcher(value).matches()) {
      throw new InvalidInputException(
          source, field, "expected an id such as 3f1c…-… (a lower-case UUID), got " + quote(value));
    }
    return value;
  }

  static String shortText(String source, String field, String value, boolean required) {
    text(source, field, value, MAX_SHORT);
    if (value.indexOf('\n') >= 0 || value.indexOf('\r') >= 0) {
      throw new InvalidInputException(source, field, "expected one line of text, got a line break");
    }
    if (required && value.isBlank()) {
      throw new InvalidInputException(source, field, "must not be empty");
    }
    return value;
  }

  static String text(String source, String field, String value, int max) {
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

  static String faultId(String source, String field, String value) {
    if (value == null || value.length() > MAX_SHORT || !FAULT_ID.matcher(value).matches()) {
      throw new InvalidInputException(
          source,
          field,
          "expected a fault id such as R2:open, U1A:stuck-high, U1.6-7:bridge or healthy, got "
              + quote(value));
    }
    return value;
  }

  static double finite(String source, String field, double value) {
    if (!Double.isFinite(value)) {
      throw new InvalidInputException(source, field, "expected a finite number, got " + value);
    }
    return value;
  }

  static <T> List<T> list(String source, String field, List<T> values) {
    if (values.size() > MAX_LIST) {
      throw new InvalidInputException(
          source,
          field,
          "has " + values.size() + " entries; at most " + MAX_LIST + " are accepted");
    }
    return values;
  }

  /**
   * Returns the part designators that a fault id or an action's part field names, for search:
   * {@code R2:open} gives R2; {@code U1A:dead} gives U1A and U1; {@code U1.6-7:bridge} gives U1;
   * {@code R2, R3} gives R2 and R3.
   */
  static List<String> parts(String faultOrPart) {
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

  static String quote(String value) {
    if (value == null) {
      return "nothing";
    }
    String shown = value.length() > 60 ? value.substring(0, 60) + "…" : value;
    return "'" + shown + "'";
  }
}

package com.stagewise.interchange.history;

import com.fasterxml.jackson.databind.JsonNode;
import com.stagewise.circuit.InvalidInputException;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Set;
import java.util.function.Function;

/**
 * One JSON object being read, with the path to it, so that every complaint names the field.
 *
 * <p>Unknown keys are an error; wrong types name what was expected and what was found.
 */
final class JsonFields {
  private final String source;
  private final String path;
  private final JsonNode node;

  private JsonFields(String source, String path, JsonNode node) {
    this.source = source;
    this.path = path;
    this.node = node;
  }

  /** Reads {@code node} as an object at {@code path} that may hold only {@code allowed} keys. */
  static JsonFields object(String source, String path, JsonNode node, Set<String> allowed) {
    if (node == null || !node.isObject()) {
      throw new InvalidInputException(
          source, path.isEmpty() ? "(top level)" : path, "expected an object, got " + kind(node));
    }
    for (Iterator<String> names = node.fieldNames(); names.hasNext(); ) {
      String name = names.next();
      if (!allowed.contains(name)) {
        throw new InvalidInputException(
            source,
            join(path, name),
            "unknown key (expected one of "
                + String.join(", ", new java.util.TreeSet<>(allowed))
                + ")");
      }
    }
    return new JsonFields(source, path, node);
  }

  String field(String key) {
    return join(path, key);
  }

  JsonNode raw(String key) {
    return node.get(key);
  }

  String text(String key) {
    JsonNode value = node.get(key);
    if (value == null || value.isNull()) {
      throw new InvalidInputException(source, field(key), "is missing (expected a string)");
    }
    if (!value.isTextual()) {
      throw new InvalidInputException(source, field(key), "expected a string, got " + kind(value));
    }
    return value.textValue();
  }

  String text(String key, String absent) {
    JsonNode value = node.get(key);
    return value == null || value.isNull() ? absent : text(key);
  }

  double number(String key) {
    JsonNode value = node.get(key);
    if (value == null || value.isNull()) {
      throw new InvalidInputException(source, field(key), "is missing (expected a number)");
    }
    if (!value.isNumber()) {
      throw new InvalidInputException(source, field(key), "expected a number, got " + kind(value));
    }
    double number = value.doubleValue();
    if (!Double.isFinite(number)) {
      throw new InvalidInputException(source, field(key), "expected a finite number, got " + value);
    }
    return number;
  }

  Double number(String key, Double absent) {
    JsonNode value = node.get(key);
    return value == null || value.isNull() ? absent : Double.valueOf(number(key));
  }

  int integer(String key) {
    JsonNode value = node.get(key);
    if (value == null || value.isNull()) {
      throw new InvalidInputException(source, field(key), "is missing (expected a whole number)");
    }
    if (!value.isIntegralNumber() || !value.canConvertToInt()) {
      throw new InvalidInputException(
          source, field(key), "expected a whole number, got " + kind(value));
    }
    return value.intValue();
  }

  Instant time(String key) {
    String text = text(key);
    try {
      Instant fast = fastUtc(text);
      return fast != null ? fast : Instant.parse(text);
    } catch (DateTimeParseException e) {
      throw new InvalidInputException(
          source,
          field(key),
          "expected a UTC time such as 2026-03-04T10:15:30Z, got '" + shorten(text) + "'");
    }
  }

  Instant time(String key, Instant absent) {
    JsonNode value = node.get(key);
    return value == null || value.isNull() ? absent : time(key);
  }

  <T> T word(String key, Function<String, java.util.Optional<T>> parse, String expected) {
    String text = text(key);
    return parse
        .apply(text)
        .orElseThrow(
            () ->
                new InvalidInputException(
                    source, field(key), "expected " + expected + ", got '" + shorten(text) + "'"));
  }

  /** Returns the array at {@code key} (empty if absent) as a list of its elements. */
  List<JsonNode> array(String key) {
    JsonNode value = node.get(key);
    if (value == null || value.isNull()) {
      return List.of();
    }
    if (!value.isArray()) {
      throw new InvalidInputException(source, field(key), "expected an array, got " + kind(value));
    }
    List<JsonNode> items = new ArrayList<>(value.size());
    value.forEach(items::add);
    return items;
  }

  List<String> texts(String key) {
    List<JsonNode> items = array(key);
    List<String> texts = new ArrayList<>(items.size());
    for (int i = 0; i < items.size(); i++) {
      JsonNode item = items.get(i);
      if (!item.isTextual()) {
        throw new InvalidInputException(
            source, field(key) + "[" + i + "]", "expected a string, got " + kind(item));
      }
      texts.add(item.textValue());
    }
    return texts;
  }

  /**
   * Returns the instant of a UTC time written as {@code Instant.toString} writes whole seconds or
   * milliseconds ({@code 2026-03-04T10:15:30Z}, {@code 2026-03-04T10:15:30.123Z}), or null for any
   * other shape (then {@code Instant.parse} decides). Bundles hold hundreds of thousands of times
   * and {@code Instant.parse} costs several microseconds each.
   */
  static Instant fastUtc(String t) {
    int n = t.length();
    if ((n != 20 && n != 24)
        || t.charAt(4) != '-'
        || t.charAt(7) != '-'
        || t.charAt(10) != 'T'
        || t.charAt(13) != ':'
        || t.charAt(16) != ':'
        || t.charAt(n - 1) != 'Z'
        || (n == 24 && t.charAt(19) != '.')) {
      return null;
    }
    int year = digits(t, 0, 4);
    int month = digits(t, 5, 2);
    int day = digits(t, 8, 2);
    int hour = digits(t, 11, 2);
    int minute = digits(t, 14, 2);
    int second = digits(t, 17, 2);
    int millis = n == 24 ? digits(t, 20, 3) : 0;
    if (year < 0
        || month < 1
        || month > 12
        || day < 1
        || day > 31
        || hour < 0
        || hour > 23
        || minute < 0
        || minute > 59
        || second < 0
        || second > 59
        || millis < 0) {
      return null;
    }
    try {
      return java.time.LocalDateTime.of(year, month, day, hour, minute, second, millis * 1_000_000)
          .toInstant(java.time.ZoneOffset.UTC);
    } catch (java.time.DateTimeException e) {
      return null;
    }
  }

  private static int digits(String text, int from, int count) {
    int value = 0;
    for (int i = from; i < from + count; i++) {
      char c = text.charAt(i);
      if (c < '0' || c > '9') {
        return -1;
      }
      value = value * 10 + (c - '0');
    }
    return value;
  }

  static String kind(JsonNode node) {
    if (node == null || node.isMissingNode()) {
      return "nothing";
    }
    if (node.isNull()) {
      return "null";
    }
    if (node.isTextual()) {
      return "a string";
    }
    if (node.isBoolean()) {
      return "true/false";
    }
    if (node.isIntegralNumber()) {
      return "a whole number";
    }
    if (node.isNumber()) {
      return "a number";
    }
    if (node.isArray()) {
      return "an array";
    }
    return "an object";
  }

  private static String join(String path, String key) {
    return path.isEmpty() ? key : path + "." + key;
  }

  private static String shorten(String text) {
    return text.length() > 40 ? text.substring(0, 40) + "…" : text;
  }
}

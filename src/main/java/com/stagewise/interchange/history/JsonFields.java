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
      throw new InvalidInputException(source, path.isEmpty() ? "(top level)" : path, "expected an object, got " + kind(node));
    }
    for (Iterator<String> names = node.fieldNames(); names.hasNext(); ) {
      String name = names.next();
      if (!allowed.contains(name)) {
        throw new InvalidInputException(source, join(path, name), "unknown key (expected one of " + String.join(", ", new java.util.TreeSet<>(allowed)) + ")");
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
      throw new InvalidInputException(source, field(key), "expected a whole number, got " + kind(value));
    }
    return value.intValue();
  }

  Instant time(String key) {
    String text = text(key);
    try {
      return Instant.parse(text);
    } catch (DateTimeParseException e) {
      throw new InvalidInputException(
          source, field(key), "expected a UTC time such as 2026-03-04T10:15:30Z, got '" + shorten(text) + "'");
    }
  }

  Instant time(String key, Instant absent) {
    JsonNode value = node.get(key);
    return value == null || value.isNull() ? absent : time(key);
  }

  <T> T word(String key, Function<String, java.util.Optional<T>> parse, String expected) {
    String text = text(key);
    return parse.apply(text)
        .orElseThrow(() -> new InvalidInputException(source, field(key), "expected " + expected + ", got '" + shorten(text) + "'"));
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
        throw new InvalidInputException(source, field(key) + "[" + i + "]", "expected a string, got " + kind(item));
      }
      texts.add(item.textValue());
    }
    return texts;
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

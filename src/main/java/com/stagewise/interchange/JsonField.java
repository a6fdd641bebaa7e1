package com.stagewise.interchange;

import com.fasterxml.jackson.core.JsonParseException;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.io.JsonEOFException;
import com.fasterxml.jackson.core.json.JsonReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.Tolerance;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * One field of a JSON document being read strictly, with its file and JSON path, so that every
 * complaint names the file, the path (e.g. {@code parts[2].value}) and what was expected.
 *
 * <p>Jackson's own exception texts never reach the user: parse errors are turned into plain
 * sentences here.
 */
final class JsonField {
  private static final ObjectMapper MAPPER =
      JsonMapper.builder()
          .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
          // Read NaN and Infinity so that the complaint can name the field instead of the column.
          .enable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
          .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
          .build();

  private final String source;
  private final String path;
  private final JsonNode node;

  private JsonField(String source, String path, JsonNode node) {
    this.source = source;
    this.path = path;
    this.node = node;
  }

  /**
   * Returns the root object of a JSON text.
   *
   * @throws InvalidInputException if the text is not JSON or its top is not an object
   */
  static JsonField parseRoot(String text, String source) {
    JsonNode root;
    try {
      root = MAPPER.readTree(text);
    } catch (JsonProcessingException e) {
      throw new InvalidInputException(source, "", parseProblem(e));
    }
    if (root == null || root.isMissingNode()) {
      throw new InvalidInputException(source, "", "the file is empty (expected a JSON object {…})");
    }
    JsonField field = new JsonField(source, "", root);
    if (!root.isObject()) {
      throw field.error("expected a JSON object {…} at the top, found " + describe(root));
    }
    return field;
  }

  private static String parseProblem(JsonProcessingException e) {
    String where =
        e.getLocation() == null
            ? ""
            : " at line "
                + e.getLocation().getLineNr()
                + ", column "
                + e.getLocation().getColumnNr();
    String original = e.getOriginalMessage() == null ? "" : e.getOriginalMessage();
    if (e instanceof JsonEOFException || original.contains("end-of-input")) {
      return "the text ends too early" + where + ": a bracket, brace or quote is not closed";
    }
    if (e instanceof JsonParseException && original.startsWith("Duplicate field '")) {
      int end = original.indexOf('\'', "Duplicate field '".length());
      String key = end > 0 ? original.substring("Duplicate field '".length(), end) : "?";
      return "key \""
          + key
          + "\" appears twice in one object"
          + where
          + " (expected each key once)";
    }
    if (original.startsWith("Trailing token")) {
      return "there is more text after the end of the JSON object"
          + where
          + " (expected one object)";
    }
    return "not valid JSON"
        + where
        + " (check for a missing or extra comma, quote, colon or bracket)";
  }

  /** Returns an exception naming this field's file and path. */
  InvalidInputException error(String problem) {
    return new InvalidInputException(source, path, problem);
  }

  /**
   * Returns an exception for this field that carries the problem of an exception from the model.
   */
  InvalidInputException rewrap(InvalidInputException e, String subField) {
    String problem = e.getMessage();
    String prefix = e.field().isEmpty() ? "" : e.field() + ": ";
    if (problem.startsWith(prefix)) {
      problem = problem.substring(prefix.length());
    }
    String at = subField.isEmpty() ? path : at(subField);
    return new InvalidInputException(source, at, problem);
  }

  String source() {
    return source;
  }

  String path() {
    return path;
  }

  JsonNode node() {
    return node;
  }

  private String at(String key) {
    return path.isEmpty() ? key : path + "." + key;
  }

  /**
   * Checks that this field is an object with no key outside {@code allowed}.
   *
   * @param what what the object is, for the message, e.g. "a part"
   */
  JsonField object(String what, List<String> allowed) {
    if (!node.isObject()) {
      throw error("expected " + what + " as an object {…}, found " + describe(node));
    }
    Iterator<String> names = node.fieldNames();
    while (names.hasNext()) {
      String name = names.next();
      if (!allowed.contains(name)) {
        throw new InvalidInputException(
            source,
            at(name),
            "unknown key \"" + name + "\" (expected one of " + String.join(", ", allowed) + ")");
      }
    }
    return this;
  }

  /** Returns a required child field. */
  JsonField require(String key, String expected) {
    JsonNode child = node.get(key);
    if (child == null) {
      throw new InvalidInputException(
          source, at(key), "missing field \"" + key + "\" (expected " + expected + ")");
    }
    return new JsonField(source, at(key), child);
  }

  /** Returns an optional child field; a JSON {@code null} counts as absent. */
  Optional<JsonField> optional(String key) {
    JsonNode child = node.get(key);
    return child == null || child.isNull()
        ? Optional.empty()
        : Optional.of(new JsonField(source, at(key), child));
  }

  /** Returns the elements of this array field. */
  List<JsonField> elements(String what) {
    if (!node.isArray()) {
      throw error("expected an array […] of " + what + ", found " + describe(node));
    }
    List<JsonField> elements = new ArrayList<>();
    for (int i = 0; i < node.size(); i++) {
      elements.add(new JsonField(source, path + "[" + i + "]", node.get(i)));
    }
    return elements;
  }

  /** Returns this field as a string, which must not be blank. */
  String name(String expected) {
    if (!node.isTextual()) {
      throw error("expected " + expected + " as a string, found " + describe(node));
    }
    if (node.asText().isBlank()) {
      throw error("expected " + expected + ", found an empty string");
    }
    return node.asText().strip();
  }

  /** Returns this field as a string, possibly empty. */
  String text() {
    if (!node.isTextual()) {
      throw error("expected a string, found " + describe(node));
    }
    return node.asText();
  }

  /** Returns this field as an integer. */
  int integer(String expected) {
    if (!node.isIntegralNumber() || !node.canConvertToInt()) {
      throw error("expected " + expected + " (a whole number), found " + describe(node));
    }
    return node.intValue();
  }

  /**
   * Returns this field as a finite number: a JSON number, or a string with an SI prefix or RKM code
   * ({@code "4k7"}, {@code "100n"}, {@code "1.5M"}).
   */
  double number(String expected) {
    double value;
    if (node.isNumber()) {
      value = node.doubleValue();
    } else if (node.isTextual()) {
      try {
        value = SiValue.parse(node.asText());
      } catch (InvalidInputException e) {
        throw error(e.getMessage());
      }
    } else {
      throw error("expected " + expected + ", found " + describe(node));
    }
    if (!Double.isFinite(value)) {
      throw error("expected " + expected + " as a finite number, found " + describe(node));
    }
    return value;
  }

  /** Returns this field as a number of 0 or more (see {@link #number}). */
  double nonNegative(String expected) {
    double value = number(expected);
    if (value < 0) {
      throw error(
          "value (" + printed(value) + ") must not be negative (expected " + expected + ")");
    }
    return value;
  }

  /** Returns this field as a tolerance fraction in [0, 1): {@code "1%"} or {@code 0.01}. */
  double tolerance() {
    double value;
    if (node.isNumber()) {
      value = node.doubleValue();
    } else if (node.isTextual()) {
      try {
        value = Tolerance.parse(node.asText());
      } catch (InvalidInputException e) {
        throw error(e.getMessage());
      }
    } else {
      throw error("expected a tolerance such as \"1%\" or 0.01, found " + describe(node));
    }
    if (!Double.isFinite(value) || value < 0 || value >= 1) {
      throw error(
          "tolerance (" + printed(value) + ") must be between 0 and 1, i.e. 0 % to below 100 %");
    }
    return value;
  }

  /**
   * Checks the {@code format} and {@code version} fields of a document's root.
   *
   * @param format the expected format, e.g. {@code stagewise-stage}
   * @param version the newest version this program reads
   * @param what what the document is, e.g. "a stage sheet"
   */
  void requireHeader(String format, int version, String what) {
    String found =
        require("format", "\"" + format + "\" for " + what).name("the format \"" + format + "\"");
    if (!found.equals(format)) {
      String hint =
          found.startsWith("stagewise-")
              ? " (this is a " + found.substring("stagewise-".length()) + " file)"
              : "";
      throw new InvalidInputException(
          source,
          at("format"),
          "format is \"" + found + "\"" + hint + ", expected \"" + format + "\" for " + what);
    }
    JsonField versionField = require("version", "the version number " + version);
    int foundVersion = versionField.integer("the version number " + version);
    if (foundVersion > version) {
      throw versionField.error(
          "version "
              + foundVersion
              + " is newer than this Stagewise reads (up to "
              + version
              + "): update Stagewise, or save the file as version "
              + version);
    }
    if (foundVersion < 1) {
      throw versionField.error(
          "version " + foundVersion + " is not a version (expected " + version + ")");
    }
  }

  /** Returns a short description of what a node holds, for messages. */
  static String describe(JsonNode node) {
    if (node.isTextual()) {
      return "the string \"" + node.asText() + "\"";
    }
    if (node.isNumber()) {
      return "the number " + printed(node.doubleValue());
    }
    if (node.isBoolean()) {
      return node.asText();
    }
    if (node.isNull()) {
      return "null";
    }
    if (node.isArray()) {
      return "an array";
    }
    if (node.isObject()) {
      return "an object";
    }
    return node.getNodeType().name().toLowerCase(Locale.ROOT);
  }

  private static String printed(double value) {
    if (Double.isNaN(value)) {
      return "NaN";
    }
    return value == Math.rint(value) && Math.abs(value) < 1e15
        ? Long.toString((long) value)
        : Double.toString(value);
  }
}

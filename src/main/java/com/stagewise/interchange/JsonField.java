package com.stagewise.interchange;

import com.fasterxml.jackson.databind.JsonNode;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.Tolerance;
import java.io.InputStream;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.Function;

/**
 * One field of a JSON document being read strictly, with its file and JSON path, so that every
 * complaint names the file, the path (e.g. {@code parts[2].value}) and what was expected.
 *
 * <p>Jackson's own exception texts never reach the user: parse errors are turned into plain
 * sentences here. This is the one reader of every document: stage sheets, readings and history
 * bundles.
 */
public final class JsonField {
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
  public static JsonField parseRoot(String text, String source) {
    return JsonParsing.root(text, source);
  }

  /** Returns a field at the top of a document: its path is empty. */
  static JsonField top(String source, JsonNode node) {
    return new JsonField(source, "", node);
  }

  /** Returns an exception naming this field's file and path. */
  public InvalidInputException error(String problem) {
    return new InvalidInputException(source, path, problem);
  }

  /**
   * Returns an exception for this field that carries the problem of an exception from the model.
   */
  public InvalidInputException rewrap(InvalidInputException e, String subField) {
    String problem = e.getMessage();
    // Strip the file and path the exception already names, so that neither is said twice.
    String prefix =
        (e.source().isEmpty() ? "" : e.source() + ": ")
            + (e.field().isEmpty() ? "" : e.field() + ": ");
    if (problem.startsWith(prefix)) {
      problem = problem.substring(prefix.length());
    }
    String at = subField.isEmpty() ? path : at(subField);
    return new InvalidInputException(source, at, problem);
  }

  /** Returns whether this field is a JSON string. */
  public boolean isText() {
    return node.isTextual();
  }

  /** Returns this field's JSON text, for reading an embedded document on its own. */
  public String json() {
    return node.toString();
  }

  /** Returns the file or screen named in messages. */
  public String source() {
    return source;
  }

  public String path() {
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
  public JsonField object(String what, List<String> allowed) {
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
  public JsonField require(String key, String expected) {
    JsonNode child = node.get(key);
    if (child == null) {
      throw new InvalidInputException(
          source, at(key), "missing field \"" + key + "\" (expected " + expected + ")");
    }
    return new JsonField(source, at(key), child);
  }

  /** Returns an optional child field; a JSON {@code null} counts as absent. */
  public Optional<JsonField> optional(String key) {
    JsonNode child = node.get(key);
    return child == null || child.isNull()
        ? Optional.empty()
        : Optional.of(new JsonField(source, at(key), child));
  }

  /** Returns the elements of this array field. */
  public List<JsonField> elements(String what) {
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
  public String name(String expected) {
    if (!node.isTextual()) {
      throw error("expected " + expected + " as a string, found " + describe(node));
    }
    if (node.asText().isBlank()) {
      throw error("expected " + expected + ", found an empty string");
    }
    return node.asText().strip();
  }

  /** Returns this field as a string, possibly empty. */
  public String text() {
    if (!node.isTextual()) {
      throw error("expected a string, found " + describe(node));
    }
    return node.asText();
  }

  /** Returns this field as an integer. */
  public int integer(String expected) {
    if (!node.isIntegralNumber() || !node.canConvertToInt()) {
      throw error("expected " + expected + " (a whole number), found " + describe(node));
    }
    return node.intValue();
  }

  /**
   * Returns this field as a finite number: a JSON number, or a string with an SI prefix or RKM code
   * ({@code "4k7"}, {@code "100n"}, {@code "1.5M"}).
   */
  public double number(String expected) {
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
  public double nonNegative(String expected) {
    double value = number(expected);
    if (value < 0) {
      throw error(
          "value (" + printed(value) + ") must not be negative (expected " + expected + ")");
    }
    return value;
  }

  /** Returns this field as a tolerance fraction in [0, 1): {@code "1%"} or {@code 0.01}. */
  public double tolerance() {
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
  public void requireHeader(String format, int version, String what) {
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

  /**
   * Returns the root object of a JSON document read from {@code in}, refusing strings longer than
   * {@code maxString} characters and nesting deeper than {@code maxDepth} levels before they are
   * held in memory.
   *
   * @param what what the document is, for messages, e.g. "a history bundle"
   * @throws InvalidInputException if the text is not JSON, exceeds the limits or is not an object
   */
  public static JsonField parseRoot(
      InputStream in, String source, String what, int maxString, int maxDepth) {
    return JsonParsing.root(in, source, what, maxString, maxDepth);
  }

  // The optional… readers below test for the child by hand rather than through Optional.map: each
  // lambda or method reference costs a class spun at its first call, and a command-line run reads
  // a sheet once, in a fresh JVM (DEVELOPERS.md, "Start-up of the command line").

  /** Returns an optional child field, or null when the key is missing or null. */
  private JsonField orNull(String key) {
    JsonNode child = node.get(key);
    return child == null || child.isNull() ? null : new JsonField(source, at(key), child);
  }

  /** Returns an optional child string, or {@code absent} when the key is missing or null. */
  public String optionalText(String key, String absent) {
    JsonField child = orNull(key);
    return child == null ? absent : child.text();
  }

  /**
   * Returns an optional child string that must not be blank (see {@link #name}), or {@code absent}
   * when the key is missing or null.
   */
  public String optionalName(String key, String expected, String absent) {
    JsonField child = orNull(key);
    return child == null ? absent : child.name(expected);
  }

  /** Returns the elements of an optional child array; an absent or null key gives none. */
  public List<JsonField> optionalElements(String key, String what) {
    JsonField child = orNull(key);
    return child == null ? List.of() : child.elements(what);
  }

  /**
   * Returns an optional child number (see {@link #number}), or {@code absent} when the key is
   * missing or null.
   */
  public double optionalNumber(String key, String expected, double absent) {
    JsonField child = orNull(key);
    return child == null ? absent : child.number(expected);
  }

  /**
   * Returns an optional child number of 0 or more (see {@link #nonNegative}), or {@code absent}
   * when the key is missing or null.
   */
  public double optionalNonNegative(String key, String expected, double absent) {
    JsonField child = orNull(key);
    return child == null ? absent : child.nonNegative(expected);
  }

  /** Returns an optional child integer, or {@code absent} when the key is missing or null. */
  public int optionalInteger(String key, String expected, int absent) {
    JsonField child = orNull(key);
    return child == null ? absent : child.integer(expected);
  }

  /**
   * Returns an optional child tolerance (see {@link #tolerance}), or {@code absent} when the key is
   * missing or null.
   */
  public double optionalTolerance(String key, double absent) {
    JsonField child = orNull(key);
    return child == null ? absent : child.tolerance();
  }

  /**
   * Returns an optional child {@code true} or {@code false}, or {@code absent} when the key is
   * missing or null.
   *
   * @throws InvalidInputException if the child is present and not a JSON boolean
   */
  public boolean optionalBoolean(String key, boolean absent) {
    JsonField child = orNull(key);
    if (child == null) {
      return absent;
    }
    if (!child.node.isBoolean()) {
      throw child.error("expected true or false, found " + describe(child.node));
    }
    return child.node.booleanValue();
  }

  /** Returns this field as an array of strings. */
  public List<String> texts(String what) {
    List<String> texts = new ArrayList<>();
    for (JsonField element : elements(what)) {
      texts.add(element.text());
    }
    return texts;
  }

  /** Returns this field as a finite JSON number (no unit prefixes: for machine-written files). */
  public double finite(String expected) {
    if (!node.isNumber()) {
      throw error("expected " + expected + " (a number), found " + describe(node));
    }
    double value = node.doubleValue();
    if (!Double.isFinite(value)) {
      throw error("expected " + expected + " as a finite number, found " + describe(node));
    }
    return value;
  }

  /**
   * Returns this field as one of a fixed set of words.
   *
   * @param parse the word's parser, empty for an unknown word
   * @param expected the words accepted, for the message, e.g. "open or closed"
   */
  public <T> T word(Function<String, Optional<T>> parse, String expected) {
    Optional<T> parsed = parse.apply(text());
    if (parsed.isEmpty()) {
      throw error("expected " + expected + ", found " + describe(node));
    }
    return parsed.get();
  }

  /** Returns this field as a UTC time such as {@code 2026-03-04T10:15:30Z}. */
  public Instant time() {
    String text = text();
    try {
      Instant fast = UtcText.fastUtc(text);
      return fast != null ? fast : Instant.parse(text);
    } catch (DateTimeParseException e) {
      throw error("expected a UTC time such as 2026-03-04T10:15:30Z, found " + describe(node));
    }
  }

  /** Returns a short description of what a node holds, for messages. */
  public static String describe(JsonNode node) {
    if (node.isTextual()) {
      return "the string " + quoted(node.asText());
    }
    if (node.isNumber() && !Double.isFinite(node.doubleValue())) {
      // JSON has no NaN or infinity; say so without printing one as if it were a result.
      return "a number that is not finite (\"" + node.asText() + "\", which JSON does not allow)";
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

  /**
   * Returns a user's text in quotes for a message, on one line: control characters escaped, and cut
   * after 60 characters with the full length said.
   */
  static String quoted(String text) {
    StringBuilder out = new StringBuilder("\"");
    int shown = Math.min(text.length(), 60);
    for (int i = 0; i < shown; i++) {
      char c = text.charAt(i);
      if (c == '\n') {
        out.append("\\n");
      } else if (Character.isISOControl(c)) {
        out.append(String.format(Locale.ROOT, "\\u%04x", (int) c));
      } else {
        out.append(c);
      }
    }
    out.append('"');
    if (text.length() > shown) {
      out.insert(out.length() - 1, "…").append(" (").append(text.length()).append(" characters)");
    }
    return out.toString();
  }

  private static String printed(double value) {
    if (!Double.isFinite(value)) {
      return "a number that is not finite";
    }
    return value == Math.rint(value) && Math.abs(value) < 1e15
        ? Long.toString((long) value)
        : Double.toString(value);
  }
}

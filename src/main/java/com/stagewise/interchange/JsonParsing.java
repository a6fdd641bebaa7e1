package com.stagewise.interchange;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonParseException;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadConstraints;
import com.fasterxml.jackson.core.exc.StreamConstraintsException;
import com.fasterxml.jackson.core.io.JsonEOFException;
import com.fasterxml.jackson.core.json.JsonReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.stagewise.circuit.InvalidInputException;
import java.io.IOException;
import java.io.InputStream;

/**
 * Turns a JSON text into the root {@link JsonField} of a document, strictly (duplicate keys and
 * trailing text refused), with Jackson's parse errors put into plain sentences that name the line
 * and column.
 */
final class JsonParsing {
  private static final ObjectMapper MAPPER =
      JsonMapper.builder()
          .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
          // Read NaN and Infinity so that the complaint can name the field instead of the column.
          .enable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
          .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
          .build();

  private JsonParsing() {}

  /**
   * Returns the root object of a JSON text.
   *
   * @throws InvalidInputException if the text is not JSON or its top is not an object
   */
  static JsonField root(String text, String source) {
    JsonNode root;
    try {
      root = MAPPER.readTree(text);
    } catch (JsonProcessingException e) {
      throw new InvalidInputException(source, "", parseProblem(e));
    }
    if (root == null || root.isMissingNode()) {
      throw new InvalidInputException(source, "", "the file is empty (expected a JSON object {…})");
    }
    JsonField field = JsonField.top(source, root);
    if (!root.isObject()) {
      throw field.error("expected a JSON object {…} at the top, found " + JsonField.describe(root));
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

  /**
   * Returns the root object of a JSON document read from {@code in}, refusing strings longer than
   * {@code maxString} characters and nesting deeper than {@code maxDepth} levels before they are
   * held in memory.
   *
   * @param what what the document is, for messages, e.g. "a history bundle"
   * @throws InvalidInputException if the text is not JSON, exceeds the limits or is not an object
   */
  static JsonField root(InputStream in, String source, String what, int maxString, int maxDepth) {
    ObjectMapper mapper =
        JsonMapper.builder(
                JsonFactory.builder()
                    .streamReadConstraints(
                        StreamReadConstraints.builder()
                            .maxStringLength(maxString)
                            .maxNestingDepth(maxDepth)
                            .build())
                    .build())
            .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
            .enable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .build();
    JsonNode root;
    try {
      root = mapper.readTree(in);
    } catch (StreamConstraintsException e) {
      String original = e.getOriginalMessage() == null ? "" : e.getOriginalMessage();
      String problem =
          original.contains("nesting depth")
              ? "nested deeper than " + maxDepth + " levels (expected " + what + ")"
              : original.contains("String value length") || original.contains("string length")
                  ? "holds a text longer than "
                      + maxString
                      + " characters (more than "
                      + what
                      + " ever needs)"
                  : "is larger than " + what + " may be";
      throw new InvalidInputException(source, "", "the file " + problem);
    } catch (JsonProcessingException e) {
      throw new InvalidInputException(source, "", parseProblem(e));
    } catch (IOException e) {
      throw new InvalidInputException(source, "", "cannot read the file: " + e.getMessage());
    }
    if (root == null || root.isMissingNode()) {
      throw new InvalidInputException(
          source, "", "the file is empty (expected " + what + ", a JSON object {…})");
    }
    JsonField field = JsonField.top(source, root);
    if (!root.isObject()) {
      throw field.error(
          "expected "
              + what
              + " as a JSON object {…} at the top, found "
              + JsonField.describe(root));
    }
    return field;
  }
}

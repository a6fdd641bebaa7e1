package com.stagewise.interchange;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonParseException;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.StreamReadConstraints;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.core.exc.StreamConstraintsException;
import com.fasterxml.jackson.core.io.JsonEOFException;
import com.fasterxml.jackson.core.json.JsonReadFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.InvalidInputException;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;

/**
 * Turns a JSON text into the root {@link JsonField} of a document, strictly (duplicate keys and
 * trailing text refused), with Jackson's parse errors put into plain sentences that name the line
 * and column.
 */
final class JsonParsing {
  /**
   * Jackson's streaming reader, strict about duplicate keys; the tree is built by {@link #tree}
   * rather than by an {@code ObjectMapper}, whose set-up in a fresh JVM cost about as long as
   * solving a demo stage (DEVELOPERS.md, "Start-up of the command line").
   */
  private static final JsonFactory FACTORY =
      JsonFactory.builder()
          .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
          // Read NaN and Infinity so that the complaint can name the field instead of the column.
          .enable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
          .build();

  private JsonParsing() {}

  /**
   * Returns the root object of a JSON text.
   *
   * @throws InvalidInputException if the text is not JSON or its top is not an object
   */
  static JsonField root(String text, String source) {
    JsonNode root;
    try (JsonParser parser = FACTORY.createParser(text)) {
      root = document(parser);
    } catch (JsonProcessingException e) {
      throw new InvalidInputException(source, "", parseProblem(e));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
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

  /**
   * Returns the one value of a document, or null for an empty text.
   *
   * @throws JsonParseException if more text follows the value
   */
  private static JsonNode document(JsonParser parser) throws IOException {
    if (parser.nextToken() == null) {
      return null;
    }
    JsonNode root = tree(parser);
    JsonToken after = parser.nextToken();
    if (after != null) {
      throw new JsonParseException(
          parser, "Trailing token (of type " + after + ") found after the value");
    }
    return root;
  }

  /**
   * Returns the value at the parser's current token as a tree, with the node types Jackson's own
   * tree reader gives: whole numbers as int, long or big integer nodes by size, others as doubles
   * (NaN and the infinities included).
   */
  private static JsonNode tree(JsonParser parser) throws IOException {
    JsonNodeFactory nodes = JsonNodeFactory.instance;
    switch (parser.currentToken()) {
      case START_OBJECT -> {
        ObjectNode object = nodes.objectNode();
        while (parser.nextToken() == JsonToken.FIELD_NAME) {
          String key = parser.currentName();
          parser.nextToken();
          object.set(key, tree(parser));
        }
        return object;
      }
      case START_ARRAY -> {
        ArrayNode array = nodes.arrayNode();
        while (parser.nextToken() != JsonToken.END_ARRAY) {
          array.add(tree(parser));
        }
        return array;
      }
      case VALUE_STRING -> {
        return nodes.textNode(parser.getText());
      }
      case VALUE_NUMBER_INT -> {
        return switch (parser.getNumberType()) {
          case INT -> nodes.numberNode(parser.getIntValue());
          case LONG -> nodes.numberNode(parser.getLongValue());
          default -> nodes.numberNode(parser.getBigIntegerValue());
        };
      }
      case VALUE_NUMBER_FLOAT -> {
        return nodes.numberNode(parser.getDoubleValue());
      }
      case VALUE_TRUE -> {
        return nodes.booleanNode(true);
      }
      case VALUE_FALSE -> {
        return nodes.booleanNode(false);
      }
      case VALUE_NULL -> {
        return nodes.nullNode();
      }
      default -> throw new JsonParseException(parser, "Unexpected token " + parser.currentToken());
    }
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
    JsonFactory factory =
        JsonFactory.builder()
            .streamReadConstraints(
                StreamReadConstraints.builder()
                    .maxStringLength(maxString)
                    .maxNestingDepth(maxDepth)
                    .build())
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .enable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
            .build();
    JsonNode root;
    try (JsonParser parser = factory.createParser(in)) {
      root = document(parser);
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

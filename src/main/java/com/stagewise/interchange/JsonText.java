package com.stagewise.interchange;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamWriteFeature;
import com.fasterxml.jackson.core.util.MinimalPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.ObjectWriter;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.util.List;
import java.util.Map;

/**
 * Prints JSON documents for people to read: top-level fields one per line, each array element on
 * its own line in a compact {@code {"key": value, …}} form, as in the contracts of the design
 * notes.
 */
final class JsonText {
  private JsonText() {}

  private static final ObjectMapper MAPPER =
      JsonMapper.builder().enable(StreamWriteFeature.WRITE_BIGDECIMAL_AS_PLAIN).build();

  /** A compact printer with a space after each colon and comma, for one-line objects. */
  private static final class OneLine extends MinimalPrettyPrinter {
    private static final long serialVersionUID = 1L;

    @Override
    public void writeObjectFieldValueSeparator(JsonGenerator g) throws IOException {
      g.writeRaw(": ");
    }

    @Override
    public void writeObjectEntrySeparator(JsonGenerator g) throws IOException {
      g.writeRaw(", ");
    }

    @Override
    public void writeArrayValueSeparator(JsonGenerator g) throws IOException {
      g.writeRaw(", ");
    }
  }

  private static final ObjectWriter ONE_LINE = MAPPER.writer(new OneLine());

  /** Returns a new empty object node. */
  static ObjectNode object() {
    return JsonNodeFactory.instance.objectNode();
  }

  /**
   * Returns a number node for a double: whole numbers print without a fraction ({@code 15}, not
   * {@code 15.0}), others in plain decimal form where that is short ({@code 0.0000235}).
   *
   * @throws IllegalArgumentException for NaN or an infinity, which JSON cannot hold
   */
  static JsonNode number(double value) {
    if (!Double.isFinite(value)) {
      throw new IllegalArgumentException("not a finite number: " + value);
    }
    if (value == Math.rint(value) && Math.abs(value) < 1e15) {
      return JsonNodeFactory.instance.numberNode((long) value);
    }
    double magnitude = Math.abs(value);
    if (magnitude >= 1e-7 && magnitude < 1e15) {
      // BigDecimal.valueOf uses the shortest decimal that reads back as the same double. A small
      // value with all 17 digits would print as a run of more than 20 digits in plain form; it
      // keeps the exponent form then.
      String plain = BigDecimal.valueOf(value).toPlainString();
      if (digits(plain) <= 20) {
        return JsonNodeFactory.instance.numberNode(new BigDecimal(plain));
      }
    }
    return JsonNodeFactory.instance.numberNode(value);
  }

  /** Returns how many digits a text has (a loop rather than a stream: see {@link #number}). */
  private static int digits(String text) {
    int digits = 0;
    for (int i = 0; i < text.length(); i++) {
      if (Character.isDigit(text.charAt(i))) {
        digits++;
      }
    }
    return digits;
  }

  /** Returns a JSON text printed on one line (no line breaks inside). */
  static String compact(String json) {
    try {
      return MAPPER.writeValueAsString(MAPPER.readTree(json));
    } catch (JsonProcessingException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Returns one node printed on one line. */
  static String oneLine(JsonNode node) {
    try {
      return ONE_LINE.writeValueAsString(node);
    } catch (JsonProcessingException e) {
      throw new UncheckedIOException(e);
    }
  }

  /**
   * Returns a document: each entry of {@code fields} on its own line; a list value becomes an array
   * with one element per line; any other value is a node printed on one line.
   */
  static String document(Map<String, Object> fields) {
    StringBuilder text = new StringBuilder("{\n");
    int left = fields.size();
    for (Map.Entry<String, Object> field : fields.entrySet()) {
      text.append("  ")
          .append(oneLine(JsonNodeFactory.instance.textNode(field.getKey())))
          .append(": ");
      if (field.getValue() instanceof List<?> list) {
        if (list.isEmpty()) {
          text.append("[]");
        } else {
          text.append("[\n");
          for (int i = 0; i < list.size(); i++) {
            text.append("    ")
                .append(oneLine((JsonNode) list.get(i)))
                .append(i + 1 < list.size() ? ",\n" : "\n");
          }
          text.append("  ]");
        }
      } else {
        text.append(oneLine((JsonNode) field.getValue()));
      }
      text.append(--left > 0 ? ",\n" : "\n");
    }
    return text.append("}\n").toString();
  }
}

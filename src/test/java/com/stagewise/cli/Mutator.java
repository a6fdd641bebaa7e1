package com.stagewise.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/**
 * Makes hostile variants of a JSON document, the way an outside probe does: absurd numbers, wrong
 * types, missing and unknown keys, huge or empty strings, lists grown far beyond any real stage,
 * truncated or garbled text, deep nesting and bytes that are not UTF-8. Seeded: the same seed gives
 * the same documents.
 */
final class Mutator {
  private static final ObjectMapper MAPPER = new ObjectMapper();
  private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

  /**
   * Numbers an outside probe tries first: extremes, signs, zero, sub-normals, whole-number giants.
   */
  private static final String[] NUMBERS = {
    "1e308",
    "-1e308",
    "1e200",
    "-1e200",
    "0",
    "-0.0",
    "4.9e-324",
    "1e-320",
    "-1",
    "-15",
    "1e15",
    "123456789012345678901234567890",
    "0.5",
    "1e6",
    "2147483648",
    "-2147483649",
    "1e-3",
    "1e12",
    "1e13",
    "100000000",
    "0.0001",
    "3"
  };

  /** Strings an outside probe tries in value fields: bad codes, extremes in words, injections. */
  private static final String[] STRINGS = {
    "",
    "   ",
    "NaN",
    "Infinity",
    "-Infinity",
    "1e999",
    "-5",
    "4k7",
    "10k",
    "1e-400",
    "200%",
    "-1%",
    "1%",
    "100n",
    "0R",
    "R",
    "k",
    "4k7k",
    "1..2",
    "GND",
    "VCC",
    "OUT",
    "U1.99",
    "U1.0",
    "U1.-1",
    "'; DROP TABLE units; --",
    "\u0000",
    "line\nbreak",
    "Ω",
    "\uD83D\uDE00",
    "resistor",
    "capacitor",
    "dual-8",
    "quad-14",
    "rail-to-rail",
    "Z",
    "stagewise-stage",
    "stagewise-readings",
    "stagewise-history",
    "00000000-0000-0000-0000-000000000000",
    "9999-12-31T23:59:59Z",
    "not json at all",
    "{}",
    "2026-13-45T99:99:99Z"
  };

  private final SplittableRandom random;

  Mutator(long seed) {
    this.random = new SplittableRandom(seed);
  }

  /** Returns a hostile variant of a document's text, as the bytes of a file. */
  byte[] mutate(String seedText) {
    int roll = random.nextInt(100);
    if (roll < 70) {
      JsonNode root = parse(seedText);
      int edits = 1 + (random.nextInt(4) == 0 ? random.nextInt(4) : 0);
      for (int i = 0; i < edits; i++) {
        root = mutateTree(root);
      }
      return text(root).getBytes(StandardCharsets.UTF_8);
    }
    return mutateText(seedText);
  }

  private static JsonNode parse(String text) {
    try {
      return MAPPER.readTree(text);
    } catch (Exception e) {
      throw new IllegalStateException("a document to mutate must be JSON", e);
    }
  }

  private static String text(JsonNode node) {
    try {
      return MAPPER.writerWithDefaultPrettyPrinter().writeValueAsString(node);
    } catch (Exception e) {
      throw new IllegalStateException(e);
    }
  }

  /** A place in the tree: the container and the key or index of one of its children. */
  private record Slot(JsonNode parent, String key, int index) {
    JsonNode get() {
      return key != null ? parent.get(key) : parent.get(index);
    }

    void set(JsonNode value) {
      if (key != null) {
        ((ObjectNode) parent).set(key, value);
      } else {
        ((ArrayNode) parent).set(index, value);
      }
    }

    void remove() {
      if (key != null) {
        ((ObjectNode) parent).remove(key);
      } else {
        ((ArrayNode) parent).remove(index);
      }
    }
  }

  private JsonNode mutateTree(JsonNode root) {
    List<Slot> slots = new ArrayList<>();
    collect(root, slots);
    if (slots.isEmpty()) {
      return NODES.textNode(pick(STRINGS));
    }
    Slot slot = slots.get(random.nextInt(slots.size()));
    JsonNode old = slot.get();
    switch (random.nextInt(12)) {
      case 0, 1, 2 -> slot.set(number(pick(NUMBERS)));
      case 3, 4 -> slot.set(NODES.textNode(pick(STRINGS)));
      case 5 -> slot.set(otherType(old));
      case 6 -> slot.remove();
      case 7 -> {
        if (slot.parent().isObject()) {
          ((ObjectNode) slot.parent()).set("extra" + random.nextInt(3), old.deepCopy());
        } else {
          slot.set(NODES.nullNode());
        }
      }
      case 8 -> slot.set(NODES.textNode(longString()));
      case 9 -> grow(slot, old);
      case 10 -> slot.set(nested(random.nextInt(3) == 0 ? 400 : 20));
      default -> swapWithAnother(slot, slots);
    }
    return root;
  }

  private void collect(JsonNode node, List<Slot> slots) {
    if (node.isObject()) {
      Iterator<Map.Entry<String, JsonNode>> fields = node.fields();
      while (fields.hasNext()) {
        Map.Entry<String, JsonNode> field = fields.next();
        slots.add(new Slot(node, field.getKey(), -1));
        collect(field.getValue(), slots);
      }
    } else if (node.isArray()) {
      for (int i = 0; i < node.size(); i++) {
        slots.add(new Slot(node, null, i));
        collect(node.get(i), slots);
      }
    }
  }

  private static JsonNode number(String text) {
    return parse(text);
  }

  private JsonNode otherType(JsonNode old) {
    return switch (random.nextInt(5)) {
      case 0 -> NODES.nullNode();
      case 1 -> NODES.booleanNode(random.nextBoolean());
      case 2 -> NODES.arrayNode().add(old.deepCopy());
      case 3 -> NODES.objectNode().set("value", old.deepCopy());
      default -> old.isTextual() ? number(pick(NUMBERS)) : NODES.textNode(old.toString());
    };
  }

  private String longString() {
    int length = random.nextInt(3) == 0 ? 70_000 : 41 + random.nextInt(300);
    StringBuilder text = new StringBuilder(length);
    for (int i = 0; i < length; i++) {
      text.append((char) ('a' + random.nextInt(26)));
    }
    return text.toString();
  }

  /** Repeats an array's elements (or wraps a value in a long array) far beyond any real stage. */
  private void grow(Slot slot, JsonNode old) {
    int copies = random.nextInt(2) == 0 ? 120 + random.nextInt(400) : 2 + random.nextInt(8);
    ArrayNode grown = NODES.arrayNode();
    if (old.isArray() && old.size() > 0) {
      for (int i = 0; i < copies; i++) {
        grown.add(old.get(i % old.size()).deepCopy());
      }
    } else {
      for (int i = 0; i < copies; i++) {
        grown.add(old.deepCopy());
      }
    }
    slot.set(grown);
  }

  private static JsonNode nested(int depth) {
    JsonNode node = NODES.numberNode(1);
    for (int i = 0; i < depth; i++) {
      node = NODES.arrayNode().add(node);
    }
    return node;
  }

  private void swapWithAnother(Slot slot, List<Slot> slots) {
    Slot other = slots.get(random.nextInt(slots.size()));
    JsonNode a = slot.get();
    JsonNode b = other.get();
    if (a == null || b == null || a == slot.parent() || containsNode(a, other.parent())) {
      slot.set(NODES.textNode(pick(STRINGS)));
      return;
    }
    slot.set(b.deepCopy());
  }

  private static boolean containsNode(JsonNode tree, JsonNode node) {
    if (tree == node) {
      return true;
    }
    for (JsonNode child : tree) {
      if (containsNode(child, node)) {
        return true;
      }
    }
    return false;
  }

  private byte[] mutateText(String text) {
    int at = text.isEmpty() ? 0 : random.nextInt(text.length());
    String mutated =
        switch (random.nextInt(10)) {
          case 0 -> text.substring(0, at);
          case 1 ->
              text.substring(0, at)
                  + pick(new String[] {",", "}", "]", "\"", ":", "{", "["})
                  + text.substring(at);
          case 2 -> text.isEmpty() ? "" : text.substring(0, at) + text.substring(at + 1);
          case 3 -> text + pick(new String[] {"{}", "x", " [1]", "\u0000", "}"});
          case 4 -> "";
          case 5 -> "\uFEFF" + text;
          case 6 -> duplicateKey(text);
          case 7 -> "[".repeat(5000) + "]".repeat(5000);
          case 8 -> replaceNumberWithToken(text);
          default -> pick(new String[] {"null", "[]", "42", "\"text\"", "{\"format\": 1}"});
        };
    byte[] bytes = mutated.getBytes(StandardCharsets.UTF_8);
    if (random.nextInt(20) == 0 && bytes.length > 0) {
      // Bytes that are not UTF-8: a lone continuation byte and an invalid lead byte.
      bytes[random.nextInt(bytes.length)] = (byte) (random.nextBoolean() ? 0x80 : 0xFF);
    }
    return bytes;
  }

  private String duplicateKey(String text) {
    int brace = text.indexOf('{');
    int colon = text.indexOf(':', brace);
    if (brace < 0 || colon < 0) {
      return text;
    }
    String firstPair = text.substring(brace + 1, text.indexOf(',', colon) + 1);
    return text.substring(0, brace + 1) + firstPair + text.substring(brace + 1);
  }

  /** Puts a token that is not a JSON number (NaN, Infinity, a leading plus) where a number was. */
  private String replaceNumberWithToken(String text) {
    java.util.regex.Matcher m = java.util.regex.Pattern.compile(":\\s*-?[0-9]").matcher(text);
    List<Integer> starts = new ArrayList<>();
    while (m.find()) {
      starts.add(m.end() - 1);
    }
    if (starts.isEmpty()) {
      return text;
    }
    int start = starts.get(random.nextInt(starts.size()));
    int end = start;
    while (end < text.length() && "0123456789.eE+-".indexOf(text.charAt(end)) >= 0) {
      end++;
    }
    String token = pick(new String[] {"NaN", "Infinity", "-Infinity", "+1", "0x10", "1e99999"});
    return text.substring(0, start) + token + text.substring(end);
  }

  private String pick(String[] options) {
    return options[random.nextInt(options.length)];
  }
}

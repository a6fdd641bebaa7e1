package com.stagewise.interchange;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.LedColour;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.value.ZenerMarking;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads and writes the {@code parts} of a stage sheet: resistors and capacitors (version 1),
 * diodes, zeners, LEDs, trimmers and potentiometers (version 2), each with the keys its kind
 * allows.
 */
final class SheetParts {
  static final List<String> PART_KEYS =
      List.of("ref", "kind", "value", "tolerance", "nets", "class", "colour", "position", "sealed");

  /** A trimmer's wiper position when the sheet gives none: mid-travel (DESIGN.md). */
  static final double DEFAULT_POSITION = 0.5;

  /**
   * Tolerance of a trimmer's end-to-end value when the sheet gives none (20 %, common practice).
   */
  static final double DEFAULT_TRIMMER_TOLERANCE = 0.20;

  private SheetParts() {}

  static ObjectNode node(Part part) {
    ArrayNode nets = JsonNodeFactory.instance.arrayNode();
    for (String net : part.nets()) {
      nets.add(net);
    }
    ObjectNode node = JsonText.object().put("ref", part.ref()).put("kind", part.kind().word());
    PartKind kind = part.kind();
    if (kind == PartKind.DIODE) {
      node.put("class", part.diodeClass().word());
    } else if (kind == PartKind.LED) {
      node.put("colour", part.colour().word());
    } else if (kind == PartKind.ZENER) {
      node.put("value", ZenerMarking.format(part.value()));
    } else {
      node.put("value", ValueText.format(part.value(), kind.isOhms()));
    }
    if (kind != PartKind.DIODE && kind != PartKind.LED) {
      node.put("tolerance", ValueText.formatTolerance(part.tolerance()));
    }
    if (kind.isTrimmer()) {
      node.set("position", JsonText.number(part.position()));
      if (part.sealed()) {
        node.put("sealed", true);
      }
    }
    node.set("nets", nets);
    return node;
  }

  static Part part(JsonField field, int version) {
    field.object("a part", PART_KEYS);
    String ref = field.require("ref", "the designator, e.g. R1").name("the designator, e.g. R1");
    PartKind kind;
    JsonField kindField = field.require("kind", PartKind.words());
    try {
      kind = PartKind.of(kindField.name(PartKind.words()));
    } catch (InvalidInputException e) {
      throw kindField.rewrap(e, "");
    }
    if (kind.sheetVersion() > version) {
      throw kindField.error(
          "kind "
              + kind.word()
              + " needs a stage sheet of version "
              + kind.sheetVersion()
              + " (expected \"version\": "
              + kind.sheetVersion()
              + " at the top of the sheet)");
    }
    for (String key : List.of("class", "colour", "position", "sealed")) {
      boolean allowed =
          switch (key) {
            case "class" -> kind == PartKind.DIODE;
            case "colour" -> kind == PartKind.LED;
            default -> kind.isTrimmer();
          };
      if (!allowed && field.optional(key).isPresent()) {
        throw field
            .optional(key)
            .orElseThrow()
            .error("a " + kind.word() + " has no \"" + key + "\" (remove it, or check the kind)");
      }
    }
    if ((kind == PartKind.DIODE || kind == PartKind.LED) && field.optional("value").isPresent()) {
      throw field
          .optional("value")
          .orElseThrow()
          .error(
              "a "
                  + kind.word()
                  + " has no value (its "
                  + (kind == PartKind.LED ? "colour" : "class")
                  + " sets its figures): remove \"value\"");
    }
    double value = 0;
    if (kind == PartKind.ZENER) {
      JsonField valueField =
          field.require("value", "the zener's voltage, a marking such as 5V1, 12V or 3.3V");
      value = zenerVolts(valueField);
    } else if (!kind.isJunction()) {
      String unit = kind.isOhms() ? "ohms, e.g. 4k7 or 470R" : "farads, e.g. 100n or 2u2";
      value = field.require("value", "the value in " + unit).nonNegative("the value in " + unit);
    }
    double defaultTolerance =
        switch (kind) {
          case RESISTOR -> StageSheet.DEFAULT_RESISTOR_TOLERANCE;
          case TRIMMER, POTENTIOMETER -> DEFAULT_TRIMMER_TOLERANCE;
          default -> StageSheet.DEFAULT_CAPACITOR_TOLERANCE;
        };
    double tolerance =
        kind == PartKind.DIODE || kind == PartKind.LED
            ? 0
            : field.optionalTolerance("tolerance", defaultTolerance);
    int count = kind.isTrimmer() ? 3 : 2;
    String shape =
        kind.isTrimmer()
            ? "three net names [end, wiper, end], e.g. [\"OUT\", \"FB\", \"GND\"]"
            : kind.isJunction()
                ? "two net names [anode, cathode], e.g. [\"OUT\", \"RECT\"]"
                : "two net names, the nets the part joins, e.g. [\"IN\", \"SUM\"]";
    JsonField netsField = field.require("nets", shape);
    List<JsonField> nets = netsField.elements(shape);
    if (nets.size() != count) {
      throw netsField.error(
          ref
              + " is a "
              + kind.word()
              + ": expected "
              + shape
              + ", found "
              + nets.size()
              + (nets.size() == 1 ? " net" : " nets"));
    }
    List<String> names = new ArrayList<>();
    for (JsonField net : nets) {
      names.add(net.name("a net name"));
    }
    DiodeClass diodeClass = null;
    if (kind == PartKind.DIODE) {
      JsonField classField = field.optional("class").orElse(null);
      if (classField != null) {
        try {
          diodeClass = DiodeClass.of(classField.name("silicon or schottky"));
        } catch (InvalidInputException e) {
          throw classField.rewrap(e, "");
        }
      }
    }
    LedColour colour = null;
    if (kind == PartKind.LED) {
      JsonField colourField =
          field.require("colour", "the LED's colour (" + LedColour.words() + ")");
      try {
        colour = LedColour.of(colourField.name(LedColour.words()));
      } catch (InvalidInputException e) {
        throw colourField.rewrap(e, "");
      }
    }
    double position = Double.NaN;
    boolean sealed = false;
    if (kind.isTrimmer()) {
      position =
          field.optionalNumber(
              "position", "the wiper position, from 0 to 1 (e.g. 0.5)", DEFAULT_POSITION);
      sealed = field.optionalBoolean("sealed", false);
    }
    try {
      if (kind.isTrimmer()) {
        return new Part(
            ref,
            kind,
            value,
            tolerance,
            names.get(0),
            names.get(2),
            names.get(1),
            position,
            sealed,
            null,
            null);
      }
      return new Part(
          ref,
          kind,
          value,
          tolerance,
          names.get(0),
          names.get(1),
          null,
          Double.NaN,
          false,
          diodeClass,
          colour);
    } catch (InvalidInputException e) {
      throw field.rewrap(e, e.field());
    }
  }

  private static double zenerVolts(JsonField valueField) {
    JsonNode node = valueField.node();
    if (node.isNumber()) {
      return valueField.nonNegative("the zener's voltage in volts, e.g. 5.1");
    }
    if (!node.isTextual()) {
      throw valueField.error(
          "expected the zener's voltage, a marking such as 5V1, 12V or 3.3V, found "
              + JsonField.describe(node));
    }
    try {
      return ZenerMarking.parse(node.textValue());
    } catch (InvalidInputException e) {
      throw valueField.rewrap(e, "");
    }
  }
}

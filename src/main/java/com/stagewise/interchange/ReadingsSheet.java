package com.stagewise.interchange;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Limits;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.OhmsSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingRules;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * Reads and writes readings files ({@code *.readings.json}, format {@code stagewise-readings},
 * version 1) for one stage.
 *
 * <p>Each reading's {@code at} is a net of the stage or a pin {@code PACKAGE.PIN} of one of its
 * packages (version 2 also a part lead such as {@code R2.1}). {@code meter} is optional ({@link
 * MeterSpec#DEFAULT}); so is each of its fields, which then takes the default's figure. An {@code
 * ac} reading without {@code hz} takes the frequency of the stage's first AC input; one without
 * {@code measure} is stated in the measure of that input (version-1 behaviour). Every rule of
 * {@link ReadingRules} applies (test points, plausible values, the meter's figures, the number of
 * readings), with its message.
 */
public final class ReadingsSheet {
  /** The {@code format} of a readings file. */
  public static final String FORMAT = "stagewise-readings";

  /**
   * The newest version this program reads. Version 2 adds ohms readings ({@code "to"}, {@code
   * "ohms"}), the meter's {@code ohms} spec and part leads as points; a set that uses none of them
   * is written as version 1.
   */
  public static final int VERSION = 2;

  /** The file name ending of readings files. */
  public static final String SUFFIX = ".readings.json";

  private static final List<String> ROOT_KEYS = List.of("format", "version", "meter", "readings");
  private static final List<String> METER_KEYS =
      List.of("percent", "counts", "displayCounts", "ohms");
  private static final List<String> OHMS_KEYS = List.of("percent", "counts");
  private static final List<String> READING_KEYS =
      List.of("at", "to", "dc", "ac", "ohms", "hz", "uncertainty", "measure");

  /** The meter's over-range, as a readings file writes it. */
  public static final String OVER_RANGE = "OL";

  private ReadingsSheet() {}

  /**
   * Returns the readings of a file, checked against the stage they were taken on.
   *
   * @throws InvalidInputException naming the file, the JSON path and what was expected
   */
  public static ReadingSet read(Path file, Stage stage) {
    return read(SheetFiles.readText(file), file.toString(), stage);
  }

  /**
   * Returns the readings of a text, checked against the stage they were taken on.
   *
   * @param source the file name or screen named in messages
   * @throws InvalidInputException naming the source, the JSON path and what was expected
   */
  public static ReadingSet read(String json, String source, Stage stage) {
    SheetFiles.requireSize(json, source);
    JsonField root = JsonField.parseRoot(json, source);
    root.requireHeader(FORMAT, VERSION, "a readings file");
    root.object("a readings file", ROOT_KEYS);
    int version = root.require("version", "").integer("the version number");
    Optional<JsonField> meterField = root.optional("meter");
    MeterSpec meter = meterField.isPresent() ? meter(meterField.get(), version) : MeterSpec.DEFAULT;
    List<JsonField> fields = root.require("readings", "an array of readings").elements("readings");
    if (fields.size() > Limits.MAX_READINGS) {
      throw root.require("readings", "")
          .error(
              fields.size()
                  + " readings is more than this program takes for one set (at most "
                  + Limits.MAX_READINGS
                  + ")");
    }
    List<Reading> readings = new ArrayList<>();
    for (JsonField field : fields) {
      readings.add(reading(field, stage, version));
    }
    ReadingSet set = new ReadingSet(meter, readings);
    ReadingRules.requireSound(stage, set, source);
    return set;
  }

  /** Returns the text of a readings file, ending in a newline. */
  public static String write(ReadingSet set) {
    Map<String, Object> fields = new LinkedHashMap<>();
    JsonNodeFactory nodes = JsonNodeFactory.instance;
    fields.put("format", nodes.textNode(FORMAT));
    fields.put("version", nodes.numberNode(needsVersion2(set) ? 2 : 1));
    MeterSpec meter = set.meter();
    ObjectNode meterNode =
        JsonText.object()
            .<ObjectNode>set("percent", JsonText.number(meter.percent()))
            .put("counts", meter.counts())
            .put("displayCounts", meter.displayCounts());
    if (!meter.ohms().equals(OhmsSpec.DEFAULT)) {
      meterNode.set(
          "ohms",
          JsonText.object()
              .<ObjectNode>set("percent", JsonText.number(meter.ohms().percent()))
              .put("counts", meter.ohms().counts()));
    }
    fields.put("meter", meterNode);
    List<JsonNode> readings = new ArrayList<>();
    for (Reading reading : set.readings()) {
      ObjectNode node = JsonText.object().put("at", reading.at());
      if (reading.kind() == Reading.Kind.OHMS) {
        node.put("to", reading.to());
      }
      if (reading.isOverRange()) {
        node.put("ohms", OVER_RANGE);
      } else {
        node.set(reading.kind().word(), JsonText.number(reading.value()));
      }
      if (reading.kind() == Reading.Kind.AC) {
        node.set("hz", JsonText.number(reading.hz()));
      }
      // Only a measure the reading states is written: a version-1 file reads back byte for byte.
      if (reading.measure().isPresent()) {
        node.put("measure", reading.measure().get().word());
      }
      if (reading.uncertainty().isPresent()) {
        node.set("uncertainty", JsonText.number(reading.uncertainty().getAsDouble()));
      }
      readings.add(node);
    }
    fields.put("readings", readings);
    return JsonText.document(fields);
  }

  /**
   * Writes readings to a file (UTF-8), replacing it.
   *
   * @throws InvalidInputException if the file cannot be written (naming the file)
   */
  public static void write(ReadingSet set, Path file) {
    SheetFiles.writeText(file, write(set));
  }

  /**
   * Returns whether a set may use anything of version 2: an ohms reading, a meter ohms spec, or a
   * point with a dot (a part lead looks like a package pin without the stage at hand, so any dotted
   * point is written as version 2, which reads package pins as before).
   */
  static boolean needsVersion2(ReadingSet set) {
    if (!set.meter().ohms().equals(OhmsSpec.DEFAULT)) {
      return true;
    }
    for (Reading r : set.readings()) {
      if (r.kind() == Reading.Kind.OHMS || r.at().indexOf('.') > 0) {
        return true;
      }
    }
    return false;
  }

  private static MeterSpec meter(JsonField field, int version) {
    field.object("the meter", version >= 2 ? METER_KEYS : METER_KEYS.subList(0, 3));
    MeterSpec base = MeterSpec.DEFAULT;
    double percent =
        field.optionalNonNegative(
            "percent", "the meter's percent of reading, e.g. 0.5", base.percent());
    int counts = field.optionalInteger("counts", "the meter's counts, e.g. 2", base.counts());
    int display =
        field.optionalInteger(
            "displayCounts", "the display counts, e.g. 6000", base.displayCounts());
    if (counts < 0) {
      throw field.require("counts", "").error("counts (" + counts + ") must be 0 or more");
    }
    if (display <= 0) {
      throw field
          .optional("displayCounts")
          .orElse(field)
          .error("displayCounts (" + display + ") must be above 0, e.g. 6000");
    }
    Optional<JsonField> ohmsField = field.optional("ohms");
    OhmsSpec ohms = ohmsField.isPresent() ? ohmsSpec(ohmsField.get()) : OhmsSpec.DEFAULT;
    try {
      return new MeterSpec(percent, counts, display, ohms);
    } catch (InvalidInputException e) {
      throw field.rewrap(e, e.field());
    }
  }

  private static OhmsSpec ohmsSpec(JsonField field) {
    field.object("the meter's ohms accuracy", OHMS_KEYS);
    double percent =
        field.optionalNonNegative(
            "percent", "the ohms percent of reading, e.g. 0.8", OhmsSpec.DEFAULT.percent());
    int counts =
        field.optionalInteger("counts", "the ohms counts, e.g. 3", OhmsSpec.DEFAULT.counts());
    if (counts < 0) {
      throw field.require("counts", "").error("counts (" + counts + ") must be 0 or more");
    }
    try {
      return new OhmsSpec(percent, counts);
    } catch (InvalidInputException e) {
      throw field.rewrap(e, e.field());
    }
  }

  private static Reading reading(JsonField field, Stage stage, int version) {
    field.object("a reading", version >= 2 ? READING_KEYS : VOLTS_KEYS);
    JsonField atField = field.require("at", "a net name or a package pin such as U1.6");
    String at = atField.name("a net name or a package pin such as U1.6");
    requireVersionFor(atField, at, stage, version);
    Optional<JsonField> dc = field.optional("dc");
    Optional<JsonField> ac = field.optional("ac");
    Optional<JsonField> ohms = field.optional("ohms");
    Optional<JsonField> to = field.optional("to");
    if (ohms.isPresent()) {
      if (dc.isPresent() || ac.isPresent()) {
        throw field.error(
            "a reading has one of \"dc\", \"ac\" or \"ohms\" (expected volts with the power on"
                + " or ohms with it off, one reading per entry)");
      }
      return ohmsReading(field, at, ohms.get(), to, stage, version);
    }
    if (to.isPresent()) {
      throw to.get()
          .error(
              "a volts reading has no \"to\" (expected \"to\" only with \"ohms\", the second"
                  + " point of a power-off reading)");
    }
    for (Optional<JsonField> given : List.of(dc, ac)) {
      if (given.isEmpty()) {
        continue;
      }
      JsonField volts = given.get();
      if (volts.node().isTextual() && volts.node().asText().trim().equalsIgnoreCase(OVER_RANGE)) {
        throw volts.error(
            "\"OL\" is the ohmmeter's over-range (expected volts here, a number; OL only with"
                + " \"ohms\")");
      }
    }
    if (dc.isPresent() == ac.isPresent()) {
      throw field.error(
          dc.isPresent()
              ? "a reading has either \"dc\" or \"ac\", not both (expected one reading per entry)"
              : "missing field \"dc\" or \"ac\" (expected the volts read at " + at + ")");
    }
    Reading.Kind kind = dc.isPresent() ? Reading.Kind.DC : Reading.Kind.AC;
    JsonField valueField = dc.isPresent() ? dc.get() : ac.get();
    double value =
        kind == Reading.Kind.DC
            ? valueField.number("the DC volts read")
            : valueField.nonNegative("the AC amplitude read, in volts");
    double hz = 0;
    Optional<JsonField> hzField = field.optional("hz");
    if (kind == Reading.Kind.AC) {
      if (hzField.isPresent()) {
        hz = hzField.get().nonNegative("the frequency in hertz");
        if (hz == 0) {
          throw hzField
              .get()
              .error("hz must be above 0 (the frequency of the ac reading in hertz)");
        }
      } else {
        boolean found = false;
        for (TestInput input : stage.inputs()) {
          if (input.hasAc()) {
            hz = input.hz();
            found = true;
            break;
          }
        }
        if (!found) {
          throw field.error(
              "missing field \"hz\" (expected the frequency of the ac reading; the stage has no ac input to take it from)");
        }
      }
    } else if (hzField.isPresent()) {
      throw hzField.get().error("a dc reading has no \"hz\" (expected hz only with \"ac\")");
    }
    Optional<AcMeasure> measure = Measures.optional(field);
    OptionalDouble uncertainty = OptionalDouble.empty();
    Optional<JsonField> uField = field.optional("uncertainty");
    if (uField.isPresent()) {
      double u = uField.get().nonNegative("the uncertainty in volts (half-width), e.g. 0.01");
      if (u == 0) {
        throw uField.get().error("uncertainty must be above 0 volts (half-width), e.g. 0.01");
      }
      uncertainty = OptionalDouble.of(u);
    }
    try {
      return new Reading(at, kind, value, hz, uncertainty, "", measure);
    } catch (InvalidInputException e) {
      throw field.rewrap(e, e.field());
    }
  }

  private static final List<String> VOLTS_KEYS =
      List.of("at", "dc", "ac", "hz", "uncertainty", "measure");

  private static Reading ohmsReading(
      JsonField field,
      String at,
      JsonField ohmsField,
      Optional<JsonField> toField,
      Stage stage,
      int version) {
    if (toField.isEmpty()) {
      throw field.error(
          "missing field \"to\" (expected the second point of the ohms reading from "
              + at
              + ", e.g. GND)");
    }
    String to = toField.get().name("the second point: a net, a package pin or a part lead");
    requireVersionFor(toField.get(), to, stage, version);
    if (to.equals(at)) {
      throw toField.get().error("\"to\" is the same point as \"at\" (expected another point)");
    }
    double value;
    if (ohmsField.node().isTextual()
        && ohmsField.node().asText().trim().equalsIgnoreCase(OVER_RANGE)) {
      value = Double.POSITIVE_INFINITY;
    } else {
      value = ohmsField.number("the ohms read (a number, e.g. 46800 or \"4k7\"), or \"OL\"");
      if (value < 0) {
        throw ohmsField.error(
            "ohms ("
                + plain(value)
                + ") must be 0 or more (expected the resistance read, or \"OL\" for the meter's"
                + " over-range)");
      }
    }
    if (field.optional("hz").isPresent()) {
      throw field.require("hz", "").error("an ohms reading has no \"hz\"");
    }
    Measures.optional(field);
    OptionalDouble uncertainty = OptionalDouble.empty();
    Optional<JsonField> uField = field.optional("uncertainty");
    if (uField.isPresent()) {
      double u = uField.get().nonNegative("the uncertainty in ohms (half-width), e.g. 50");
      if (u == 0) {
        throw uField.get().error("uncertainty must be above 0 ohms (half-width), e.g. 50");
      }
      uncertainty = OptionalDouble.of(u);
    }
    try {
      return new Reading(at, Reading.Kind.OHMS, value, 0, uncertainty, to);
    } catch (InvalidInputException e) {
      throw field.rewrap(e, e.field());
    }
  }

  /**
   * Refuses a part lead ({@code R2.1}) as a point of a version-1 file; whether the point names
   * anything of the stage is for {@link ReadingRules}.
   */
  private static void requireVersionFor(JsonField field, String at, Stage stage, int version) {
    if (version < 2 && ReadingRules.isPartLead(stage, at)) {
      throw field.error(
          "part lead "
              + at
              + " needs a version 2 readings file (expected a net or a package pin in version"
              + " 1)");
    }
  }

  private static String plain(double value) {
    return java.math.BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
  }
}

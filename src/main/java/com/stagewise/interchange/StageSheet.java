package com.stagewise.interchange;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Limits;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.StageRules;
import com.stagewise.circuit.TestInput;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads and writes stage sheets ({@code *.stage.json}, format {@code stagewise-stage}, versions 1
 * and 2; version 2 adds diodes, zeners, LEDs, trimmers and potentiometers).
 *
 * <p>Reading is strict: a file larger than {@link Limits#MAX_FILE_BYTES}, an unknown key, a missing
 * field, a wrong type, a bad or negative value, a wrong format or a newer version, and every
 * problem of {@link StageRules#problems} (values outside their plausible range, sizes, nets) is an
 * {@link InvalidInputException} that names the file, the JSON path (e.g. {@code parts[2].value})
 * and what was expected.
 *
 * <p>Values may be plain numbers or strings with an SI prefix or in RKM code ({@code 10k}, {@code
 * 4k7}, {@code 470R}, {@code 100n}, {@code 2u2}); tolerances {@code "1%"} or {@code 0.01}. Fields
 * that may be left out: {@code title} and {@code board} (empty), {@code ground} ({@code GND}),
 * {@code inputs} (none), an input's {@code ac} and {@code hz}, and tolerances, which then take the
 * values most often fitted (common practice): 5 % for resistors and rails, 10 % for capacitors.
 *
 * <p>Writing prints values in RKM code ({@code 4k7}, {@code 100n}, {@code 470R}) and tolerances as
 * percentages, so that a sheet read back equals the stage written.
 */
public final class StageSheet {
  /** The {@code format} of a stage sheet. */
  public static final String FORMAT = "stagewise-stage";

  /**
   * The newest version this program reads. A sheet is written as version 1 unless it holds a part
   * kind of version 2 (diode, zener, LED, trimmer, potentiometer).
   */
  public static final int VERSION = 2;

  /** The file name ending of stage sheets. */
  public static final String SUFFIX = ".stage.json";

  /** Tolerance of a resistor or rail whose sheet gives none (5 %, common practice). */
  static final double DEFAULT_RESISTOR_TOLERANCE = 0.05;

  /** Tolerance of a capacitor whose sheet gives none (10 %, common practice). */
  static final double DEFAULT_CAPACITOR_TOLERANCE = 0.10;

  private static final List<String> ROOT_KEYS =
      List.of(
          "format",
          "version",
          "title",
          "board",
          "ground",
          "rails",
          "inputs",
          "parts",
          "amplifiers");
  private static final List<String> RAIL_KEYS = List.of("net", "volts", "tolerance");
  private static final List<String> INPUT_KEYS = List.of("net", "dc", "ac", "hz", "measure");
  private static final List<String> AMPLIFIER_KEYS =
      List.of(
          "ref",
          "package",
          "packageType",
          "section",
          "class",
          "inPlus",
          "inMinus",
          "out",
          "vPlus",
          "vMinus");

  private StageSheet() {}

  /**
   * Returns the stage of a sheet file.
   *
   * @throws InvalidInputException if the file cannot be read or the sheet is not a sound stage; the
   *     message names the file
   */
  public static Stage read(Path file) {
    return read(SheetFiles.readText(file), file.toString());
  }

  /**
   * Returns the stage of a sheet's text.
   *
   * @param source the file name or screen named in messages
   * @throws InvalidInputException if the sheet is not a sound stage
   */
  public static Stage read(String json, String source) {
    return parse(json, source, true);
  }

  /**
   * Returns the stage of a sheet's text checked for its form only (format, keys, types, values),
   * not for the rules of {@link StageRules}: for tools that list every problem of a sheet ({@code
   * stage check}) or draw a sheet that still has some.
   *
   * @param source the file name or screen named in messages
   * @throws InvalidInputException if the sheet is not a well-formed stage sheet
   */
  public static Stage readForm(String json, String source) {
    return parse(json, source, false);
  }

  /**
   * Returns the stage of a sheet file checked for its form only (see {@link #readForm(String,
   * String)}).
   *
   * @throws InvalidInputException if the file cannot be read or is not a well-formed stage sheet
   */
  public static Stage readForm(Path file) {
    return readForm(SheetFiles.readText(file), file.toString());
  }

  private static Stage parse(String json, String source, boolean checked) {
    SheetFiles.requireSize(json, source);
    JsonField root = JsonField.parseRoot(json, source);
    root.requireHeader(FORMAT, VERSION, "a stage sheet");
    root.object("a stage sheet", ROOT_KEYS);
    String title = root.optionalText("title", "");
    String board = root.optionalText("board", "");
    String ground = root.optionalName("ground", "the ground net's name", "GND");
    List<Rail> rails = new ArrayList<>();
    for (JsonField field : root.require("rails", "an array of rails").elements("rails")) {
      rails.add(rail(field));
    }
    List<TestInput> inputs = new ArrayList<>();
    for (JsonField field : root.optionalElements("inputs", "inputs")) {
      inputs.add(input(field));
    }
    int version = root.require("version", "the version number").integer("the version number");
    List<Part> parts = new ArrayList<>();
    for (JsonField field : root.require("parts", "an array of parts").elements("parts")) {
      parts.add(SheetParts.part(field, version));
    }
    List<JsonField> ampFields =
        root.require("amplifiers", "an array of op-amp sections").elements("op-amp sections");
    List<Amplifier> amplifiers = new ArrayList<>();
    for (JsonField field : ampFields) {
      amplifiers.add(amplifier(field));
    }
    Stage stage;
    try {
      stage = new Stage(title, board, ground, rails, inputs, parts, amplifiers);
    } catch (InvalidInputException e) {
      throw root.rewrap(e, e.field());
    }
    if (checked) {
      StageRules.requireSound(stage, source);
    }
    return stage;
  }

  /** Returns the sheet text of a stage, ending in a newline. */
  public static String write(Stage stage) {
    Map<String, Object> fields = new LinkedHashMap<>();
    JsonNodeFactory nodes = JsonNodeFactory.instance;
    fields.put("format", nodes.textNode(FORMAT));
    fields.put("version", nodes.numberNode(Part.newerKinds(stage.parts()).isEmpty() ? 1 : 2));
    fields.put("title", nodes.textNode(stage.title()));
    fields.put("board", nodes.textNode(stage.board()));
    fields.put("ground", nodes.textNode(stage.ground()));
    List<JsonNode> rails = new ArrayList<>();
    for (Rail rail : stage.rails()) {
      rails.add(
          JsonText.object()
              .put("net", rail.net())
              .<ObjectNode>set("volts", JsonText.number(rail.volts()))
              .put("tolerance", ValueText.formatTolerance(rail.tolerance())));
    }
    fields.put("rails", rails);
    List<JsonNode> inputs = new ArrayList<>();
    for (TestInput input : stage.inputs()) {
      ObjectNode node =
          JsonText.object().put("net", input.net()).set("dc", JsonText.number(input.dc()));
      if (input.hasAc() || input.hz() > 0) {
        node.set("ac", JsonText.number(input.ac()));
        node.set("hz", JsonText.number(input.hz()));
        // Peak is the default: a sheet of version 1 is written back byte for byte.
        if (input.measure() != AcMeasure.PEAK) {
          node.put("measure", input.measure().word());
        }
      }
      inputs.add(node);
    }
    fields.put("inputs", inputs);
    List<JsonNode> parts = new ArrayList<>();
    for (Part part : stage.parts()) {
      parts.add(SheetParts.node(part));
    }
    fields.put("parts", parts);
    List<JsonNode> amplifiers = new ArrayList<>();
    for (Amplifier amp : stage.amplifiers()) {
      amplifiers.add(
          JsonText.object()
              .put("ref", amp.ref())
              .put("package", amp.packageRef())
              .put("packageType", amp.packageType().word())
              .put("section", amp.section())
              .put("class", amp.deviceClass().word())
              .put("inPlus", amp.inPlus())
              .put("inMinus", amp.inMinus())
              .put("out", amp.out())
              .put("vPlus", amp.vPlus())
              .put("vMinus", amp.vMinus()));
    }
    fields.put("amplifiers", amplifiers);
    return JsonText.document(fields);
  }

  /**
   * Writes a stage's sheet to a file (UTF-8), replacing it.
   *
   * @throws InvalidInputException if the file cannot be written (naming the file)
   */
  public static void write(Stage stage, Path file) {
    SheetFiles.writeText(file, write(stage));
  }

  private static Rail rail(JsonField field) {
    field.object("a rail", RAIL_KEYS);
    String net = field.require("net", "the rail's net name").name("the rail's net name");
    double volts =
        field
            .require("volts", "the rail's voltage, e.g. 15 or -15")
            .number("the rail's voltage in volts");
    double tolerance = field.optionalTolerance("tolerance", DEFAULT_RESISTOR_TOLERANCE);
    try {
      return new Rail(net, volts, tolerance);
    } catch (InvalidInputException e) {
      throw field.rewrap(e, e.field());
    }
  }

  private static TestInput input(JsonField field) {
    field.object("a test input", INPUT_KEYS);
    String net = field.require("net", "the input's net name").name("the input's net name");
    double dc =
        field
            .require("dc", "the input's DC level in volts, e.g. 0")
            .number("the DC level in volts");
    double ac = field.optionalNonNegative("ac", "the AC amplitude in volts", 0.0);
    double hz = field.optionalNonNegative("hz", "the AC frequency in hertz", 0.0);
    if (ac > 0 && hz <= 0) {
      throw field
          .optional("hz")
          .orElse(field)
          .error(
              "an input with an ac amplitude needs \"hz\" above 0 (the frequency in hertz, e.g. 1000)");
    }
    AcMeasure measure = Measures.of(field);
    try {
      return new TestInput(net, dc, ac, hz, measure);
    } catch (InvalidInputException e) {
      throw field.rewrap(e, e.field());
    }
  }

  private static Amplifier amplifier(JsonField field) {
    field.object("an op-amp section", AMPLIFIER_KEYS);
    String ref =
        field.require("ref", "the section's designator, e.g. U1A").name("the section's designator");
    String pkg =
        field
            .require("package", "the package's designator, e.g. U1")
            .name("the package's designator");
    JsonField typeField = field.require("packageType", "single-8, dual-8 or quad-14");
    PackageType type;
    try {
      type = PackageType.of(typeField.name("single-8, dual-8 or quad-14"));
    } catch (InvalidInputException e) {
      throw typeField.rewrap(e, "");
    }
    JsonField sectionField = field.require("section", "the section letter, e.g. A");
    String section = sectionField.name("the section letter, e.g. A");
    if (!type.hasSection(section)) {
      throw sectionField.error(
          "section \""
              + section
              + "\" is not on a "
              + type.word()
              + " package (expected one of "
              + String.join(", ", type.sections())
              + ")");
    }
    JsonField classField =
        field.require("class", "classic-bipolar, ground-sensing or rail-to-rail");
    DeviceClass deviceClass;
    try {
      deviceClass =
          DeviceClass.of(classField.name("classic-bipolar, ground-sensing or rail-to-rail"));
    } catch (InvalidInputException e) {
      throw classField.rewrap(e, "");
    }
    Map<String, String> nets = new HashMap<>();
    for (String key : List.of("inPlus", "inMinus", "out", "vPlus", "vMinus")) {
      nets.put(key, field.require(key, "the net on the " + key + " pin").name("a net name"));
    }
    try {
      return new Amplifier(
          ref,
          pkg,
          type,
          section,
          deviceClass,
          nets.get("inPlus"),
          nets.get("inMinus"),
          nets.get("out"),
          nets.get("vPlus"),
          nets.get("vMinus"));
    } catch (InvalidInputException e) {
      throw field.rewrap(e, e.field());
    }
  }
}

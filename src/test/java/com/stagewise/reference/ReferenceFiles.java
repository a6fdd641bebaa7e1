package com.stagewise.reference;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.solver.Phasor;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads and writes the stored reference files {@code src/test/resources/reference/spice/*.json}
 * (format {@code stagewise-spice-reference}, version 1; see DEVELOPERS.md).
 */
final class ReferenceFiles {
  static final String FORMAT = "stagewise-spice-reference";

  static final String SIMULATOR = "ngspice 39 (Debian package), batch mode";

  static final ObjectMapper JSON =
      new ObjectMapper()
          .enable(SerializationFeature.INDENT_OUTPUT)
          .enable(SerializationFeature.ORDER_MAP_ENTRIES_BY_KEYS);

  /** The folder of the stored files, from the project root. */
  static final Path FOLDER = Path.of("src", "test", "resources", "reference", "spice");

  private ReferenceFiles() {}

  /** A stored reference: where the stage comes from and what ngspice said. */
  record Stored(ReferenceStages.Source source, SpiceComparison.Expected expected) {}

  static ObjectNode toJson(
      ReferenceStages.Source source, String title, SpiceComparison.Expected e) {
    ObjectNode root = JSON.createObjectNode();
    root.put("format", FORMAT);
    root.put("version", 1);
    root.put("simulator", SIMULATOR);
    ObjectNode stage = root.putObject("stage");
    stage.put("kind", source.kind());
    stage.put("id", source.id());
    stage.put("title", title);
    writeState(root.putObject("dc"), e.states().get(0));
    if (e.states().size() > 1) {
      var others = root.putArray("otherStates");
      e.states().stream().skip(1).forEach(state -> writeState(others.addObject(), state));
    }
    if (e.hz() > 0) {
      ObjectNode ac = root.putObject("ac");
      ac.put("hz", e.hz());
      ObjectNode acNets = ac.putObject("nets");
      e.ac()
          .forEach(
              (net, p) -> {
                ObjectNode one = acNets.putObject(net);
                one.put("amplitude", p.amplitude());
                one.put("phaseDegrees", p.phaseDegrees());
              });
    }
    return root;
  }

  private static void writeState(ObjectNode node, SpiceComparison.DcState state) {
    ObjectNode nets = node.putObject("nets");
    state.nets().forEach(nets::put);
    ObjectNode pins = node.putObject("pins");
    state.pins().forEach(pins::put);
  }

  private static SpiceComparison.DcState readState(JsonNode node) {
    return new SpiceComparison.DcState(doubles(node.path("nets")), doubles(node.path("pins")));
  }

  static Stored read(Path file) throws IOException {
    JsonNode root = JSON.readTree(file.toFile());
    if (!FORMAT.equals(root.path("format").asText())) {
      throw new IOException(file + ": format must be " + FORMAT);
    }
    ReferenceStages.Source source =
        new ReferenceStages.Source(
            root.path("stage").path("kind").asText(), root.path("stage").path("id").asText());
    List<SpiceComparison.DcState> states = new ArrayList<>();
    states.add(readState(root.path("dc")));
    root.path("otherStates").forEach(state -> states.add(readState(state)));
    double hz = root.path("ac").path("hz").asDouble(0);
    Map<String, Phasor> ac = new LinkedHashMap<>();
    root.path("ac")
        .path("nets")
        .fields()
        .forEachRemaining(
            f ->
                ac.put(
                    f.getKey(),
                    new Phasor(
                        f.getValue().path("amplitude").asDouble(),
                        f.getValue().path("phaseDegrees").asDouble())));
    return new Stored(source, new SpiceComparison.Expected(states, hz, ac));
  }

  static void write(Path file, ObjectNode json) throws IOException {
    Files.createDirectories(file.getParent());
    Files.writeString(file, JSON.writeValueAsString(json) + "\n");
  }

  private static Map<String, Double> doubles(JsonNode node) {
    Map<String, Double> map = new LinkedHashMap<>();
    node.fields().forEachRemaining(f -> map.put(f.getKey(), f.getValue().asDouble()));
    return map;
  }
}

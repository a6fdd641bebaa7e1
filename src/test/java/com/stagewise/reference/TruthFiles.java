package com.stagewise.reference;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.Stage;
import com.stagewise.interchange.StageSheet;
import com.stagewise.reference.FaultSimulation.Case;
import com.stagewise.reference.FaultSimulation.Dropped;
import com.stagewise.reference.FaultSimulation.Reading;
import com.stagewise.reference.FaultSimulation.Tie;
import com.stagewise.solver.DeviceParams;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/**
 * Writes the fault truth set, {@code src/test/resources/diagnosis/truth/NAME.json} (format {@code
 * stagewise-fault-truth}, version 1; documented in DEVELOPERS.md): one file per stage, the header
 * pretty-printed and one case per line so that a diff shows which cases changed.
 */
final class TruthFiles {
  static final String FORMAT = "stagewise-fault-truth";

  static final Path FOLDER = Path.of("src", "test", "resources", "diagnosis", "truth");

  static final ObjectMapper JSON = new ObjectMapper();

  private TruthFiles() {}

  /** Everything one stage's file holds. */
  record StageTruth(
      ReferenceStages.Source source,
      Stage stage,
      long seed,
      int samplesPerFault,
      int healthySamples,
      List<FaultList.Skipped> skipped,
      List<Dropped> dropped,
      List<Case> cases) {}

  static void write(Path file, StageTruth truth) throws IOException {
    ObjectNode head = JSON.createObjectNode();
    head.put("format", FORMAT);
    head.put("version", 1);
    head.put("simulator", ReferenceFiles.SIMULATOR);
    ObjectNode source = head.putObject("stage");
    source.put("kind", truth.source().kind());
    source.put("id", truth.source().id());
    head.set("sheet", sheet(truth.stage()));
    ObjectNode meter = head.putObject("meter");
    meter.put("percent", MeterModel.HANDHELD.percent());
    meter.put("counts", MeterModel.HANDHELD.counts());
    meter.put("displayCounts", MeterModel.HANDHELD.displayCounts());
    meter
        .putObject("ohms")
        .put("percent", OhmsMeterModel.HANDHELD.percent())
        .put("counts", OhmsMeterModel.HANDHELD.counts());
    ObjectNode scope = head.putObject("scope");
    scope.put("percent", FaultSimulation.SCOPE_FRACTION * 100);
    scope.put("volts", FaultSimulation.SCOPE_VOLTS);
    ObjectNode generator = head.putObject("generator");
    generator.put("seed", truth.seed());
    generator.put("samplesPerFault", truth.samplesPerFault());
    generator.put("healthySamples", truth.healthySamples());
    ArrayNode skipped = head.putArray("notSimulated");
    for (FaultList.Skipped s : truth.skipped()) {
      skipped.addObject().put("fault", s.fault()).put("reason", s.reason());
    }
    ArrayNode dropped = head.putArray("dropped");
    for (Dropped d : truth.dropped()) {
      dropped
          .addObject()
          .put("fault", d.fault())
          .put("seed", d.seed())
          .put("sample", d.sample())
          .put("reason", d.reason());
    }
    StringBuilder text = new StringBuilder();
    String header = JSON.writerWithDefaultPrettyPrinter().writeValueAsString(head);
    // Open the object again to append the cases, one per line.
    text.append(header, 0, header.lastIndexOf('}')).append(",\n  \"cases\" : [\n");
    for (int i = 0; i < truth.cases().size(); i++) {
      text.append("    ").append(JSON.writeValueAsString(caseJson(truth.cases().get(i))));
      text.append(i + 1 < truth.cases().size() ? ",\n" : "\n");
    }
    text.append("  ]\n}\n");
    Files.createDirectories(file.getParent());
    Files.writeString(file, text.toString());
  }

  static JsonNode read(Path file) throws IOException {
    JsonNode root = JSON.readTree(file.toFile());
    if (!FORMAT.equals(root.path("format").asText())) {
      throw new IOException(file + ": format must be " + FORMAT);
    }
    return root;
  }

  private static ObjectNode caseJson(Case c) {
    ObjectNode node = JSON.createObjectNode();
    node.put("fault", c.fault());
    node.put("seed", c.seed());
    node.put("sample", c.sample());
    ArrayNode readings = node.putArray("readings");
    for (Reading r : c.readings()) {
      ObjectNode one = readings.addObject().put("at", r.at());
      if (r.kind().equals("dc")) {
        one.put("dc", r.volts());
      } else {
        one.put("ac", r.volts()).put("hz", r.hz());
      }
    }
    ArrayNode ohms = node.putArray("ohms");
    for (FaultSimulation.Ohms o : c.ohms()) {
      ObjectNode one = ohms.addObject().put("at", o.at()).put("to", o.to());
      if (Double.isInfinite(o.shown())) {
        one.put("ohms", "OL");
      } else {
        one.put("ohms", o.shown());
      }
    }
    ArrayNode partial = node.putArray("partial");
    c.partial().forEach(partial::add);
    ObjectNode exact = node.putObject("exact");
    ObjectNode dc = exact.putObject("dc");
    c.exactDc().forEach(dc::put);
    if (!c.exactAc().isEmpty()) {
      ObjectNode ac = exact.putObject("ac");
      c.exactAc()
          .forEach(
              (net, p) ->
                  ac.putObject(net)
                      .put("amplitude", FaultSimulation.significant(p.amplitude()))
                      .put("phaseDegrees", FaultSimulation.significant(p.phaseDegrees())));
    }
    ObjectNode exactOhms = exact.putObject("ohms");
    for (FaultSimulation.Ohms o : c.ohms()) {
      String key = o.at() + " to " + o.to();
      if (Double.isInfinite(o.exact())) {
        exactOhms.put(key, "open");
      } else {
        exactOhms.put(key, o.exact());
      }
    }
    ObjectNode unit = node.putObject("unit");
    ObjectNode parts = unit.putObject("parts");
    c.parts().forEach((ref, v) -> parts.put(ref, FaultSimulation.significant(v)));
    ObjectNode rails = unit.putObject("rails");
    c.rails().forEach((net, v) -> rails.put(net, FaultSimulation.significant(v)));
    ObjectNode devices = unit.putObject("devices");
    c.devices().forEach((ref, p) -> devices.set(ref, device(p)));
    if (c.faultValue() != null) {
      unit.put("faultValue", FaultSimulation.significant(c.faultValue()));
    }
    if (!c.ties().isEmpty()) {
      ArrayNode ties = unit.putArray("ties");
      for (Tie t : c.ties()) {
        ObjectNode tie =
            ties.addObject().put("node", t.node()).put("to", t.to()).put("why", t.why());
        t.group().forEach(tie.putArray("group")::add);
      }
    }
    node.put("start", c.start());
    if (!c.solvedBy().equals("start")) {
      node.put("solvedBy", c.solvedBy());
    }
    return node;
  }

  private static ObjectNode device(DeviceParams p) {
    ObjectNode node = JSON.createObjectNode();
    node.put("gain", FaultSimulation.significant(p.gain()));
    node.put("offset", FaultSimulation.significant(p.offset()));
    node.put("biasPlus", FaultSimulation.significant(p.biasPlus()));
    node.put("biasMinus", FaultSimulation.significant(p.biasMinus()));
    node.put("outputResistance", p.outputResistance());
    node.put("headroomLow", FaultSimulation.significant(p.headroomLow()));
    node.put("headroomHigh", FaultSimulation.significant(p.headroomHigh()));
    return node;
  }

  /** The stage as its stage sheet (written by the project's own sheet writer). */
  static JsonNode sheet(Stage stage) {
    try {
      return JSON.readTree(StageSheet.write(stage));
    } catch (IOException e) {
      throw new java.io.UncheckedIOException(e);
    }
  }
}

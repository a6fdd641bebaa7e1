package com.stagewise.reference;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Fault;
import com.stagewise.diagnosis.PowerOffFaults;
import com.stagewise.solver.PowerOff;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Stored power-off answers of ngspice ({@code src/test/resources/reference/ohms/*.json}, format
 * {@code stagewise-ohms-reference}, version 1; see DEVELOPERS.md), and the comparison of our
 * prediction with them. {@code main} regenerates the files (ngspice 39 on the PATH).
 */
final class PowerOffReference {
  static final String FORMAT = "stagewise-ohms-reference";

  /** The folder of the stored files, from the project root. */
  static final Path FOLDER = Path.of("src", "test", "resources", "reference", "ohms");

  /**
   * Agreement required with ngspice, relative: 0.1 % (our figure: well inside a handheld's ±0.8 %
   * ohms accuracy, so a disagreement could never hide a fault).
   */
  static final double RELATIVE = 1e-3;

  private PowerOffReference() {}

  /** Returns the stages checked: every template's default stage and every demo sheet. */
  static List<ReferenceStages.Named> stages() {
    return ReferenceStages.all().stream().filter(n -> !n.source().kind().equals("hand")).toList();
  }

  /**
   * Returns every disagreement between our power-off prediction and ngspice's answers for one
   * stage, in words; empty when all agree within {@link #RELATIVE} (and OL where ngspice reads OL).
   */
  static List<String> mismatches(Stage stage, List<SpicePowerOff.Answer> answers) {
    List<String> problems = new ArrayList<>();
    List<String> faults = FaultList.of(stage);
    if (answers.size() != faults.size()) {
      problems.add(answers.size() + " faults answered, the catalogue has " + faults.size());
      return problems;
    }
    PowerOff healthy = PowerOff.of(stage);
    for (SpicePowerOff.Answer answer : answers) {
      if (!faults.contains(answer.fault())) {
        problems.add("no fault " + answer.fault() + " in the catalogue any more");
        continue;
      }
      Fault fault =
          Fault.parse(
              answer.fault(),
              stage.rails().stream()
                  .map(r -> r.net())
                  .collect(java.util.stream.Collectors.toSet()));
      double value = SpicePowerOff.simulatedValue(stage, answer.fault());
      PowerOff faulted = PowerOffFaults.faulted(stage, fault, value);
      for (int k = 0; k < answer.pairs().size(); k++) {
        String a = answer.pairs().get(k)[0];
        String b = answer.pairs().get(k)[1];
        double ours =
            faulted
                .predict(PowerOffFaults.onFaulted(healthy, a), PowerOffFaults.onFaulted(healthy, b))
                .nominal();
        double spice = answer.ohms()[k];
        boolean agree =
            Double.isInfinite(spice)
                ? Double.isInfinite(ours)
                : Math.abs(ours - spice) <= RELATIVE * Math.abs(spice);
        if (!agree) {
          problems.add(
              String.format(
                  Locale.ROOT,
                  "%s %s–%s: ours %s, ngspice %s",
                  answer.fault(),
                  a,
                  b,
                  text(ours),
                  text(spice)));
        }
      }
    }
    return problems;
  }

  static String text(double ohms) {
    return Double.isInfinite(ohms) ? "OL" : String.format(Locale.ROOT, "%.6g Ω", ohms);
  }

  static Path file(ReferenceStages.Source source) {
    return FOLDER.resolve(source.name() + ".json");
  }

  static ObjectNode toJson(ReferenceStages.Named named, List<SpicePowerOff.Answer> answers) {
    ObjectNode root = ReferenceFiles.JSON.createObjectNode();
    root.put("format", FORMAT);
    root.put("version", 1);
    root.put("simulator", ReferenceFiles.SIMULATOR);
    root.put(
        "method",
        "sources and op-amp sections removed, 1 mA test current between each pair, .op,"
            + " 1e12 ohm shunt from every node to ground; a drifted part at x5 or /5; OL above 1e9 ohms");
    ObjectNode stage = root.putObject("stage");
    stage.put("kind", named.source().kind());
    stage.put("id", named.source().id());
    stage.put("title", named.stage().title());
    ArrayNode faults = root.putArray("faults");
    for (SpicePowerOff.Answer answer : answers) {
      ObjectNode one = faults.addObject();
      one.put("fault", answer.fault());
      ArrayNode pairs = one.putArray("pairs");
      ArrayNode ohms = one.putArray("ohms");
      for (int k = 0; k < answer.pairs().size(); k++) {
        pairs.addArray().add(answer.pairs().get(k)[0]).add(answer.pairs().get(k)[1]);
        double v = answer.ohms()[k];
        if (Double.isInfinite(v)) {
          ohms.add("OL");
        } else {
          ohms.add(FaultSimulation.significant(v));
        }
      }
    }
    return root;
  }

  /** Reads one stored file's answers. */
  static List<SpicePowerOff.Answer> read(Path file) throws IOException {
    JsonNode root = ReferenceFiles.JSON.readTree(file.toFile());
    if (!FORMAT.equals(root.path("format").asText())) {
      throw new IOException(file + ": format must be " + FORMAT);
    }
    List<SpicePowerOff.Answer> answers = new ArrayList<>();
    for (JsonNode one : root.path("faults")) {
      List<String[]> pairs = new ArrayList<>();
      one.path("pairs")
          .forEach(p -> pairs.add(new String[] {p.get(0).asText(), p.get(1).asText()}));
      double[] ohms = new double[pairs.size()];
      for (int k = 0; k < ohms.length; k++) {
        JsonNode v = one.path("ohms").get(k);
        ohms[k] = v.isTextual() ? Double.POSITIVE_INFINITY : v.asDouble();
      }
      answers.add(new SpicePowerOff.Answer(one.path("fault").asText(), pairs, ohms));
    }
    return answers;
  }

  static ReferenceStages.Source source(Path file) throws IOException {
    JsonNode root = ReferenceFiles.JSON.readTree(file.toFile());
    return new ReferenceStages.Source(
        root.path("stage").path("kind").asText(), root.path("stage").path("id").asText());
  }

  /** Regenerates every stored file with ngspice; prints one line per stage. */
  public static void main(String[] args) throws IOException {
    if (!Ngspice.available()) {
      System.err.println(Ngspice.MISSING);
      System.exit(1);
    }
    Files.createDirectories(FOLDER);
    for (ReferenceStages.Named named : stages()) {
      long start = System.nanoTime();
      List<SpicePowerOff.Answer> answers = SpicePowerOff.solve(named.stage());
      ReferenceFiles.write(file(named.source()), toJson(named, answers));
      int values = answers.stream().mapToInt(a -> a.ohms().length).sum();
      System.out.printf(
          Locale.ROOT,
          "%-44s %3d faults %6d readings  %.1f s%n",
          named.source().name(),
          answers.size(),
          values,
          (System.nanoTime() - start) / 1e9);
    }
  }
}

package com.stagewise.reference;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.diagnosis.PowerOffFaults;
import com.stagewise.interchange.StageSheet;
import com.stagewise.solver.AcSolution;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.DeviceParams;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.PowerOff;
import com.stagewise.solver.SectionState;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Checks the stored fault truth set (simulated with ngspice 39, Debian package, as reference
 * simulator): its readings lie within the meter's accuracy of the simulated values, every fault of
 * the stage is there, and our solver, given the same unit (parts, rails, device parameters) and the
 * same fault applied through the stage model, agrees with ngspice within 1 mV + 0.01 % at every net
 * and pin and within 0.1 % in AC amplitude. That last check measures the solver on faulted,
 * randomised units, far beyond the nominal stages.
 */
class FaultTruthTest {

  static Stream<Path> truthFiles() throws IOException {
    try (Stream<Path> files = Files.list(TruthFiles.FOLDER)) {
      return files.filter(f -> f.toString().endsWith(".json")).sorted().toList().stream();
    }
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("truthFiles")
  void readings_lieWithinMeterAccuracyOfTheSimulatedValues(Path file) throws IOException {
    JsonNode root = TruthFiles.read(file);
    MeterModel meter =
        new MeterModel(
            root.path("meter").path("percent").asDouble(),
            root.path("meter").path("counts").asInt(),
            root.path("meter").path("displayCounts").asInt());
    List<String> problems = new ArrayList<>();
    for (JsonNode c : root.path("cases")) {
      JsonNode exact = c.path("exact").path("dc");
      int dcCount = 0;
      for (JsonNode r : c.path("readings")) {
        String at = r.path("at").asText();
        if (r.has("dc")) {
          dcCount++;
          double truth = exact.path(at).asDouble();
          double shown = r.path("dc").asDouble();
          // Error within the meter's accuracy, plus half a count of rounding.
          double allowed = meter.uncertainty(truth) + meter.resolution(shown);
          if (Math.abs(shown - truth) > allowed) {
            problems.add(
                c.path("fault").asText() + " " + at + ": shown " + shown + ", true " + truth);
          }
        }
      }
      if (dcCount != exact.size()) {
        problems.add(
            c.path("fault").asText()
                + ": "
                + dcCount
                + " DC readings for "
                + exact.size()
                + " test points");
      }
    }
    assertThat(problems).isEmpty();
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("truthFiles")
  void ohmsReadings_coverEveryPairOfNets_withinTheOhmmetersAccuracyOfNgspice(Path file)
      throws IOException {
    JsonNode root = TruthFiles.read(file);
    Stage stage = stageOf(root);
    JsonNode spec = root.path("meter").path("ohms");
    OhmsMeterModel meter =
        new OhmsMeterModel(
            spec.path("percent").asDouble(),
            spec.path("counts").asInt(),
            root.path("meter").path("displayCounts").asInt());
    int nets = stage.nets().size();
    List<String> problems = new ArrayList<>();
    for (JsonNode c : root.path("cases")) {
      String fault = c.path("fault").asText();
      JsonNode exact = c.path("exact").path("ohms");
      if (c.path("ohms").size() != nets * (nets - 1) / 2 || exact.size() != c.path("ohms").size()) {
        problems.add(fault + ": " + c.path("ohms").size() + " ohms readings for " + nets + " nets");
        continue;
      }
      for (JsonNode r : c.path("ohms")) {
        String pair = r.path("at").asText() + " to " + r.path("to").asText();
        JsonNode truth = exact.path(pair);
        boolean open = truth.isTextual();
        boolean overRange = r.path("ohms").isTextual();
        if (open || truth.asDouble() > meter.overRange() * 1.01) {
          // Nothing connects, or beyond the top range: the meter shows OL.
          if (!overRange) {
            problems.add(fault + " " + pair + ": shown " + r.path("ohms") + ", true " + truth);
          }
          continue;
        }
        if (overRange) {
          if (truth.asDouble() < meter.overRange() * 0.99) {
            problems.add(fault + " " + pair + ": OL shown for " + truth);
          }
          continue;
        }
        double shown = r.path("ohms").asDouble();
        double allowed = meter.uncertainty(truth.asDouble()) + meter.resolution(shown);
        if (Math.abs(shown - truth.asDouble()) > allowed) {
          problems.add(fault + " " + pair + ": shown " + shown + ", true " + truth);
        }
      }
    }
    assertThat(problems).isEmpty();
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("truthFiles")
  void powerOff_onTheSameFaultedUnit_agreesWithNgspice(Path file) throws IOException {
    JsonNode root = TruthFiles.read(file);
    Stage stage = stageOf(root);
    Set<String> rails = new HashSet<>();
    stage.rails().forEach(r -> rails.add(r.net()));
    List<String> problems = new ArrayList<>();
    for (JsonNode c : root.path("cases")) {
      String fault = c.path("fault").asText();
      JsonNode unit = c.path("unit");
      Stage s = stage;
      for (Part part : stage.parts()) {
        double value = unit.path("parts").path(part.ref()).asDouble();
        s = s.withPart(part.ref(), p -> p.withValue(value));
      }
      double value = unit.has("faultValue") ? unit.path("faultValue").asDouble() : Double.NaN;
      PowerOff faulted =
          PowerOffFaults.faulted(s, com.stagewise.diagnosis.Fault.parse(fault, rails), value);
      JsonNode exact = c.path("exact").path("ohms");
      exact
          .fields()
          .forEachRemaining(
              e -> {
                String[] pair = e.getKey().split(" to ");
                double ours = faulted.predict(pair[0], pair[1]).nominal();
                boolean agree =
                    e.getValue().isTextual()
                        ? Double.isInfinite(ours)
                        : Math.abs(ours - e.getValue().asDouble())
                            <= 1e-3 * Math.abs(e.getValue().asDouble());
                if (!agree) {
                  problems.add(fault + " " + e.getKey() + ": ours " + ours + ", ngspice " + e);
                }
              });
    }
    // ngspice 39 (the truth generator's circuit with every source removed, 1 mA test current):
    // within 0.1 %, and OL exactly where nothing connects.
    assertThat(problems).isEmpty();
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("truthFiles")
  void embeddedSheet_readsBackAsTheStage(Path file) throws IOException {
    JsonNode root = TruthFiles.read(file);
    Stage embedded =
        StageSheet.read(TruthFiles.JSON.writeValueAsString(root.path("sheet")), file.toString());
    assertThat(embedded).isEqualTo(stageOf(root));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("truthFiles")
  void everyFaultOfTheStage_hasCasesOrIsListedAsDropped(Path file) throws IOException {
    JsonNode root = TruthFiles.read(file);
    Stage stage = stageOf(root);
    Set<String> present = new HashSet<>();
    root.path("cases").forEach(c -> present.add(c.path("fault").asText()));
    root.path("dropped").forEach(c -> present.add(c.path("fault").asText()));
    assertThat(present).containsExactlyInAnyOrderElementsOf(FaultList.of(stage));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("truthFiles")
  void solver_onTheSameFaultedUnit_agreesWithNgspice(Path file) throws IOException {
    JsonNode root = TruthFiles.read(file);
    Stage stage = stageOf(root);
    List<String> problems = new ArrayList<>();
    for (JsonNode c : root.path("cases")) {
      String fault = c.path("fault").asText();
      Faulted faulted = faulted(stage, c);
      SolveResult result = StageSolver.solve(faulted.stage(), faulted.conditions());
      if (!(result instanceof SolveResult.Solved solved)) {
        problems.add(fault + " (seed " + c.path("seed").asLong() + "): our solver gave " + result);
        continue;
      }
      JsonNode exact = c.path("exact").path("dc");
      OperatingPoint point = nearest(solved.points(), exact);
      exact
          .fields()
          .forEachRemaining(
              e -> {
                double ours = point.at(e.getKey());
                double ref = e.getValue().asDouble();
                if (Math.abs(ours - ref)
                    > SpiceComparison.DC_VOLTS + SpiceComparison.DC_FRACTION * Math.abs(ref)) {
                  problems.add(
                      String.format(
                          Locale.ROOT,
                          "%s (seed %d) DC at %s: ours %.6f, ngspice %.6f",
                          fault,
                          c.path("seed").asLong(),
                          e.getKey(),
                          ours,
                          ref));
                }
              });
      JsonNode exactAc = c.path("exact").path("ac");
      if (exactAc.size() > 0) {
        Optional<AcSolution> ac = StageSolver.ac(faulted.stage(), faulted.conditions(), point);
        exactAc
            .fields()
            .forEachRemaining(
                e -> {
                  double ref = e.getValue().path("amplitude").asDouble();
                  double ours =
                      ac.map(a -> a.nets().get(e.getKey()).amplitude()).orElse(Double.NaN);
                  // The stored amplitude has 9 significant digits: far inside 0.1 %.
                  if (!(Math.abs(ours - ref)
                      <= SpiceComparison.AC_FRACTION * ref + SpiceComparison.AC_FLOOR_VOLTS)) {
                    problems.add(
                        String.format(
                            Locale.ROOT,
                            "%s (seed %d) AC at %s: ours %.9g, ngspice %.9g",
                            fault,
                            c.path("seed").asLong(),
                            e.getKey(),
                            ours,
                            ref));
                  }
                });
      }
    }
    assertThat(problems).as("disagreements with ngspice 39 in %s", file.getFileName()).isEmpty();
  }

  /** The stage of a truth file, from where it comes from. */
  static Stage stageOf(JsonNode root) {
    return ReferenceStages.resolve(
        new ReferenceStages.Source(
            root.path("stage").path("kind").asText(), root.path("stage").path("id").asText()));
  }

  /** A stage and solver conditions that model one stored case. */
  record Faulted(Stage stage, Conditions conditions) {}

  /**
   * Rebuilds a case for our solver through the stage model (independently of the netlist code that
   * made it): the unit's values, then the fault as a change of the stage or a forced output, then
   * the ties of floating nodes as 1 GΩ resistors.
   */
  static Faulted faulted(Stage stage, JsonNode c) {
    JsonNode unit = c.path("unit");
    Stage s = stage;
    for (Part part : stage.parts()) {
      double value = unit.path("parts").path(part.ref()).asDouble();
      s = s.withPart(part.ref(), p -> p.withValue(value));
    }
    Conditions conditions = Conditions.NOMINAL;
    for (var rail : stage.rails()) {
      conditions =
          conditions.withDriven(rail.net(), unit.path("rails").path(rail.net()).asDouble());
    }
    Map<String, DeviceParams> devices = new java.util.HashMap<>();
    for (Amplifier amp : stage.amplifiers()) {
      JsonNode d = unit.path("devices").path(amp.ref());
      devices.put(
          amp.ref(),
          new DeviceParams(
              d.path("gain").asDouble(),
              d.path("offset").asDouble(),
              d.path("biasPlus").asDouble(),
              d.path("biasMinus").asDouble(),
              d.path("outputResistance").asDouble(),
              d.path("headroomLow").asDouble(),
              d.path("headroomHigh").asDouble()));
    }
    String fault = c.path("fault").asText();
    if (!fault.equals("healthy")) {
      int colon = fault.lastIndexOf(':');
      String ref = fault.substring(0, colon);
      String kind = fault.substring(colon + 1);
      Part trimmer = stage.part(ref).filter(p -> p.kind().isTrimmer()).orElse(null);
      if (trimmer != null) {
        double value = unit.path("parts").path(ref).asDouble();
        double[] track = {value * trimmer.position(), value * (1 - trimmer.position())};
        Part faultedTrimmer =
            switch (kind) {
              case "wiper-open" -> Part.resistor(ref, value, 0, trimmer.netA(), trimmer.netB());
              case "open" ->
                  unit.path("faultValue").asDouble() == 0
                      ? Part.resistor(ref, track[0], 0, trimmer.netA(), trimmer.wiper())
                      : Part.resistor(ref, track[1], 0, trimmer.wiper(), trimmer.netB());
              case "misset" ->
                  trimmer.withValue(value).withPosition(unit.path("faultValue").asDouble());
              default -> throw new IllegalArgumentException("unknown fault " + fault);
            };
        s = s.withPart(ref, p -> faultedTrimmer);
      } else if (stage.rail(ref).isEmpty()) {
        switch (kind) {
          case "leaky" -> {
            Part junction = stage.part(ref).orElseThrow();
            s =
                s.plusPart(
                    Part.resistor(
                        "LEAK",
                        unit.path("faultValue").asDouble(),
                        0,
                        junction.netA(),
                        junction.netB()));
          }
          case "open" -> s = s.minusPart(ref);
          case "short" ->
              s =
                  s.withPart(
                      ref, p -> new Part(p.ref(), PartKind.RESISTOR, 0, 0, p.netA(), p.netB()));
          case "high", "low" -> {
            double value = unit.path("faultValue").asDouble();
            s = s.withPart(ref, p -> p.withValue(value));
          }
          case "stuck-high" -> conditions = conditions.withForced(ref, SectionState.HIGH);
          case "stuck-low" -> conditions = conditions.withForced(ref, SectionState.LOW);
          case "dead" -> conditions = conditions.withForced(ref, SectionState.DEAD);
          case "lifted" -> {
            for (Amplifier amp : stage.amplifiers()) {
              for (Terminal t : Terminal.values()) {
                if (amp.pinName(t).equals(ref)) {
                  s = s.withAmplifier(amp.ref(), a -> a.withNet(t, "pin:" + ref));
                }
              }
            }
          }
          case "bridge" -> {
            String pkg = ref.substring(0, ref.lastIndexOf('.'));
            String[] pins = ref.substring(ref.lastIndexOf('.') + 1).split("-");
            Map<String, String> pinNets = s.pinNets();
            s =
                s.plusPart(
                    Part.resistor(
                        "BRIDGE",
                        0,
                        0,
                        pinNets.get(pkg + "." + pins[0]),
                        pinNets.get(pkg + "." + pins[1])));
          }
          default -> throw new IllegalArgumentException("unknown fault " + fault);
        }
      }
    }
    int tieCount = 0;
    for (JsonNode tie : unit.path("ties")) {
      s =
          s.plusPart(
              Part.resistor(
                  "TIE" + ++tieCount,
                  FlatCircuit.TIE_OHMS,
                  0,
                  tie.path("node").asText(),
                  tie.path("to").asText()));
      Set<String> group = new HashSet<>();
      tie.path("group").forEach(n -> group.add(n.asText()));
      for (Amplifier amp : s.amplifiers()) {
        DeviceParams p = devices.get(amp.ref());
        devices.put(
            amp.ref(),
            p.withBias(
                group.contains(amp.inPlus()) ? 0 : p.biasPlus(),
                group.contains(amp.inMinus()) ? 0 : p.biasMinus()));
      }
    }
    for (Map.Entry<String, DeviceParams> d : devices.entrySet()) {
      conditions = conditions.withDevice(d.getKey(), d.getValue());
    }
    return new Faulted(s, conditions);
  }

  private static OperatingPoint nearest(List<OperatingPoint> points, JsonNode exact) {
    OperatingPoint best = null;
    double bestDiff = Double.POSITIVE_INFINITY;
    for (OperatingPoint p : points) {
      double worst = 0;
      for (var it = exact.fields(); it.hasNext(); ) {
        var e = it.next();
        worst = Math.max(worst, Math.abs(p.at(e.getKey()) - e.getValue().asDouble()));
      }
      if (worst < bestDiff) {
        bestDiff = worst;
        best = p;
      }
    }
    return best;
  }
}

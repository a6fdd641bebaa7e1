package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.interchange.ReadingsSheet;
import com.stagewise.interchange.StageSheet;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * A diagnoser that has already diagnosed other readings gives, for a set of readings, exactly the
 * diagnosis a fresh diagnoser gives for that set.
 *
 * <p>Outside fact: Bayes' rule itself. The posterior over the faults is the prior times the
 * likelihood of the readings, P(fault | readings) ∝ P(fault) · P(readings | fault); it is a
 * function of the readings alone, not of the order they were taken in nor of what was asked before
 * (the definition of Bayesian ranking, in any probability textbook; the reference is from memory:
 * Jaynes, Probability Theory: The Logic of Science, on updating with data in any order). So is
 * everything worked out from the posterior: the groups, the estimates, the next probes by expected
 * information and the suspects that read the same. The whole diagnosis is compared as text (every
 * double as {@link Double#toString} writes it, which tells any two doubles apart), with the
 * suspects that read the same as the first one.
 *
 * <p>The readings: the fault truth set's ngspice-simulated units (every template and demo sheet:
 * DC, AC, power-off ohms), the demo sheets' own readings files, and the test sheets with readings
 * taken from a fault's prediction (there the readings are only the input; the check is the
 * equality). Each walk goes as a technician works: a few readings, then all, then with the scope's
 * AC, one struck out, with the power off, and back to none.
 */
class ReuseEqualsFreshTest {

  @Test
  void everyTruthSetStage_walkedThroughOneDiagnoser_givesWhatAFreshOneGives() {
    List<TruthCases.StageCases> all = TruthCases.load();
    // The truth set holds every template (by its file name), so every template is walked.
    for (StageTemplate template : Templates.all()) {
      assertThat(all)
          .as("truth set for template " + template.name())
          .anyMatch(s -> s.name().equals("template-" + template.name() + ".json"));
    }
    int steps = 0;
    List<String> found = new ArrayList<>();
    for (TruthCases.StageCases stage : all) {
      MeterSpec meter = stage.meter();
      // One unit a stage: the first with both AC and ohms readings, else the first with either.
      TruthCases.Case c =
          stage.cases().stream()
              .filter(x -> !x.ac().isEmpty() && !x.ohms().isEmpty())
              .findFirst()
              .or(
                  () ->
                      stage.cases().stream()
                          .filter(x -> !x.ac().isEmpty() || !x.ohms().isEmpty())
                          .findFirst())
              .orElse(stage.cases().get(0));
      List<ReadingSet> walk = new ArrayList<>();
      walk.add(c.partial(meter));
      walk.add(c.full(meter));
      if (!c.ac().isEmpty()) {
        walk.add(c.fullWithAc(meter));
        walk.add(struck(c.fullWithAc(meter), 0));
      }
      if (!c.ohms().isEmpty()) {
        walk.add(c.partialWithOhms(meter));
        walk.add(struck(c.fullWithOhms(meter), c.dc().size()));
      }
      walk.add(new ReadingSet(meter, List.of()));
      check(
          stage.name() + " " + c.fault(), stage.stage(), Diagnoser.of(stage.stage()), walk, found);
      steps += walk.size();
    }
    assertThat(found).isEmpty();
    assertThat(steps).isGreaterThan(150);
  }

  @Test
  void demoSheets_withTheirReadingsFiles_walkedThroughOneDiagnoser_giveWhatAFreshOneGives()
      throws IOException {
    int walks = 0;
    List<String> found = new ArrayList<>();
    try (Stream<Path> files = Files.list(Path.of("data/readings"))) {
      for (Path file : files.sorted().toList()) {
        String name = file.getFileName().toString();
        String sheet = name.substring(0, name.indexOf('.')) + StageSheet.SUFFIX;
        Stage stage = StageSheet.read(Path.of("data/stages", sheet));
        ReadingSet readings = ReadingsSheet.read(file, stage);
        List<Reading> volts = new ArrayList<>();
        List<Reading> rest = new ArrayList<>();
        for (Reading r : readings.readings()) {
          (r.kind() == Reading.Kind.DC ? volts : rest).add(r);
        }
        MeterSpec meter = readings.meter();
        List<ReadingSet> walk = new ArrayList<>();
        walk.add(new ReadingSet(meter, volts.subList(0, Math.min(2, volts.size()))));
        walk.add(new ReadingSet(meter, volts));
        walk.add(readings);
        if (readings.readings().size() > 1) {
          walk.add(struck(readings, readings.readings().size() - 1));
          walk.add(struck(readings, 0));
        }
        walk.add(readings);
        check(name, stage, Diagnoser.of(stage), walk, found);
        walks++;
      }
    }
    assertThat(found).isEmpty();
    assertThat(walks).isGreaterThanOrEqualTo(10);
  }

  @Test
  void testSheets_walkedThroughOneDiagnoser_giveWhatAFreshOneGives() {
    List<String> found = new ArrayList<>();
    for (String name : List.of("chain-12", "chain-7-bistable", "channel-level-meter")) {
      Stage stage = StageSheet.read(Path.of("src/test/resources/stages", name + ".stage.json"));
      // Readings from the second suspect's predictions before any reading (a fault), two decimals
      // as a meter shows them.
      Diagnosis none = Diagnoser.of(stage).diagnose(new ReadingSet(MeterSpec.DEFAULT, List.of()));
      Suspect source = none.suspects().get(Math.min(1, none.suspects().size() - 1));
      List<Reading> volts = new ArrayList<>();
      source.predicted().forEach((at, v) -> volts.add(Reading.dc(at, Math.round(v * 100) / 100.0)));
      List<Reading> withAc = new ArrayList<>(volts);
      source.predictedAc().forEach((at, v) -> withAc.add(Reading.ac(at, v, acHz(stage))));
      List<ReadingSet> walk = new ArrayList<>();
      walk.add(new ReadingSet(MeterSpec.DEFAULT, volts.subList(0, Math.min(3, volts.size()))));
      walk.add(new ReadingSet(MeterSpec.DEFAULT, volts));
      if (!source.predictedAc().isEmpty()) {
        walk.add(new ReadingSet(MeterSpec.DEFAULT, withAc));
      }
      walk.add(struck(new ReadingSet(MeterSpec.DEFAULT, volts), 1));
      check(name, stage, Diagnoser.of(stage), walk, found);
    }
    assertThat(found).isEmpty();
  }

  private static double acHz(Stage stage) {
    return stage.inputs().stream()
        .filter(com.stagewise.circuit.TestInput::hasAc)
        .mapToDouble(com.stagewise.circuit.TestInput::hz)
        .findFirst()
        .orElse(1000);
  }

  /**
   * Diagnoses each set of the walk with the one diagnoser (and its mains-powered view), and each
   * with a fresh diagnoser; adds to {@code found} every line that differs, with the step.
   */
  private static void check(
      String what, Stage stage, Diagnoser reused, List<ReadingSet> walk, List<String> found) {
    Diagnoser mains = reused.mainsPowered(true);
    for (int i = 0; i < walk.size(); i++) {
      ReadingSet readings = walk.get(i);
      Diagnoser fresh = Diagnoser.of(stage);
      String step = what + ", step " + i + " (" + readings.readings().size() + " readings)";
      for (String d : differences(dump(reused, readings), dump(fresh, readings))) {
        found.add(step + ":\n" + d);
      }
      for (String d :
          differences(dump(mains, readings), dump(fresh.mainsPowered(true), readings))) {
        found.add(step + ", mains-powered:\n" + d);
      }
    }
  }

  /**
   * Every field of the diagnosis, one per line so that a failure shows where, and the same list.
   */
  private static String dump(Diagnoser diagnoser, ReadingSet readings) {
    Diagnosis d = diagnoser.diagnose(readings);
    Map<String, Object> fields = new LinkedHashMap<>();
    fields.put("verdict", d.verdict());
    for (int i = 0; i < d.suspects().size(); i++) {
      fields.put("suspect " + i, d.suspects().get(i));
    }
    for (int i = 0; i < d.nextProbes().size(); i++) {
      fields.put("probe " + i, d.nextProbes().get(i));
    }
    fields.put("check", d.confirmingCheck());
    fields.put("observations", d.observations());
    fields.put("notes", d.notes());
    fields.put("same as first", diagnoser.sameAsFirst(readings));
    StringBuilder out = new StringBuilder();
    fields.forEach((k, v) -> out.append(k).append(": ").append(v).append('\n'));
    return out.toString();
  }

  /** The lines that differ, each as the reused diagnoser's and the fresh one's; empty if none. */
  private static List<String> differences(String reused, String fresh) {
    List<String> a = reused.lines().toList();
    List<String> b = fresh.lines().toList();
    List<String> out = new ArrayList<>();
    for (int i = 0; i < Math.max(a.size(), b.size()); i++) {
      String x = i < a.size() ? a.get(i) : "(none)";
      String y = i < b.size() ? b.get(i) : "(none)";
      if (!x.equals(y)) {
        out.add("reused: " + x + "\n fresh: " + y);
      }
    }
    return out;
  }

  private static ReadingSet struck(ReadingSet set, int index) {
    List<Reading> left = new ArrayList<>(set.readings());
    left.remove(index);
    return new ReadingSet(set.meter(), left);
  }
}

package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.ReadingSet;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.function.BiFunction;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Accuracy of the diagnosis on the fault truth set: faulted units simulated independently with
 * ngspice 39 (Debian package), with random in-tolerance parts and device parameters and meter error
 * added. The floors are the project's own (reasons beside them in {@link
 * #fullDcReadings_meetTheTargets}); the figures are written to target/diagnosis-accuracy.md for
 * DEVELOPERS.md.
 */
class DiagnosisAccuracyTest {
  private static final Map<String, Score> SCORES = new TreeMap<>();
  private static final Map<String, Score> FAMILY_SCORES = new TreeMap<>();
  private static List<TruthCases.StageCases> truth;

  @BeforeAll
  static void load() {
    truth = TruthCases.load();
  }

  /** Hit counts for one way of reading. */
  static final class Score {
    int cases;
    int firstOrGroup;
    int topThree;
    int topThreeOrTied;
    int healthy;
    int healthyCalled;
    long groupSizes;
    final Map<String, int[]> byKind = new TreeMap<>();

    double rate(int hits) {
      return cases == 0 ? 0 : (double) hits / cases;
    }
  }

  private static Score score(
      String name, BiFunction<TruthCases.Case, TruthCases.StageCases, ReadingSet> readings) {
    Score score = new Score();
    Map<String, Score> families = new TreeMap<>();
    for (TruthCases.StageCases stage : truth) {
      Diagnoser diagnoser = Diagnoser.of(stage.stage());
      Score family = families.computeIfAbsent(family(stage.stage()), f -> new Score());
      for (TruthCases.Case c : stage.cases()) {
        Diagnosis d = diagnoser.diagnose(readings.apply(c, stage), 20);
        count(score, c, d);
        count(family, c, d);
      }
    }
    SCORES.put(name, score);
    families.forEach((f, s) -> FAMILY_SCORES.put(name + ", " + f, s));
    return score;
  }

  /**
   * The stage family a stage belongs to: op-amp stages of resistors and capacitors, stages with
   * diodes, zeners or LEDs, and stages with trimmers (a stage with both counts as a junction
   * stage).
   */
  static String family(com.stagewise.circuit.Stage stage) {
    if (stage.parts().stream().anyMatch(p -> p.kind().isJunction())) {
      return "stages with diodes, zeners or LEDs";
    }
    if (stage.parts().stream().anyMatch(p -> p.kind().isTrimmer())) {
      return "stages with trimmers";
    }
    return "resistors and capacitors only";
  }

  private static void count(Score score, TruthCases.Case c, Diagnosis d) {
    Suspect first = d.suspects().get(0);
    boolean hit = first.fault().equals(c.fault()) || first.group().contains(c.fault());
    boolean three = d.suspects().stream().limit(3).anyMatch(s -> s.fault().equals(c.fault()));
    // Tied: the readings cannot tell the truth apart from one of the first three suspects.
    boolean tied = d.suspects().stream().limit(3).anyMatch(s -> s.group().contains(c.fault()));
    score.cases++;
    score.firstOrGroup += hit ? 1 : 0;
    score.topThree += three ? 1 : 0;
    score.topThreeOrTied += three || tied ? 1 : 0;
    score.groupSizes += first.group().size();
    if (c.fault().equals("healthy")) {
      score.healthy++;
      score.healthyCalled += d.verdict() == Verdict.HEALTHY ? 1 : 0;
    }
    String kind =
        c.fault().contains(":") ? c.fault().substring(c.fault().lastIndexOf(':') + 1) : c.fault();
    int[] k = score.byKind.computeIfAbsent(kind, x -> new int[3]);
    k[0]++;
    k[1] += hit ? 1 : 0;
    k[2] += three ? 1 : 0;
  }

  @Test
  void fullDcReadings_meetTheTargets() throws IOException {
    Score s = score("full DC readings", (c, st) -> c.full(st.meter()));
    write();
    // Our floors: truth first or in its group ≥ 90 % (the technician checks the first group at
    // the bench; below that the list sends them after the wrong parts too often to save time),
    // in the first three ≥ 98 % counting ties, healthy called healthy ≥ 95 % (each false alarm
    // sends a technician after a good part). Where the readings cannot tell the truth from
    // several faults (a part no read pin sees, a capacitor at DC) only the priors order the tie,
    // so the first-three floor is checked with ties counted; the raw figure is reported beside it
    // in DEVELOPERS.md.
    assertThat(s.cases).isGreaterThan(50);
    assertThat(s.rate(s.firstOrGroup)).isGreaterThanOrEqualTo(0.90);
    assertThat(s.rate(s.topThreeOrTied)).isGreaterThanOrEqualTo(0.98);
    assertThat(s.rate(s.topThree)).isGreaterThanOrEqualTo(0.80);
    assertThat((double) s.healthyCalled / s.healthy).isGreaterThanOrEqualTo(0.95);
  }

  @Test
  void partialReadings_areReported() throws IOException {
    Score s = score("partial DC readings", (c, st) -> c.partial(st.meter()));
    write();
    // No target for partial readings; the truth must still be found among the first few often.
    assertThat(s.rate(s.firstOrGroup)).isGreaterThan(0.5);
  }

  @Test
  void fullReadingsWithAc_areAtLeastAsGood() throws IOException {
    Score dc =
        SCORES.containsKey("full DC readings")
            ? SCORES.get("full DC readings")
            : score("full DC readings", (c, st) -> c.full(st.meter()));
    Score ac = score("full DC and AC readings", (c, st) -> c.fullWithAc(st.meter()));
    write();
    assertThat(ac.rate(ac.firstOrGroup)).isGreaterThanOrEqualTo(dc.rate(dc.firstOrGroup) - 0.02);
  }

  @Test
  void powerOffReadings_areReportedBesideVolts_andDoNotMakeItWorse() throws IOException {
    Score dc =
        SCORES.containsKey("full DC readings")
            ? SCORES.get("full DC readings")
            : score("full DC readings", (c, st) -> c.full(st.meter()));
    // Every pair of nets read with the power off (ngspice, the ohmmeter's error drawn as the truth
    // generator draws it), beside the full and the partial DC readings.
    Score ohms = score("full DC and power-off readings", (c, st) -> c.fullWithOhms(st.meter()));
    Score partial =
        score("partial DC and power-off readings", (c, st) -> c.partialWithOhms(st.meter()));
    write();
    assertThat(ohms.rate(ohms.firstOrGroup)).isGreaterThanOrEqualTo(dc.rate(dc.firstOrGroup));
    assertThat((double) ohms.groupSizes / ohms.cases)
        .isLessThanOrEqualTo((double) dc.groupSizes / dc.cases);
    assertThat((double) ohms.healthyCalled / ohms.healthy).isGreaterThanOrEqualTo(0.95);
    assertThat(partial.rate(partial.firstOrGroup)).isGreaterThan(0.5);
  }

  @Test
  void followingTheNextProbe_isolatesTheTruth() throws IOException {
    // Start from nothing, take the reading that nextProbes puts first (from the simulated unit),
    // and count readings until the true fault stands first with a group of its own.
    int cases = 0;
    int isolated = 0;
    long probes = 0;
    int visible = 0;
    for (TruthCases.StageCases stage : truth) {
      Diagnoser diagnoser = Diagnoser.of(stage.stage());
      for (int i = 0; i < stage.cases().size(); i += 2) {
        TruthCases.Case c = stage.cases().get(i);
        if (c.fault().equals("healthy")) {
          continue;
        }
        cases++;
        List<com.stagewise.circuit.Reading> taken = new ArrayList<>();
        List<com.stagewise.circuit.Reading> available = new ArrayList<>(c.dc());
        available.addAll(c.ac());
        boolean done = false;
        while (true) {
          Diagnosis d = diagnoser.diagnose(new ReadingSet(stage.meter(), taken), 5);
          Suspect first = d.suspects().get(0);
          if (first.fault().equals(c.fault()) && first.group().size() == 1) {
            done = true;
            break;
          }
          com.stagewise.circuit.Reading next = null;
          for (var advice : d.nextProbes()) {
            next =
                available.stream()
                    .filter(r -> r.at().equals(advice.at()) && r.kind() == advice.kind())
                    .findFirst()
                    .orElse(null);
            if (next != null) {
              break;
            }
          }
          if (next == null) {
            break;
          }
          available.remove(next);
          taken.add(next);
        }
        // Whether the full set can isolate it at all: otherwise no order of probes could.
        Diagnosis all = diagnoser.diagnose(c.fullWithAc(stage.meter()), 5);
        boolean canIsolate =
            all.suspects().get(0).fault().equals(c.fault())
                && all.suspects().get(0).group().size() == 1;
        visible += canIsolate ? 1 : 0;
        if (done) {
          isolated++;
          probes += taken.size();
        }
      }
    }
    String line =
        String.format(
            Locale.ROOT,
            "%nFollowing nextProbes from no readings: %d faulty cases, %d can be isolated with every reading,"
                + " %d isolated by following the advice, mean %.1f readings each.%n",
            cases,
            visible,
            isolated,
            isolated == 0 ? 0.0 : (double) probes / isolated);
    Path out = Paths.get("target", "diagnosis-probes.md");
    Files.createDirectories(out.getParent());
    Files.writeString(out, line);
    assertThat(isolated).isGreaterThanOrEqualTo((int) (0.9 * visible));
    assertThat((double) probes / Math.max(1, isolated)).isLessThan(6);
  }

  private static synchronized void write() throws IOException {
    StringBuilder text =
        new StringBuilder(
            "| readings | cases | first or in group | first three | first three or tied | healthy called healthy | mean group size |\n|---|---|---|---|---|---|---|\n");
    List<String> kinds = new ArrayList<>();
    Map<String, Score> rows = new java.util.LinkedHashMap<>(SCORES);
    rows.putAll(FAMILY_SCORES);
    rows.forEach(
        (name, s) -> {
          text.append(
              String.format(
                  Locale.ROOT,
                  "| %s | %d | %.1f %% | %.1f %% | %.1f %% | %d of %d | %.2f |%n",
                  name,
                  s.cases,
                  100 * s.rate(s.firstOrGroup),
                  100 * s.rate(s.topThree),
                  100 * s.rate(s.topThreeOrTied),
                  s.healthyCalled,
                  s.healthy,
                  (double) s.groupSizes / Math.max(1, s.cases)));
          StringBuilder k =
              new StringBuilder(
                  "\n" + name + " by fault kind (cases, first or in group, first three): ");
          s.byKind.forEach(
              (kind, v) ->
                  k.append(String.format(Locale.ROOT, "%s %d/%d/%d; ", kind, v[0], v[1], v[2])));
          kinds.add(k.toString());
        });
    kinds.forEach(text::append);
    Path out = Paths.get("target", "diagnosis-accuracy.md");
    Files.createDirectories(out.getParent());
    Files.writeString(out, text.append('\n').toString());
  }
}

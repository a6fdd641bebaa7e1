package com.stagewise.diagnosis;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.solver.PowerOff;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.SplittableRandom;
import java.util.stream.Stream;

/**
 * Measures, on the fault truth set, how many probes it takes to isolate the true fault when
 * following {@code nextProbes} from no readings, with and without power-off checks allowed. Run by
 * hand (it prints a table; not a unit test): {@code java -cp …
 * com.stagewise.diagnosis.OhmsProbeMeasure [every-Nth-case]}.
 *
 * <p>Volts readings come from the truth set (ngspice, meter error as drawn there); so do ohms
 * readings between two nets (ngspice on the unit's power-off network, ohmmeter error drawn there).
 * A point that is a package pin or a part lead reads as its net, except a lifted pin, which touches
 * nothing with the power off (OL); a pin against its own net reads the leads' 0 Ω with the meter's
 * error (±3 counts of 0.1 Ω).
 */
public final class OhmsProbeMeasure {
  private static final int MAX_PROBES = 3;

  private OhmsProbeMeasure() {}

  public static void main(String[] args) throws Exception {
    int every = args.length > 0 ? Integer.parseInt(args[0]) : 2;
    ObjectMapper mapper = new ObjectMapper();
    int cases = 0;
    int[] within = new int[2];
    long[] probes = new long[2];
    int[] isolated = new int[2];
    // The same counted with a group of faults that read the same everywhere (a bridge and a short
    // between the same nets) standing in for the true fault: not the strict figure above.
    int[] withinGrouped = new int[2];
    long[] probesGrouped = new long[2];
    int[] isolatedGrouped = new int[2];
    SplittableRandom rnd = new SplittableRandom(20261202L);
    // Per fault kind, with ohms allowed: units, within 3 probes, isolated by every reading of the
    // unit at once (all DC, AC and ohms between nets), and first with a group of its own but not
    // alone-first within 3 (a tie the readings cannot break, or more probes needed).
    java.util.Map<String, int[]> kinds = new java.util.TreeMap<>();
    List<Path> files;
    try (Stream<Path> s = Files.list(TruthCases.FOLDER)) {
      files = s.filter(f -> f.toString().endsWith(".json")).sorted().toList();
    }
    List<TruthCases.StageCases> truth = TruthCases.load();
    for (int f = 0; f < files.size(); f++) {
      JsonNode root = mapper.readTree(files.get(f).toFile());
      TruthCases.StageCases stage = truth.get(f);
      Diagnoser diagnoser = Diagnoser.of(stage.stage());
      JsonNode rawCases = root.get("cases");
      for (int i = 0; i < stage.cases().size(); i += every) {
        TruthCases.Case c = stage.cases().get(i);
        if (c.fault().equals("healthy")) {
          continue;
        }
        cases++;
        JsonNode unit = rawCases.get(i).get("unit");
        Stage unitStage = unitStage(stage.stage(), unit);
        Fault fault =
            Fault.parse(
                c.fault(),
                stage.stage().rails().stream()
                    .map(r -> r.net())
                    .collect(java.util.stream.Collectors.toSet()));
        PowerOff healthyUnit = PowerOff.of(unitStage);
        String lifted =
            fault.kind() == FaultKind.LIFTED ? fault.subject() + "." + fault.pin() : null;
        for (int mode = 0; mode < 2; mode++) {
          boolean ohmsAllowed = mode == 1;
          List<Reading> taken = new ArrayList<>();
          List<Reading> available = new ArrayList<>(c.dc());
          available.addAll(c.ac());
          boolean done = false;
          int grouped = -1;
          while (taken.size() <= 8) {
            ReadingSet set = new ReadingSet(stage.meter(), taken);
            Diagnosis d = diagnoser.diagnose(set, 5);
            Suspect first = d.suspects().get(0);
            if (grouped < 0 && aloneAsAGroup(diagnoser, set, first, c.fault())) {
              grouped = taken.size();
            }
            if (first.fault().equals(c.fault()) && first.group().size() == 1) {
              done = true;
              break;
            }
            Reading next = null;
            for (ProbeAdvice advice : d.nextProbes()) {
              if (advice.kind() == Reading.Kind.OHMS) {
                if (ohmsAllowed) {
                  next =
                      Reading.ohms(
                          advice.at(),
                          advice.to(),
                          truthOhms(c, healthyUnit, lifted, advice.at(), advice.to(), rnd, stage));
                  break;
                }
                continue;
              }
              next =
                  available.stream()
                      .filter(r -> r.at().equals(advice.at()) && r.kind() == advice.kind())
                      .findFirst()
                      .orElse(null);
              if (next != null) {
                available.remove(next);
                break;
              }
            }
            if (next == null) {
              break;
            }
            taken.add(next);
          }
          if (grouped >= 0) {
            isolatedGrouped[mode]++;
            probesGrouped[mode] += grouped;
            withinGrouped[mode] += grouped <= MAX_PROBES ? 1 : 0;
          }
          if (done) {
            isolated[mode]++;
            probes[mode] += taken.size();
            if (taken.size() <= MAX_PROBES) {
              within[mode]++;
            }
          }
          if (ohmsAllowed) {
            String kind = c.fault().substring(c.fault().lastIndexOf(':') + 1);
            int[] k = kinds.computeIfAbsent(kind, x -> new int[6]);
            k[0]++;
            k[1] += done && taken.size() <= MAX_PROBES ? 1 : 0;
            List<Reading> everything = new ArrayList<>(c.dc());
            everything.addAll(c.ac());
            everything.addAll(c.ohms());
            ReadingSet atOnce = new ReadingSet(stage.meter(), everything);
            Suspect all = diagnoser.diagnose(atOnce, 5).suspects().get(0);
            k[2] += all.fault().equals(c.fault()) && all.group().size() == 1 ? 1 : 0;
            k[3] += done && taken.size() > MAX_PROBES ? 1 : 0;
            k[4] += grouped >= 0 && grouped <= MAX_PROBES ? 1 : 0;
            k[5] += aloneAsAGroup(diagnoser, atOnce, all, c.fault()) ? 1 : 0;
          }
        }
      }
      System.out.printf(
          Locale.ROOT,
          "%-50s cases %4d  within 3: volts %4d, with ohms %4d%n",
          files.get(f).getFileName(),
          cases,
          within[0],
          within[1]);
    }
    System.out.println(
        "by fault kind (units, within 3 with ohms, isolated by every reading at once, isolated"
            + " only after more than 3; then counting a same-readings group as one: within 3,"
            + " by every reading at once):");
    int[] sum = new int[6];
    kinds.forEach(
        (kind, k) -> {
          System.out.printf(
              Locale.ROOT,
              "  %-12s %4d %4d %4d %4d   %4d %4d%n",
              kind,
              k[0],
              k[1],
              k[2],
              k[3],
              k[4],
              k[5]);
          for (int i = 0; i < sum.length; i++) {
            sum[i] += k[i];
          }
        });
    System.out.printf(
        Locale.ROOT,
        "  %-12s %4d %4d %4d %4d   %4d %4d%n",
        "all",
        sum[0],
        sum[1],
        sum[2],
        sum[3],
        sum[4],
        sum[5]);
    for (int mode = 0; mode < 2; mode++) {
      System.out.printf(
          Locale.ROOT,
          "%s: %d faulty units; true fault first alone within %d probes in %d (%.1f %%);"
              + " isolated at all in %d, mean %.2f probes%n",
          mode == 0 ? "volts only" : "ohms allowed",
          cases,
          MAX_PROBES,
          within[mode],
          100.0 * within[mode] / cases,
          isolated[mode],
          isolated[mode] == 0 ? 0.0 : (double) probes[mode] / isolated[mode]);
      System.out.printf(
          Locale.ROOT,
          "  counting a same-readings group as one (not the strict figure): within %d probes in"
              + " %d (%.1f %%); isolated at all in %d, mean %.2f probes%n",
          MAX_PROBES,
          withinGrouped[mode],
          100.0 * withinGrouped[mode] / cases,
          isolatedGrouped[mode],
          isolatedGrouped[mode] == 0 ? 0.0 : (double) probesGrouped[mode] / isolatedGrouped[mode]);
    }
  }

  /**
   * Whether the true fault stands first alone counting the faults that read the same as it
   * everywhere as one: the first suspect is the truth or reads the same as it, and every other
   * member of the first group reads the same as the first.
   */
  private static boolean aloneAsAGroup(
      Diagnoser diagnoser, ReadingSet readings, Suspect first, String truth) {
    List<String> same = diagnoser.sameAsFirst(readings);
    return same.contains(truth) && same.containsAll(first.group());
  }

  /** Returns what the ohmmeter showed between two points of the simulated unit (see above). */
  private static double truthOhms(
      TruthCases.Case c,
      PowerOff healthy,
      String lifted,
      String a,
      String b,
      SplittableRandom rnd,
      TruthCases.StageCases stage) {
    if (a.equals(lifted) || b.equals(lifted)) {
      return Double.POSITIVE_INFINITY;
    }
    String netA = healthy.node(a).orElseThrow();
    String netB = healthy.node(b).orElseThrow();
    if (netA.equals(netB)) {
      return shown(rnd, stage.meter(), 0);
    }
    for (Reading r : c.ohms()) {
      if (Set.of(r.at(), r.to()).equals(Set.of(netA, netB))) {
        return r.value();
      }
    }
    throw new IllegalStateException(
        "no ohms reading " + netA + " to " + netB + " in the truth set");
  }

  private static Stage unitStage(Stage stage, JsonNode unit) {
    List<Part> parts = new ArrayList<>();
    for (Part p : stage.parts()) {
      JsonNode v = unit.get("parts").get(p.ref());
      parts.add(v == null ? p : p.withValue(v.asDouble()));
    }
    return stage.withParts(parts);
  }

  /** What the meter shows: OL beyond its top range, else the value with the error drawn. */
  private static double shown(SplittableRandom rnd, MeterSpec meter, double ohms) {
    if (!Double.isFinite(ohms) || ohms > meter.ohmsOverRange()) {
      return Double.POSITIVE_INFINITY;
    }
    double u = meter.ohmsUncertainty(ohms);
    double value = Math.max(0, ohms + u * (2 * rnd.nextDouble() - 1));
    double step = meter.ohms().resolution(value, meter.displayCounts());
    BigDecimal s = new BigDecimal(step, new MathContext(1));
    double rounded =
        new BigDecimal(value).divide(s, 0, RoundingMode.HALF_EVEN).multiply(s).doubleValue();
    return rounded > meter.ohmsOverRange() ? Double.POSITIVE_INFINITY : rounded;
  }
}

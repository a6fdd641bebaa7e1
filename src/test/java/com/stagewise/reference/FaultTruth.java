package com.stagewise.reference;

import com.stagewise.circuit.Stage;
import com.stagewise.reference.FaultSimulation.Case;
import com.stagewise.reference.FaultSimulation.Dropped;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.TreeMap;
import java.util.stream.IntStream;
import java.util.stream.Stream;

/**
 * Generates the fault truth set for the diagnosis accuracy test: for every checked stage, {@code
 * healthy} and every fault of {@link FaultList}, several simulated units (random in-tolerance
 * parts, rails and device parameters; the fault applied to the netlist here; ngspice 39, Debian
 * package, as reference simulator; meter error added). Seeded, so a rerun writes the same files.
 * Run by {@code src/scripts/spice-reference.sh truth} from the project root.
 */
public final class FaultTruth {
  /** The master seed of the whole set. */
  static final long SEED = 20_261_202L;

  /** Units simulated per fault. */
  static final int SAMPLES_PER_FAULT = 2;

  /** Units simulated healthy, per stage: more, so that false alarms are measured too. */
  static final int HEALTHY_SAMPLES = 8;

  private FaultTruth() {}

  /**
   * Writes one truth file per stage and prints the counts per fault kind and the dropped cases;
   * with the argument {@code missing}, only the stages that have no truth file yet (others are left
   * as they are).
   */
  public static void main(String[] args) throws IOException {
    boolean onlyMissing = args.length > 0 && args[0].equals("missing");
    if (!Ngspice.available()) {
      System.err.println(Ngspice.MISSING);
      System.exit(1);
    }
    Map<String, Integer> perKind = new TreeMap<>();
    Map<String, Integer> droppedPerKind = new TreeMap<>();
    List<String> written = new ArrayList<>();
    int total = 0;
    for (ReferenceStages.Named named : truthStages()) {
      String name = named.source().name() + ".json";
      if (onlyMissing && Files.exists(TruthFiles.FOLDER.resolve(name))) {
        continue;
      }
      TruthFiles.StageTruth truth = generate(named);
      TruthFiles.write(TruthFiles.FOLDER.resolve(name), truth);
      written.add(name);
      for (Case c : truth.cases()) {
        perKind.merge(kindOf(named.stage(), c.fault()), 1, Integer::sum);
        total++;
      }
      for (Dropped d : truth.dropped()) {
        droppedPerKind.merge(kindOf(named.stage(), d.fault()), 1, Integer::sum);
      }
    }
    try (Stream<Path> files = Files.list(TruthFiles.FOLDER)) {
      for (Path file : files.toList()) {
        if (!onlyMissing && !written.contains(file.getFileName().toString())) {
          Files.delete(file);
        }
      }
    }
    System.out.println(
        "wrote " + total + " cases for " + written.size() + " stages to " + TruthFiles.FOLDER);
    System.out.println("cases per fault kind: " + perKind);
    System.out.println("dropped (ngspice did not converge): " + droppedPerKind);
  }

  /**
   * The stages of the truth set: the templates and the sheets, or the hand-built stages before they
   * exist.
   */
  static List<ReferenceStages.Named> truthStages() {
    List<ReferenceStages.Named> library =
        ReferenceStages.all().stream().filter(n -> !n.source().kind().equals("hand")).toList();
    return library.isEmpty() ? ReferenceStages.all() : library;
  }

  /** Simulates every case of one stage, in parallel, in a fixed order. */
  static TruthFiles.StageTruth generate(ReferenceStages.Named named) {
    Stage stage = named.stage();
    record Spec(String fault, int sample, long seed) {}
    List<Spec> specs = new ArrayList<>();
    for (String fault : FaultList.of(stage)) {
      int samples = fault.equals("healthy") ? HEALTHY_SAMPLES : SAMPLES_PER_FAULT;
      for (int sample = 0; sample < samples; sample++) {
        specs.add(new Spec(fault, sample, caseSeed(named.source().name(), fault, sample)));
      }
    }
    Object[] results = new Object[specs.size()];
    IntStream.range(0, specs.size())
        .parallel()
        .forEach(
            i -> {
              Spec s = specs.get(i);
              results[i] =
                  FaultSimulation.simulate(
                      stage, s.fault(), s.seed(), s.sample(), MeterModel.HANDHELD);
            });
    List<Case> cases = new ArrayList<>();
    List<Dropped> dropped = new ArrayList<>();
    for (Object result : results) {
      if (result instanceof Case c) {
        cases.add(c);
      } else {
        dropped.add((Dropped) result);
      }
    }
    return new TruthFiles.StageTruth(
        named.source(),
        stage,
        SEED,
        SAMPLES_PER_FAULT,
        HEALTHY_SAMPLES,
        FaultList.skipped(stage),
        dropped,
        cases);
  }

  /**
   * A seed per case from the master seed, the stage, the fault and the sample: stable across runs.
   */
  static long caseSeed(String stage, String fault, int sample) {
    long h = SEED;
    for (char ch : (stage + "|" + fault + "|" + sample).toCharArray()) {
      h = h * 31 + ch;
    }
    return new SplittableRandom(h).nextLong() & Long.MAX_VALUE;
  }

  /** Returns the kind of a fault id: {@code open}, {@code lifted}, {@code rail-low}, …. */
  static String kindOf(Stage stage, String fault) {
    if (fault.equals("healthy")) {
      return "healthy";
    }
    int colon = fault.lastIndexOf(':');
    String kind = fault.substring(colon + 1);
    return stage.rail(fault.substring(0, colon)).isPresent() ? "rail-" + kind : kind;
  }
}

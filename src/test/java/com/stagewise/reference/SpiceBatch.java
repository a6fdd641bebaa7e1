package com.stagewise.reference;

import com.stagewise.circuit.Stage;
import com.stagewise.solver.Conditions;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;

/**
 * The whole fault dictionary of one stage as one ngspice batch run, and how long ngspice takes for
 * it (ngspice 39, Debian package, as reference simulator), for the diagnosis benchmark's "ngspice
 * takes X ms for the same fault dictionary".
 *
 * <p>Every fault of {@link FaultList} (nominal parts and device parameters; a drifted part at ×5 or
 * ÷5; floating nodes tied as in the truth set, with a fixed seed) is one small circuit file; one
 * control script loads each in turn ({@code source}), solves it ({@code op}, and {@code ac} when
 * the stage has an AC input), prints every node and removes it ({@code remcirc}). One process start
 * for the whole dictionary, and each fault converges on its own as in a single run. (One deck with
 * every fault as a subcircuit under a single {@code op} was tried: ngspice then needs gmin and
 * source stepping for the joint Newton iteration, which is slower and can fail as a whole.) {@code
 * SpiceBatchTest} checks the batch's answers against one run per fault.
 */
public final class SpiceBatch {
  /** The seed for the tie directions of floating nodes in the dictionary. */
  static final long SEED = 7L;

  /** The control script's file name; the faults are {@code f1.cir}, {@code f2.cir}, …. */
  static final String MAIN = "dictionary.cir";

  private SpiceBatch() {}

  /**
   * One batch run for a stage's whole fault dictionary.
   *
   * @param files file name → text: the control script and one circuit file per fault
   * @param faults the fault ids, in the order of the circuit files
   * @param nodes per fault, our node name → SPICE node name
   * @param flats per fault, the flattened faulted circuit
   */
  record Deck(
      Map<String, String> files,
      List<String> faults,
      List<Map<String, String>> nodes,
      List<FlatCircuit> flats) {}

  /** Returns the batch run of every fault of a stage at nominal values. */
  static Deck deck(Stage stage) {
    SplittableRandom rnd = new SplittableRandom(SEED);
    List<String> faults = FaultList.of(stage);
    List<Map<String, String>> nodes = new ArrayList<>();
    List<FlatCircuit> flats = new ArrayList<>();
    Map<String, String> files = new LinkedHashMap<>();
    StringBuilder control = new StringBuilder();
    control
        .append("* fault dictionary of ")
        .append(stage.title().replaceAll("[\\r\\n]+", " "))
        .append('\n');
    control.append(".control\nset numdgt=15\n");
    for (int i = 0; i < faults.size(); i++) {
      FlatCircuit flat = FlatCircuit.of(stage, Conditions.NOMINAL);
      applyNominal(flat, stage, faults.get(i), rnd);
      FaultSimulation.tieFloating(flat, rnd);
      SpiceNetlist.Body body = SpiceNetlist.body(flat, false);
      String file = "f" + (i + 1) + ".cir";
      files.put(
          file,
          "* "
              + faults.get(i)
              + "\n"
              + SpiceNetlist.options(false)
              + "\n"
              + body.lines()
              + ".end\n");
      control.append("source ").append(file).append('\n');
      control.append("echo @@fault ").append(i + 1).append("\necho @@op\nop\nprint all\n");
      if (flat.hz > 0) {
        control
            .append("echo @@ac\nac lin 1 ")
            .append(SpiceNetlist.num(flat.hz))
            .append(' ')
            .append(SpiceNetlist.num(flat.hz))
            .append("\nprint all\n");
      }
      control.append("echo @@end\nremcirc\n");
      nodes.add(body.spiceNodes());
      flats.add(flat);
    }
    // Without quit 0, ngspice 39 in batch mode exits with status 1.
    control.append("quit 0\n.endc\n.end\n");
    files.put(MAIN, control.toString());
    return new Deck(files, faults, nodes, flats);
  }

  /** Applies a fault at nominal values: a drifted part is off by exactly ×5 or ÷5. */
  private static void applyNominal(
      FlatCircuit flat, Stage stage, String fault, SplittableRandom rnd) {
    if (fault.endsWith(":high")
        || (fault.endsWith(":low")
            && stage.rail(fault.substring(0, fault.length() - 4)).isEmpty())) {
      String ref = fault.substring(0, fault.lastIndexOf(':'));
      int i = flat.branchIndex(ref);
      FlatCircuit.Branch b = flat.branches.get(i);
      double value = fault.endsWith(":high") ? b.value() * 5 : b.value() / 5;
      flat.branches.set(i, new FlatCircuit.Branch(b.label(), b.kind(), b.a(), b.b(), value));
      return;
    }
    FaultSimulation.apply(flat, stage, fault, rnd);
  }

  /** Runs the deck once and returns each fault's outcome, in the deck's order. */
  static List<Ngspice.Outcome> solve(Deck deck) {
    return outcomes(deck, Ngspice.runFiles(deck.files(), MAIN));
  }

  /** Splits the batch's output at the {@code @@fault K} markers and reads each fault's part. */
  private static List<Ngspice.Outcome> outcomes(Deck deck, String output) {
    String stdout = output.substring(0, Math.max(0, output.indexOf("\n@@stderr\n")));
    String[] parts = stdout.split("\\n@@fault ");
    List<Ngspice.Outcome> outcomes = new ArrayList<>();
    for (int i = 0; i < deck.faults().size(); i++) {
      String mine = "";
      for (String part : parts) {
        if (part.startsWith((i + 1) + "\n")) {
          mine = part;
        }
      }
      outcomes.add(Ngspice.parse(mine, deck.nodes().get(i)));
    }
    return outcomes;
  }

  /**
   * Returns ngspice's wall time for the whole fault dictionary of a stage: one process that reads
   * the control script, loads and solves every fault (DC, and AC when the stage has an AC input)
   * and prints every node voltage. Start-up is included, as a caller of ngspice pays it; the files
   * are made beforehand and their writing is included (a few kilobytes).
   *
   * @throws IllegalStateException if ngspice is not on the PATH or does not solve every fault
   */
  public static Duration timeFaultDictionary(Stage stage) {
    Deck deck = deck(stage);
    long start = System.nanoTime();
    String output = Ngspice.runFiles(deck.files(), MAIN);
    long end = System.nanoTime();
    for (Ngspice.Outcome outcome : outcomes(deck, output)) {
      if (!(outcome instanceof Ngspice.Solved)) {
        throw new IllegalStateException(
            "ngspice did not solve the fault dictionary of " + stage.title() + ": " + outcome);
      }
    }
    return Duration.ofNanos(end - start);
  }

  /**
   * A stage's fault dictionary written to a temporary folder beforehand, so that a timing counts
   * ngspice alone (its process start included), not the Java side that writes the netlists.
   */
  public static final class Written implements AutoCloseable {
    private final Deck deck;
    private final java.nio.file.Path dir;

    private Written(Deck deck) {
      this.deck = deck;
      this.dir = Ngspice.writeFiles(deck.files());
    }

    /** Runs ngspice on the written dictionary; checks that every fault solved. */
    public Duration run() {
      long start = System.nanoTime();
      String output = Ngspice.runIn(dir, MAIN);
      long end = System.nanoTime();
      for (Ngspice.Outcome outcome : outcomes(deck, output)) {
        if (!(outcome instanceof Ngspice.Solved)) {
          throw new IllegalStateException("ngspice did not solve the fault dictionary: " + outcome);
        }
      }
      return Duration.ofNanos(end - start);
    }

    /** Returns the ngspice command that runs the dictionary from within {@link #folder()}. */
    public String command() {
      return "ngspice -b " + MAIN;
    }

    /** Returns the folder the netlists are written to. */
    public java.nio.file.Path folder() {
      return dir;
    }

    /** Deletes the folder. */
    @Override
    public void close() {
      Ngspice.deleteQuietly(dir);
    }
  }

  /** Writes a stage's fault dictionary (nominal parts) to a temporary folder for timed runs. */
  public static Written written(Stage stage) {
    return new Written(deck(stage));
  }

  /**
   * Prints ngspice's time for the fault dictionary of each named stage (all checked stages when no
   * name is given): the median of 7 runs after one warm-up.
   */
  public static void main(String[] args) {
    if (!Ngspice.available()) {
      System.err.println(Ngspice.MISSING);
      System.exit(1);
    }
    for (ReferenceStages.Named named : ReferenceStages.all()) {
      if (args.length > 0
          && !args[0].isEmpty()
          && !Arrays.asList(args).contains(named.source().name())) {
        continue;
      }
      timeFaultDictionary(named.stage());
      long[] ms = new long[7];
      for (int i = 0; i < ms.length; i++) {
        ms[i] = timeFaultDictionary(named.stage()).toNanos();
      }
      Arrays.sort(ms);
      System.out.printf(
          Locale.ROOT,
          "%-40s %3d faults  ngspice %.1f ms (median of 7)%n",
          named.source().name(),
          FaultList.of(named.stage()).size(),
          ms[3] / 1e6);
    }
  }
}

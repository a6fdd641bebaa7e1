package com.stagewise.reference;

import com.stagewise.circuit.Stage;
import com.stagewise.solver.Conditions;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Power-off resistances between every pair of nets of a stage, for every fault of the catalogue,
 * computed by ngspice (ngspice 39, Debian package, as reference simulator) in batch mode.
 *
 * <p>Each fault is applied to the flattened circuit by the truth generator ({@link
 * FaultSimulation#apply}: a drifted part at exactly ×5 or ÷5 as in {@link SpiceBatch}); then every
 * source and op-amp section is removed (power off: rails and inputs disconnected, op-amp pins draw
 * nothing) and the remaining network is written by {@link SpiceNetlist#body} (resistors, and
 * capacitors, which {@code .op} treats as open). One 1 mA test current source per pair of points,
 * all at 0; the control script sets one at a time to 1 mA ({@code alter}), runs {@code .op} and
 * prints {@code v(a) - v(b)}: the resistance in kilohms. A 1 TΩ shunt from every node to ground
 * gives every node a path to ground so that nodes the meter cannot reach do not make the matrix
 * singular; a pair that reads above {@link #OVER_RANGE} ohms is one that nothing connects (it reads
 * the shunts, about 10¹² Ω). The shunts change a 10 MΩ reading by 10⁻⁵, far below the 0.1 %
 * checked.
 *
 * <p>The points are the stage's nets, plus, for a lifted pin, that pin (its own node once lifted).
 * All faults of a stage run in one ngspice process (one circuit file per fault, loaded with {@code
 * source}, removed with {@code remcirc}); faults that leave the network unchanged (outputs stuck or
 * dead, rails missing or low, a capacitor drifted) share one circuit.
 */
final class SpicePowerOff {
  /** The test current in amperes. */
  static final double TEST_AMPS = 1e-3;

  /** Readings above this (ohms) are nothing-connects: the shunts alone are about 10¹² Ω. */
  static final double OVER_RANGE = 1e9;

  private static final String MAIN = "poweroff.cir";

  private static final Pattern VALUE = Pattern.compile("=\\s*([-+0-9.eE]+)\\s*$");

  private SpicePowerOff() {}

  /**
   * The ngspice answers for one fault.
   *
   * @param fault the fault id
   * @param pairs the pairs of points, each {@code [a, b]}
   * @param ohms the resistance of each pair, {@link Double#POSITIVE_INFINITY} when nothing connects
   */
  record Answer(String fault, List<String[]> pairs, double[] ohms) {}

  /** Returns the pairs of points checked for a fault: every pair of nets, then the lifted pin. */
  static List<String[]> pairs(Stage stage, String fault) {
    List<String> points = new ArrayList<>(stage.nets());
    List<String[]> pairs = new ArrayList<>();
    for (int i = 0; i < points.size(); i++) {
      for (int j = i + 1; j < points.size(); j++) {
        pairs.add(new String[] {points.get(i), points.get(j)});
      }
    }
    if (fault.endsWith(":lifted")) {
      String pin = fault.substring(0, fault.length() - ":lifted".length());
      for (String net : points) {
        pairs.add(new String[] {pin, net});
      }
    }
    return pairs;
  }

  /** Returns the value a drifted part is given in these checks: ×5 or ÷5 of its marked value. */
  static double driftedValue(Stage stage, String fault) {
    String ref = fault.substring(0, fault.lastIndexOf(':'));
    double marked = stage.part(ref).orElseThrow().value();
    return fault.endsWith(":high") ? marked * 5 : marked / 5;
  }

  /** Returns whether a fault id is a part drifted high or low (not a low rail). */
  static boolean isDrift(Stage stage, String fault) {
    String ref = fault.substring(0, fault.lastIndexOf(':') < 0 ? 0 : fault.lastIndexOf(':'));
    return (fault.endsWith(":high") || fault.endsWith(":low")) && stage.part(ref).isPresent();
  }

  /**
   * Returns the value the fault simulation gives a fault in these checks (random draws seeded with
   * 1): a leaky junction's leak ohms, a misset trimmer's position, the end an open track's wiper
   * keeps (0 the first, 1 the second); NaN for a fault without one. Drifted parts: {@link
   * #driftedValue}.
   */
  static double simulatedValue(Stage stage, String fault) {
    if (isDrift(stage, fault)) {
      return driftedValue(stage, fault);
    }
    Double value =
        FaultSimulation.apply(
            FlatCircuit.of(stage, Conditions.NOMINAL), stage, fault, new SplittableRandom(1));
    return value == null ? Double.NaN : value;
  }

  /** Runs ngspice once for every fault of a stage and returns the answers in fault order. */
  static List<Answer> solve(Stage stage) {
    Deck deck = deck(stage);
    return parse(Ngspice.runFiles(deck.files(), MAIN), deck);
  }

  /**
   * The files of one run.
   *
   * @param files file name → text: the control script and the circuit files
   * @param faults the fault ids in order
   * @param pairs per fault, the pairs of points
   * @param sameAs per fault, the first fault with the same network (itself when it is the first)
   */
  record Deck(
      Map<String, String> files,
      List<String> faults,
      List<List<String[]>> pairs,
      List<Integer> sameAs) {}

  /** Returns the files of the run for every fault of a stage. */
  static Deck deck(Stage stage) {
    List<String> faults = FaultList.of(stage);
    Map<String, String> files = new LinkedHashMap<>();
    Map<String, Integer> firstWith = new LinkedHashMap<>();
    List<Integer> sameAs = new ArrayList<>();
    List<List<String[]>> pairsOf = new ArrayList<>();
    StringBuilder control = new StringBuilder("* power-off resistances\n.control\nset numdgt=15\n");
    for (int f = 0; f < faults.size(); f++) {
      String fault = faults.get(f);
      FlatCircuit flat = FlatCircuit.of(stage, Conditions.NOMINAL);
      if (isDrift(stage, fault)) {
        String ref = fault.substring(0, fault.lastIndexOf(':'));
        int i = flat.branchIndex(ref);
        FlatCircuit.Branch b = flat.branches.get(i);
        flat.branches.set(
            i,
            new FlatCircuit.Branch(b.label(), b.kind(), b.a(), b.b(), driftedValue(stage, fault)));
      } else {
        FaultSimulation.apply(flat, stage, fault, new SplittableRandom(1));
      }
      powerOff(flat);
      SpiceNetlist.Body body = SpiceNetlist.body(flat, false);
      List<String[]> pairs = pairs(stage, fault);
      pairsOf.add(pairs);
      String key = circuit(flat, body, pairs);
      Integer first = firstWith.get(key);
      if (first != null) {
        // The same network as an earlier fault (a stuck output, a missing rail …): same answers.
        sameAs.add(first);
        continue;
      }
      firstWith.put(key, f);
      sameAs.add(f);
      String file = "f" + f + ".cir";
      files.put(
          file,
          "* " + fault + " (power off)\n" + SpiceNetlist.options(false) + "\n" + key + ".end\n");
      control(control, f, file, flat, body, pairs);
    }
    control.append("echo @@end\nquit 0\n.endc\n.end\n");
    files.put(MAIN, control.toString());
    return new Deck(files, faults, pairsOf, sameAs);
  }

  /**
   * Returns what an ohmmeter reads between every pair of nets of one simulated unit with the power
   * off, as ngspice computes it: the unit's faulted circuit (its drawn part values, the fault as
   * the truth generator applied it) with every source, op-amp section and junction removed, before
   * any floating node is tied (a tie models a bias current, which flows only with the power on).
   *
   * @param unit the unit's flattened, faulted circuit (not changed)
   * @param stage the stage, for its nets
   * @return per pair {@code [a, b]} of nets (in the stage's order), the ohms; {@link
   *     Double#POSITIVE_INFINITY} where nothing connects
   */
  static Answer ofUnit(FlatCircuit unit, Stage stage) {
    FlatCircuit flat = unit.copy();
    powerOff(flat);
    SpiceNetlist.Body body = SpiceNetlist.body(flat, false);
    List<String[]> pairs = pairs(stage, "healthy");
    Map<String, String> files = new LinkedHashMap<>();
    files.put(
        "unit.cir",
        "* unit (power off)\n"
            + SpiceNetlist.options(false)
            + "\n"
            + circuit(flat, body, pairs)
            + ".end\n");
    StringBuilder control = new StringBuilder("* power-off resistances\n.control\nset numdgt=15\n");
    control(control, 0, "unit.cir", flat, body, pairs);
    control.append("echo @@end\nquit 0\n.endc\n.end\n");
    files.put(MAIN, control.toString());
    Deck deck = new Deck(files, List.of("unit"), List.of(pairs), List.of(0));
    return parse(Ngspice.runFiles(files, MAIN), deck).get(0);
  }

  /**
   * Turns a flattened circuit into its power-off network: no sources, no op-amp sections (the nets
   * they held stay as nodes). Junctions are open as the design notes' power-off model has them (the
   * meter's test voltage does not turn them on); a shorted or leaky one is a resistor by now and
   * stays.
   */
  private static void powerOff(FlatCircuit flat) {
    flat.branches.removeIf(b -> b.kind().isJunction());
    flat.driven.clear();
    flat.acDrive.clear();
    flat.hz = 0;
    flat.sections.clear();
  }

  /** Returns the circuit's element lines: the network, the shunts and one test source per pair. */
  private static String circuit(FlatCircuit flat, SpiceNetlist.Body body, List<String[]> pairs) {
    StringBuilder circuit = new StringBuilder();
    circuit.append(body.lines());
    // ngspice 39's own rshunt option crashes (malloc) on nodes held only by current sources, so
    // the shunts are written out: 1 TΩ from every node to ground.
    int shunt = 0;
    for (String node : new java.util.TreeSet<>(body.spiceNodes().values())) {
      if (!node.equals("0")) {
        circuit.append("Rsh").append(++shunt).append(' ').append(node).append(" 0 1e12\n");
      }
    }
    for (int k = 0; k < pairs.size(); k++) {
      String a = spiceNode(body, flat, pairs.get(k)[0]);
      String b = spiceNode(body, flat, pairs.get(k)[1]);
      // Current flows from b through the source into a.
      circuit.append("It").append(k).append(' ').append(b).append(' ').append(a);
      circuit.append(" DC 0\n");
    }
    return circuit.toString();
  }

  /** Appends the control lines that solve every pair of one circuit file, one test current each. */
  private static void control(
      StringBuilder control,
      int index,
      String file,
      FlatCircuit flat,
      SpiceNetlist.Body body,
      List<String[]> pairs) {
    control.append("echo @@fault ").append(index).append('\n');
    control.append("source ").append(file).append('\n');
    for (int k = 0; k < pairs.size(); k++) {
      String a = spiceNode(body, flat, pairs.get(k)[0]);
      String b = spiceNode(body, flat, pairs.get(k)[1]);
      control.append("alter it").append(k).append(" dc=").append(SpiceNetlist.num(TEST_AMPS));
      control.append("\nop\necho @@pair ").append(k).append('\n');
      control.append("print ").append(difference(a, b)).append('\n');
      control.append("alter it").append(k).append(" dc=0\ndestroy all\n");
    }
    control.append("remcirc\n");
  }

  private static String spiceNode(SpiceNetlist.Body body, FlatCircuit flat, String point) {
    String ours = flat.nets.contains(point) ? point : flat.pinNodes.get(point);
    String node = ours == null ? null : body.spiceNodes().get(ours);
    if (node == null) {
      throw new IllegalArgumentException("no node for " + point);
    }
    return node;
  }

  /** The printed expression for v(a) − v(b); ngspice has no vector for ground, node 0. */
  private static String difference(String a, String b) {
    if (b.equals("0")) {
      return "v(" + a + ")";
    }
    if (a.equals("0")) {
      return "-v(" + b + ")";
    }
    return "v(" + a + ")-v(" + b + ")";
  }

  private static List<Answer> parse(String output, Deck deck) {
    List<String> faults = deck.faults();
    List<List<String[]>> pairs = deck.pairs();
    if (!output.contains("@@end")) {
      throw new IllegalStateException("ngspice did not finish the power-off run: " + tail(output));
    }
    Map<Integer, double[]> values = new LinkedHashMap<>();
    int fault = -1;
    int pair = -1;
    for (String line : output.split("\\R")) {
      String t = line.trim();
      if (t.startsWith("@@fault ")) {
        fault = Integer.parseInt(t.substring(8));
        values.put(fault, new double[pairs.get(fault).size()]);
        java.util.Arrays.fill(values.get(fault), Double.NaN);
      } else if (t.startsWith("@@pair ")) {
        pair = Integer.parseInt(t.substring(7));
      } else if (pair >= 0 && fault >= 0) {
        Matcher m = VALUE.matcher(t);
        if (m.find()) {
          double ohms = Double.parseDouble(m.group(1)) / TEST_AMPS;
          values.get(fault)[pair] = Math.abs(ohms) > OVER_RANGE ? Double.POSITIVE_INFINITY : ohms;
          pair = -1;
        }
      }
    }
    List<Answer> answers = new ArrayList<>();
    for (int f = 0; f < faults.size(); f++) {
      double[] ohms = values.get(deck.sameAs().get(f));
      for (int k = 0; ohms != null && k < ohms.length; k++) {
        if (Double.isNaN(ohms[k])) {
          ohms = null;
        }
      }
      if (ohms == null) {
        throw new IllegalStateException(
            "ngspice printed no complete answer for " + faults.get(f) + ": " + tail(output));
      }
      answers.add(new Answer(faults.get(f), pairs.get(f), ohms));
    }
    return answers;
  }

  private static String tail(String output) {
    String[] lines = output.split("\\R");
    return String.join("\n", List.of(lines).subList(Math.max(0, lines.length - 12), lines.length));
  }
}

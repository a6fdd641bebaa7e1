package com.stagewise.solver;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * What an ohmmeter reads between two points of a stage with the power off.
 *
 * <p>The power-off model of the design notes: every rail and test input is disconnected (its net
 * floats), capacitors are open, op-amp pins draw nothing and junctions do not conduct at the
 * meter's test voltage. What remains is the network of resistors, and a reading across one part
 * shows that part in parallel with the rest of the network. The resistance between two nodes is
 * found by nodal analysis: the second node is the reference, a unit current goes into the first,
 * and the first node's voltage is the resistance (entry (a, a) of the inverse of the reduced
 * conductance matrix). Resistors below 1 mΩ are taken as 1 mΩ, as the DC solver takes them.
 *
 * <p>Tolerances: by Rayleigh's monotonicity law (the effective resistance of a resistor network
 * never falls when one resistor rises; any text on electrical networks), the lowest reading of
 * in-tolerance parts is the one with every resistor at its lowest value, and the highest the one
 * with every resistor at its highest. So the healthy range is exact.
 *
 * <p>Points are named as in a readings file: a net ({@code SUM}), a package pin ({@code U1.2}; a
 * pin no section uses touches nothing) or a part lead ({@code R2.1}, {@code R2.2}: the part's first
 * and second net; {@code D1.a}, {@code D1.k} a junction's anode and cathode; {@code RV1.1}, {@code
 * RV1.w}, {@code RV1.2} a trimmer's ends and wiper).
 *
 * <p>The newer parts: a trimmer is its track split at the wiper (two resistors, the wiper at the
 * sheet's position, both sections at the track's tolerance corner together, so Rayleigh's law still
 * gives the exact range); diodes, zeners and LEDs are open, as the design notes' power-off model
 * has them (a meter's ohms ranges drive too little voltage to turn a junction on — common practice;
 * its diode-test mode, which does, is not an ohms reading). A reading across a diode therefore
 * shows the rest of the network, or OL.
 */
public final class PowerOff {
  /** Resistors below this are taken as this (ohms): the DC solver's floor for links and shorts. */
  public static final double SHORT_FLOOR = 1e-3;

  /**
   * A reading that takes longer than this to settle within 0.1 % is said to creep (seconds): a
   * handheld meter updates a few times a second, so a technician sees a longer settling as a
   * drifting display (common practice).
   */
  public static final double CREEP_SECONDS = 1.0;

  /** Time constants to settle within 0.1 % (e^-7 ≈ 0.09 %). */
  private static final double SETTLE_TIME_CONSTANTS = 7;

  private final Stage stage;

  /** The stage's used package pins and their nets, built once (a lookup per point asked). */
  private final Map<String, String> pinNets;

  private final Map<String, Integer> nodes = new LinkedHashMap<>();
  private final Network nominal;
  private final Network low;
  private final Network high;

  private PowerOff(Stage stage) {
    this.stage = stage;
    this.pinNets = stage.pinNets();
    for (String net : stage.nets()) {
      nodes.put(net, nodes.size());
    }
    for (String net : pinNets.values()) {
      nodes.putIfAbsent(net, nodes.size());
    }
    List<Part> resistors = new ArrayList<>();
    for (Part part : stage.parts()) {
      if (part.kind() == PartKind.RESISTOR) {
        resistors.add(part);
      } else if (part.kind().isTrimmer()) {
        double[] track = part.trackOhms();
        resistors.add(
            Part.resistor(
                part.ref() + "~1", track[0], part.tolerance(), part.netA(), part.wiper()));
        resistors.add(
            Part.resistor(
                part.ref() + "~2", track[1], part.tolerance(), part.wiper(), part.netB()));
      }
    }
    nominal = new Network(nodes, resistors, 0);
    low = new Network(nodes, resistors, -1);
    high = new Network(nodes, resistors, 1);
  }

  /** Returns the power-off network of a stage (its parts at their values as given). */
  public static PowerOff of(Stage stage) {
    return new PowerOff(stage);
  }

  /**
   * Returns the net a point sits on: the net itself, the net on a used package pin, or the net on a
   * part lead; empty when the point names nothing of the stage. A package pin that no section uses
   * (an offset or n/c pin) sits on a node of its own, named {@code U1.8 (unused)}.
   */
  public Optional<String> node(String point) {
    if (point == null || point.isBlank()) {
      return Optional.empty();
    }
    if (nodes.containsKey(point)) {
      return Optional.of(point);
    }
    String pinNet = pinNets.get(point);
    if (pinNet != null) {
      return Optional.of(pinNet);
    }
    int dot = point.lastIndexOf('.');
    if (dot <= 0 || dot == point.length() - 1) {
      return Optional.empty();
    }
    String owner = point.substring(0, dot);
    String lead = point.substring(dot + 1);
    Optional<Part> part = stage.part(owner);
    if (part.isPresent()) {
      return Optional.ofNullable(part.get().leadNet(lead));
    }
    var type = stage.packageType(owner);
    if (type.isPresent() && lead.matches("[0-9]{1,2}")) {
      int pin = Integer.parseInt(lead);
      if (pin >= 1 && pin <= type.get().pinCount()) {
        return Optional.of(point + " (unused)");
      }
    }
    return Optional.empty();
  }

  /** Returns whether a point is a part lead ({@code R2.1}) rather than a net or a package pin. */
  public boolean isLead(String point) {
    if (point == null || nodes.containsKey(point) || pinNets.containsKey(point)) {
      return false;
    }
    int dot = point.lastIndexOf('.');
    return dot > 0 && stage.part(point.substring(0, dot)).isPresent() && node(point).isPresent();
  }

  /**
   * Returns every point a reading may name, in a fixed order: the nets, the used package pins, then
   * the part leads.
   */
  public List<String> points() {
    Set<String> points = new LinkedHashSet<>(stage.nets());
    points.addAll(pinNets.keySet());
    for (Part part : stage.parts()) {
      for (String lead : part.leads()) {
        points.add(part.ref() + "." + lead);
      }
    }
    return List.copyOf(points);
  }

  /**
   * Returns the resistance between two points with every part at its value, in ohms; {@link
   * Double#POSITIVE_INFINITY} when nothing connects them, 0 when both are on one net.
   *
   * @throws IllegalArgumentException if a point names nothing of the stage (see {@link
   *     #node(String)})
   */
  public double ohms(String a, String b) {
    return nominal.ohms(resolve(a), resolve(b));
  }

  /**
   * Returns the reading between two points: nominal, the healthy range of in-tolerance parts, and
   * the capacitors that make it creep.
   *
   * @throws IllegalArgumentException if a point names nothing of the stage
   */
  public OhmsPrediction predict(String a, String b) {
    String na = resolve(a);
    String nb = resolve(b);
    double r = nominal.ohms(na, nb);
    // Rounding can put the corners a hair on the wrong side of the nominal of a part with no
    // tolerance; the range always holds the nominal.
    double lo = Math.min(r, low.ohms(na, nb));
    double hi = Math.max(r, high.ohms(na, nb));
    return new OhmsPrediction(r, lo, hi, Double.isFinite(r) ? creep(na, nb) : List.of());
  }

  private String resolve(String point) {
    Optional<String> node = node(point);
    if (node.isEmpty()) {
      throw new IllegalArgumentException(
          "\"" + point + "\" is no net, package pin or part lead of the stage");
    }
    return node.get();
  }

  /**
   * The capacitors that charge through the meter: with the test current going in at a and out at b,
   * a capacitor whose two nets settle at different voltages charges through the resistance it sees
   * (the network between its nets, the meter being a current source). Seven of those time constants
   * past {@link #CREEP_SECONDS} make the reading creep.
   */
  private List<OhmsPrediction.Creep> creep(String a, String b) {
    List<OhmsPrediction.Creep> creeping = new ArrayList<>();
    double rab = nominal.ohms(a, b);
    for (Part part : stage.parts()) {
      if (part.kind() != PartKind.CAPACITOR || part.value() <= 0) {
        continue;
      }
      String p = part.netA();
      String q = part.netB();
      double seen = nominal.ohms(p, q);
      if (!Double.isFinite(seen) || seen == 0 || !nominal.sameGroup(p, a)) {
        continue;
      }
      // Node potentials for a unit current from a to b: v(x) = (R(a,b) + R(x,b) - R(x,a)) / 2.
      double vp = (rab + nominal.ohms(p, b) - nominal.ohms(p, a)) / 2;
      double vq = (rab + nominal.ohms(q, b) - nominal.ohms(q, a)) / 2;
      if (Math.abs(vp - vq) < 1e-3 * rab) {
        continue;
      }
      double seconds = SETTLE_TIME_CONSTANTS * part.value() * seen;
      if (seconds >= CREEP_SECONDS) {
        creeping.add(new OhmsPrediction.Creep(part.ref(), part.value(), seconds));
      }
    }
    creeping.sort(LONGEST_FIRST);
    return creeping;
  }

  /**
   * Orders creeping capacitors by time constant, longest first (a named class rather than a
   * composed comparator: each lambda costs a fresh command-line JVM a spun class).
   */
  private static final Comparator<OhmsPrediction.Creep> LONGEST_FIRST = new LongestFirst();

  private static final class LongestFirst implements Comparator<OhmsPrediction.Creep> {
    @Override
    public int compare(OhmsPrediction.Creep a, OhmsPrediction.Creep b) {
      return Double.compare(b.seconds(), a.seconds());
    }
  }

  /** One resistor network (parts at nominal, lowest or highest), with answers cached per node. */
  private static final class Network {
    private final Map<String, Integer> nodes;
    private final int[] group;
    private final double[][] conductance;
    private final Map<Integer, double[]> byReference = new LinkedHashMap<>();

    Network(Map<String, Integer> nodes, List<Part> resistors, int corner) {
      this.nodes = nodes;
      int n = nodes.size();
      conductance = new double[n][n];
      group = new int[n];
      for (int i = 0; i < n; i++) {
        group[i] = i;
      }
      for (Part r : resistors) {
        int i = nodes.get(r.netA());
        int j = nodes.get(r.netB());
        if (i == j) {
          continue;
        }
        double ohms = Math.max(SHORT_FLOOR, r.value() * (1 + corner * r.tolerance()));
        double g = 1 / ohms;
        conductance[i][i] += g;
        conductance[j][j] += g;
        conductance[i][j] -= g;
        conductance[j][i] -= g;
        union(i, j);
      }
    }

    boolean sameGroup(String a, String b) {
      Integer i = nodes.get(a);
      Integer j = nodes.get(b);
      return i != null && j != null && find(i) == find(j);
    }

    double ohms(String a, String b) {
      if (a.equals(b)) {
        return 0;
      }
      Integer ni = nodes.get(a);
      Integer nj = nodes.get(b);
      if (ni == null || nj == null) {
        // An unused package pin: a node that nothing touches.
        return Double.POSITIVE_INFINITY;
      }
      int i = ni;
      int j = nj;
      if (find(i) != find(j)) {
        return Double.POSITIVE_INFINITY;
      }
      double[] column = byReference.get(j);
      if (column == null) {
        column = toReference(j);
        byReference.put(j, column);
      }
      return column[i];
    }

    /**
     * Returns the resistance from every node of the reference's group to the reference: the
     * diagonal of the inverse of the conductance matrix with the reference's row and column
     * removed.
     */
    private double[] toReference(int reference) {
      int n = conductance.length;
      int root = find(reference);
      List<Integer> members = new ArrayList<>();
      for (int i = 0; i < n; i++) {
        if (i != reference && find(i) == root) {
          members.add(i);
        }
      }
      int m = members.size();
      double[][] reduced = new double[m][m];
      for (int r = 0; r < m; r++) {
        for (int c = 0; c < m; c++) {
          reduced[r][c] = conductance[members.get(r)][members.get(c)];
        }
      }
      double[] result = new double[n];
      java.util.Arrays.fill(result, Double.POSITIVE_INFINITY);
      result[reference] = 0;
      DenseLu.Factors factors = DenseLu.factor(reduced);
      if (factors == null) {
        throw new IllegalStateException("power-off network of one group is singular");
      }
      for (int r = 0; r < m; r++) {
        result[members.get(r)] = factors.inverseDiagonal(r);
      }
      return result;
    }

    private int find(int i) {
      while (group[i] != i) {
        group[i] = group[group[i]];
        i = group[i];
      }
      return i;
    }

    private void union(int i, int j) {
      group[find(i)] = find(j);
    }
  }
}

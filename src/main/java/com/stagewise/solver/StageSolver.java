package com.stagewise.solver;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Connectivity;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Says what every net and package pin of a stage should read: modified nodal analysis at DC with
 * an exact search for the saturation state of every op-amp section, and small-signal AC about the
 * DC point.
 *
 * <p>Each section is linear (its internal source equals gain times the differential input), clamped
 * high or clamped low; the limits follow the actual voltages at the section's own supply pins, so a
 * missing rail needs no special case. A consistent state is one where every linear section's source
 * lies within its limits and every clamped section's demand lies beyond the limit it is clamped at.
 */
public final class StageSolver {
  /** Consistency slack in volts, far below any meter's resolution. */
  private static final double SLACK = 1e-9;

  /** Iterations of the active-set search before falling back to enumeration. */
  private static final int MAX_ITERATIONS = 40;

  /** Above this many free sections, enumeration of every state combination is refused. */
  private static final int MAX_ENUMERATED_SECTIONS = 9;

  private StageSolver() {}

  /** Solves a stage with nominal parts and nominal device parameters. */
  public static SolveResult solve(Stage stage) {
    return solve(stage, Conditions.NOMINAL);
  }

  /**
   * Solves a stage at DC under the given conditions.
   *
   * @return every stable consistent operating point, or which nets float, or which section has no
   *     consistent state; never NaN voltages
   */
  public static SolveResult solve(Stage stage, Conditions conditions) {
    Network network = new Network(stage, conditions);
    int n = network.sections.length;
    SectionState[] start = new SectionState[n];
    for (int k = 0; k < n; k++) {
      start[k] = network.forced[k] != null ? network.forced[k] : SectionState.LINEAR;
    }
    Network.DcSystem first = solveConsistently(network, start);
    if (first == null) {
      List<String> floating = floatingNets(network);
      if (!floating.isEmpty()) {
        return new SolveResult.Floating(floating);
      }
      return enumerate(network, true);
    }
    // Strong positive feedback shows as an unstable linear section at the all-linear start; such a
    // stage may have several stable states, so every combination is tried.
    if (!allLinearStable(network, start, first)) {
      return enumerate(network, true);
    }
    Optional<OperatingPoint> found = activeSetSearch(network, start, first);
    return found.<SolveResult>map(point -> new SolveResult.Solved(List.of(point)))
        .orElseGet(() -> enumerate(network, true));
  }

  /**
   * Returns the small-signal AC response about an operating point, at the frequency of the first
   * test input that has an AC amplitude; empty when no input has one.
   *
   * <p>Inputs with AC at another frequency are taken as AC ground. A clamped output passes no AC
   * from its inputs; a dead output drives nothing.
   */
  public static Optional<AcSolution> ac(Stage stage, OperatingPoint point) {
    return ac(stage, Conditions.NOMINAL, point);
  }

  /** As {@link #ac(Stage, OperatingPoint)}, under the given conditions. */
  public static Optional<AcSolution> ac(Stage stage, Conditions conditions, OperatingPoint point) {
    Optional<TestInput> source = stage.inputs().stream().filter(TestInput::hasAc).findFirst();
    if (source.isEmpty()) {
      return Optional.empty();
    }
    double hz = source.get().hz();
    Network network = new Network(stage, conditions);
    int n = network.sections.length;
    SectionState[] states = new SectionState[n];
    boolean[] collapsed = new boolean[n];
    double[] x = vectorOf(network, point);
    for (int k = 0; k < n; k++) {
      states[k] = point.states().get(network.sections[k].ref());
      collapsed[k] = network.sourceNode[k] >= 0 && network.collapsed(x, k);
    }
    double[][] solution = network.solveAc(states, collapsed, hz);
    if (solution == null) {
      return Optional.empty();
    }
    Map<String, Phasor> nets = new LinkedHashMap<>();
    for (String net : network.nets) {
      Integer index = network.unknown.get(net);
      if (index != null) {
        nets.put(net, Phasor.of(solution[0][index], solution[1][index]));
      } else {
        double amplitude =
            stage.input(net).filter(i -> i.hasAc() && i.hz() == hz).map(TestInput::ac).orElse(0.0);
        nets.put(net, new Phasor(amplitude, 0));
      }
    }
    return Optional.of(new AcSolution(hz, nets));
  }

  /**
   * Returns every consistent operating point by trying every combination of section states, with
   * no stability filter. Exposed for cross-checks of the search; slow for many sections.
   */
  public static List<OperatingPoint> enumerateConsistent(Stage stage, Conditions conditions) {
    Network network = new Network(stage, conditions);
    List<OperatingPoint> points = new ArrayList<>();
    forEachCombination(
        network,
        states -> {
          Network.DcSystem system = solveConsistently(network, states);
          if (system != null && isConsistent(network, states, system.x())) {
            points.add(pointOf(network, states, system.x()));
          }
        });
    return points;
  }

  private static List<String> floatingNets(Network network) {
    Stage stage = network.stage;
    // A dead output no longer ties its net to anything: model that for the connectivity check.
    Stage check = stage;
    for (int k = 0; k < network.sections.length; k++) {
      if (network.sourceNode[k] < 0) {
        Amplifier amp = network.sections[k];
        String isolated = "\u0000dead-" + amp.ref();
        check = check.withAmplifier(amp.ref(), a -> a.withNet(com.stagewise.circuit.Terminal.OUT, isolated));
      }
    }
    List<String> floating = new ArrayList<>(Connectivity.floatingNets(check));
    floating.removeIf(net -> net.startsWith("\u0000"));
    return floating;
  }

  /**
   * Starting from {@code start}, moves each section whose state is inconsistent to the state its
   * demand points at, until nothing changes. Converges in a few steps for negative feedback; a
   * repeated combination, or an end state with an unstable linear section, ends the search without
   * a result.
   */
  private static Optional<OperatingPoint> activeSetSearch(
      Network network, SectionState[] start, Network.DcSystem first) {
    int n = network.sections.length;
    SectionState[] states = start.clone();
    Set<String> seen = new HashSet<>();
    Network.DcSystem system = first;
    for (int iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
      if (!seen.add(Arrays.toString(states))) {
        return Optional.empty();
      }
      if (system == null) {
        system = solveConsistently(network, states);
        if (system == null) {
          return Optional.empty();
        }
      }
      double[] x = system.x();
      boolean changed = false;
      for (int k = 0; k < n; k++) {
        if (network.forced[k] != null) {
          continue;
        }
        SectionState next = preferredState(network, x, k, states[k]);
        if (next != states[k]) {
          states[k] = next;
          changed = true;
        }
      }
      if (!changed) {
        return allLinearStable(network, states, system)
            ? Optional.of(pointOf(network, states, x))
            : Optional.empty();
      }
      system = null;
    }
    return Optional.empty();
  }

  private static boolean allLinearStable(Network network, SectionState[] states, Network.DcSystem system) {
    for (int k = 0; k < states.length; k++) {
      if (network.forced[k] == null && states[k] == SectionState.LINEAR && !system.stable(network, k)) {
        return false;
      }
    }
    return true;
  }

  private static SectionState preferredState(Network network, double[] x, int k, SectionState now) {
    double[] limits = network.limits(x, k);
    double demand = network.drive(x, k);
    if (now == SectionState.LINEAR) {
      double source = network.source(x, k);
      if (source > limits[1] + SLACK) {
        return SectionState.HIGH;
      }
      if (source < limits[0] - SLACK) {
        return SectionState.LOW;
      }
      return now;
    }
    if (now == SectionState.HIGH && demand < limits[1] - SLACK) {
      return demand < limits[0] - SLACK ? SectionState.LOW : SectionState.LINEAR;
    }
    if (now == SectionState.LOW && demand > limits[0] + SLACK) {
      return demand > limits[1] + SLACK ? SectionState.HIGH : SectionState.LINEAR;
    }
    return now;
  }

  private static boolean isConsistent(Network network, SectionState[] states, double[] x) {
    for (int k = 0; k < network.sections.length; k++) {
      if (network.forced[k] != null) {
        continue;
      }
      double[] limits = network.limits(x, k);
      double demand = network.drive(x, k);
      double scale = SLACK * Math.max(1, Math.abs(limits[1]) + Math.abs(limits[0]));
      boolean ok =
          switch (states[k]) {
            case LINEAR -> {
              double source = network.source(x, k);
              yield source >= limits[0] - scale && source <= limits[1] + scale;
            }
            case HIGH -> demand >= limits[1] - scale;
            case LOW -> demand <= limits[0] + scale;
            case DEAD -> false;
          };
      if (!ok) {
        return false;
      }
    }
    return true;
  }

  /**
   * Solves with the given states; the choice between normal and mid-supply clamp rows is settled
   * by re-solving if the supply pins' voltages change it.
   */
  private static Network.DcSystem solveConsistently(Network network, SectionState[] states) {
    int n = network.sections.length;
    boolean[] collapsed = new boolean[n];
    double[] guess = new double[network.size];
    for (int round = 0; round < 3; round++) {
      for (int k = 0; k < n; k++) {
        collapsed[k] = network.sourceNode[k] >= 0 && network.collapsed(guess, k);
      }
      Network.DcSystem system = network.solveDc(states, collapsed);
      if (system == null) {
        return null;
      }
      boolean same = true;
      for (int k = 0; k < n; k++) {
        if (network.sourceNode[k] >= 0 && network.collapsed(system.x(), k) != collapsed[k]) {
          same = false;
        }
      }
      if (same) {
        return system;
      }
      guess = system.x();
    }
    return null;
  }

  private static SolveResult enumerate(Network network, boolean stableOnly) {
    int free = 0;
    for (SectionState forced : network.forced) {
      free += forced == null ? 1 : 0;
    }
    if (free > MAX_ENUMERATED_SECTIONS) {
      return new SolveResult.NoConsistentState(
          "", "the saturation search did not settle and the stage has too many sections to try every state");
    }
    List<OperatingPoint> points = new ArrayList<>();
    forEachCombination(
        network,
        states -> {
          Network.DcSystem system = solveConsistently(network, states);
          if (system == null || !isConsistent(network, states, system.x())) {
            return;
          }
          if (stableOnly && !allLinearStable(network, states, system)) {
            return;
          }
          points.add(pointOf(network, states, system.x()));
        });
    if (points.isEmpty()) {
      String section = network.sections.length > 0 ? network.sections[0].ref() : "";
      return new SolveResult.NoConsistentState(
          section, "no combination of linear and clamped outputs satisfies every section");
    }
    return new SolveResult.Solved(points);
  }

  /** Calls {@code action} with every combination of states of the free sections (HIGH first). */
  private static void forEachCombination(
      Network network, java.util.function.Consumer<SectionState[]> action) {
    int n = network.sections.length;
    SectionState[] choices = {SectionState.HIGH, SectionState.LOW, SectionState.LINEAR};
    int[] digit = new int[n];
    while (true) {
      SectionState[] states = new SectionState[n];
      for (int k = 0; k < n; k++) {
        states[k] = network.forced[k] != null ? network.forced[k] : choices[digit[k]];
      }
      action.accept(states);
      int k = 0;
      while (k < n && (network.forced[k] != null || ++digit[k] == choices.length)) {
        digit[k] = 0;
        k++;
      }
      if (k == n) {
        return;
      }
    }
  }

  private static OperatingPoint pointOf(Network network, SectionState[] states, double[] x) {
    Map<String, Double> nets = new LinkedHashMap<>();
    for (String net : network.nets) {
      nets.put(net, network.volts(x, net));
    }
    Map<String, Double> pins = new LinkedHashMap<>();
    network.stage.pinNets().forEach((pin, net) -> pins.put(pin, nets.get(net)));
    Map<String, SectionState> sectionStates = new LinkedHashMap<>();
    for (int k = 0; k < network.sections.length; k++) {
      sectionStates.put(network.sections[k].ref(), states[k]);
    }
    return new OperatingPoint(nets, pins, sectionStates);
  }

  private static double[] vectorOf(Network network, OperatingPoint point) {
    double[] x = new double[network.size];
    network.unknown.forEach((net, index) -> x[index] = point.nets().get(net));
    return x;
  }
}

package com.stagewise.solver;

import com.stagewise.circuit.Connectivity;
import com.stagewise.circuit.Stage;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.function.Consumer;

/**
 * A stage compiled once for repeated solves: the fast form of {@link StageSolver} for work that
 * solves one topology many times with changed numbers (tolerance spreads, fault grids).
 *
 * <p>Nets, parts and sections are addressed by index ({@link #net}, {@link #part}, {@link
 * #section}); part values, driven-net voltages and device parameters can be changed between solves.
 * Not safe for use by several threads at once.
 */
public final class CompiledStage {
  /** Consistency slack in volts, far below any meter's resolution. */
  private static final double SLACK = 1e-9;

  /** Iterations of the active-set search before falling back to enumeration. */
  private static final int MAX_ITERATIONS = 40;

  /** Above this many free sections, enumeration of every state combination is refused. */
  private static final int MAX_ENUMERATED_SECTIONS = 9;

  private final Network network;

  private CompiledStage(Network network) {
    this.network = network;
  }

  /** Compiles a stage under the given conditions. */
  public static CompiledStage of(Stage stage, Conditions conditions) {
    return new CompiledStage(new Network(stage, conditions));
  }

  /**
   * One consistent operating state.
   *
   * @param volts the voltage of every net, indexed as {@link #nets()}
   * @param states the state of every section, indexed as the stage's amplifiers
   */
  public record State(double[] volts, SectionState[] states) {}

  /** The outcome of a solve: settled states, floating nets, or no consistent state. */
  public sealed interface Outcome permits Settled, Floats, Unsettled {}

  /** The stage settles in one state, or (strong positive feedback) in several stable ones. */
  public record Settled(List<State> states) implements Outcome {}

  /** Some nets have no DC path to a driven net. */
  public record Floats(List<String> nets) implements Outcome {}

  /** No combination of linear and clamped outputs satisfies every section. */
  public record Unsettled(String section, String reason) implements Outcome {}

  /** Returns the nets in index order (the stage's net order). */
  public List<String> nets() {
    return List.of(network.nets);
  }

  /** Returns the index of a net, or -1 if the stage has no such net. */
  public int net(String name) {
    return network.netIndex.getOrDefault(name, -1);
  }

  /** Returns the index of a part by designator, or -1. */
  public int part(String ref) {
    for (int p = 0; p < network.partRefs.length; p++) {
      if (network.partRefs[p].equals(ref)) {
        return p;
      }
    }
    return -1;
  }

  /** Returns the number of parts. */
  public int partCount() {
    return network.value.length;
  }

  /** Returns the number of sections. */
  public int sectionCount() {
    return network.sections.length;
  }

  /** Returns the value of part p (ohms or farads). */
  public double partValue(int p) {
    return network.value[p];
  }

  /** Sets the value of part p (ohms or farads), for the next solve. */
  public void setPartValue(int p, double value) {
    network.value[p] = value;
  }

  /** Returns whether net i is driven (ground, a rail or an input). */
  public boolean isDriven(int net) {
    return network.unknownOf[net] < 0;
  }

  /** Returns the voltage of driven net i. */
  public double drivenVolts(int net) {
    return network.driven[net];
  }

  /**
   * Sets the voltage of a driven net, for the next solve.
   *
   * @throws IllegalArgumentException if the net is not driven
   */
  public void setDrivenVolts(int net, double volts) {
    if (network.unknownOf[net] >= 0) {
      throw new IllegalArgumentException(network.nets[net] + " is not a driven net");
    }
    network.driven[net] = volts;
  }

  /** Returns the device parameters of section k. */
  public DeviceParams device(int k) {
    return network.params[k];
  }

  /** Sets the device parameters of section k, for the next solve. */
  public void setDevice(int k, DeviceParams params) {
    network.params[k] = params;
  }

  /** Returns whether section k's output is forced by a fault. */
  public boolean isForced(int k) {
    return network.forced[k] != null;
  }

  /**
   * Solves at DC: every stable consistent state, or the floating nets, or which section has no
   * consistent state; never NaN voltages.
   */
  public Outcome solve() {
    int n = network.sections.length;
    SectionState[] start = new SectionState[n];
    for (int k = 0; k < n; k++) {
      start[k] = network.forced[k] != null ? network.forced[k] : SectionState.LINEAR;
    }
    Network.DcSystem first = solveConsistently(start);
    if (first == null) {
      List<String> floating = floatingNets();
      if (!floating.isEmpty()) {
        return new Floats(floating);
      }
      return enumerate(true);
    }
    // Strong positive feedback shows as an unstable linear section at the all-linear start; such a
    // stage may have several stable states, so every combination is tried.
    if (!allLinearStable(start, first)) {
      return enumerate(true);
    }
    State found = activeSetSearch(start, first);
    return found != null ? new Settled(List.of(found)) : enumerate(true);
  }

  /**
   * Solves starting from a known state's section states, for re-solves after a change of numbers:
   * returns the consistent stable state the search settles in from there, or null when it does not
   * settle (then use {@link #solve}). Much cheaper than {@link #solve} for stages with several
   * stable states, which {@link #solve} enumerates.
   */
  public State solveNear(State near) {
    SectionState[] start = near.states().clone();
    Network.DcSystem first = solveConsistently(start);
    if (first == null || !allLinearStable(start, first)) {
      return null;
    }
    return activeSetSearch(start, first);
  }

  /**
   * Returns every consistent state by trying every combination of section states, with no stability
   * filter. For cross-checks of the search; slow for many sections.
   */
  public List<State> enumerateConsistent() {
    List<State> found = new ArrayList<>();
    forEachCombination(
        states -> {
          Network.DcSystem system = solveConsistently(states);
          if (system != null && isConsistent(states, system.x())) {
            found.add(stateOf(states, system.x()));
          }
        });
    return found;
  }

  /**
   * A state's factorised system, for fast re-solves after small changes of the numbers: one step of
   * x ← x + M⁻¹·(b − M'·x) with the old factors, exact to first order in the change.
   */
  public final class Linearization {
    private final SectionState[] states;
    private final boolean[] collapsed;
    private final double[] x;
    private final Network.DcSystem system;

    private Linearization(SectionState[] states, boolean[] collapsed, Network.DcSystem system) {
      this.states = states;
      this.collapsed = collapsed;
      this.x = system.x();
      this.system = system;
    }

    /**
     * Returns the state after the numbers changed, to first order, if the sections stay in the same
     * states; null when a section would change state (then solve again in full).
     */
    public State step() {
      double[] dx = system.factors().solve(network.residual(states, collapsed, x));
      double[] moved = new double[x.length];
      for (int i = 0; i < x.length; i++) {
        moved[i] = x[i] + dx[i];
      }
      for (int k = 0; k < states.length; k++) {
        if (network.sourceNode[k] >= 0 && network.collapsed(moved, k) != collapsed[k]) {
          return null;
        }
      }
      return isConsistent(states, moved) ? stateOf(states, moved) : null;
    }
  }

  /** Returns the factorised system of a state, or null when it is singular. */
  public Linearization linearize(State state) {
    int n = network.sections.length;
    boolean[] collapsed = new boolean[n];
    double[] x = vectorOf(state);
    for (int k = 0; k < n; k++) {
      collapsed[k] = network.sourceNode[k] >= 0 && network.collapsed(x, k);
    }
    Network.DcSystem system = network.solveDc(state.states(), collapsed);
    return system == null ? null : new Linearization(state.states().clone(), collapsed, system);
  }

  /** Returns the AC analysis frequency (the first input with AC), or 0 when no input has AC. */
  public double acHz() {
    return network.acHz;
  }

  /**
   * Returns the small-signal AC response about a state: {@code {amplitude, phase in degrees}} per
   * net, or null when no input has AC or the system is singular.
   */
  public double[][] ac(State state) {
    if (network.acHz == 0) {
      return null;
    }
    int n = network.sections.length;
    boolean[] collapsed = new boolean[n];
    double[] x = vectorOf(state);
    for (int k = 0; k < n; k++) {
      collapsed[k] = network.sourceNode[k] >= 0 && network.collapsed(x, k);
    }
    double[][] solution = network.solveAc(state.states(), collapsed);
    if (solution == null) {
      return null;
    }
    double[][] out = new double[2][network.nets.length];
    for (int i = 0; i < network.nets.length; i++) {
      int u = network.unknownOf[i];
      if (u >= 0) {
        Phasor p = Phasor.of(solution[0][u], solution[1][u]);
        out[0][i] = p.amplitude();
        out[1][i] = p.phaseDegrees();
      } else {
        out[0][i] = network.acSource[i];
      }
    }
    return out;
  }

  private List<String> floatingNets() {
    java.util.Set<String> dead = new HashSet<>();
    for (int k = 0; k < network.sections.length; k++) {
      if (network.sourceNode[k] < 0) {
        dead.add(network.sections[k].ref());
      }
    }
    return Connectivity.floatingNets(network.stage, dead);
  }

  /**
   * Starting from {@code start}, moves each section whose state is inconsistent to the state its
   * demand points at, until nothing changes. Converges in a few steps for negative feedback; a
   * repeated combination, or an end state with an unstable linear section, ends the search without
   * a result (null).
   */
  private State activeSetSearch(SectionState[] start, Network.DcSystem first) {
    int n = network.sections.length;
    SectionState[] states = start.clone();
    Set<String> seen = new HashSet<>();
    Network.DcSystem system = first;
    for (int iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
      if (!seen.add(Arrays.toString(states))) {
        return null;
      }
      if (system == null) {
        system = solveConsistently(states);
        if (system == null) {
          return null;
        }
      }
      double[] x = system.x();
      boolean changed = false;
      for (int k = 0; k < n; k++) {
        if (network.forced[k] != null) {
          continue;
        }
        SectionState next = preferredState(x, k, states[k]);
        if (next != states[k]) {
          states[k] = next;
          changed = true;
        }
      }
      if (!changed) {
        // The start state was checked for stability already; a moved one is checked here.
        boolean stable = iteration == 0 || allLinearStable(states, system);
        return stable ? stateOf(states, x) : null;
      }
      system = null;
    }
    return null;
  }

  private boolean allLinearStable(SectionState[] states, Network.DcSystem system) {
    for (int k = 0; k < states.length; k++) {
      if (network.forced[k] == null
          && states[k] == SectionState.LINEAR
          && !system.stable(network, k)) {
        return false;
      }
    }
    return true;
  }

  private SectionState preferredState(double[] x, int k, SectionState now) {
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

  private boolean isConsistent(SectionState[] states, double[] x) {
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
   * Solves with the given states; the choice between normal and mid-supply clamp rows is settled by
   * re-solving if the supply pins' voltages change it.
   */
  private Network.DcSystem solveConsistently(SectionState[] states) {
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

  private Outcome enumerate(boolean stableOnly) {
    int free = 0;
    for (SectionState forced : network.forced) {
      free += forced == null ? 1 : 0;
    }
    if (free > MAX_ENUMERATED_SECTIONS) {
      return new Unsettled(
          "",
          "the saturation search did not settle and the stage has too many sections to try every state");
    }
    List<State> found = new ArrayList<>();
    forEachCombination(
        states -> {
          Network.DcSystem system = solveConsistently(states);
          if (system == null || !isConsistent(states, system.x())) {
            return;
          }
          if (stableOnly && !allLinearStable(states, system)) {
            return;
          }
          found.add(stateOf(states, system.x()));
        });
    if (found.isEmpty()) {
      String section = network.sections.length > 0 ? network.sections[0].ref() : "";
      return new Unsettled(
          section, "no combination of linear and clamped outputs satisfies every section");
    }
    return new Settled(found);
  }

  /** Calls {@code action} with every combination of states of the free sections (HIGH first). */
  private void forEachCombination(Consumer<SectionState[]> action) {
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

  private State stateOf(SectionState[] states, double[] x) {
    double[] volts = new double[network.nets.length];
    for (int i = 0; i < volts.length; i++) {
      volts[i] = network.volts(x, i);
    }
    return new State(volts, states.clone());
  }

  private double[] vectorOf(State state) {
    double[] x = new double[network.size];
    for (int i = 0; i < network.nets.length; i++) {
      int u = network.unknownOf[i];
      if (u >= 0) {
        x[u] = state.volts()[i];
      }
    }
    return x;
  }

  /** Returns the section designators, indexed as the stage's amplifiers. */
  String[] sectionRefs() {
    String[] refs = new String[network.sections.length];
    for (int k = 0; k < refs.length; k++) {
      refs[k] = network.sections[k].ref();
    }
    return refs;
  }
}

package com.stagewise.solver;

import com.stagewise.circuit.Connectivity;
import com.stagewise.circuit.Stage;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.Consumer;

/**
 * The {@link Analysis} of a stage: the stage compiled once into index arrays ({@link Network}),
 * with the saturation search and the factorised re-solves. Everything index-based stays in here;
 * callers see names and the solver's values.
 */
final class CompiledStage implements Analysis {
  /** Consistency slack in volts, far below any meter's resolution. */
  private static final double SLACK = 1e-9;

  /**
   * Iterations of the active-set search per section: each section moves at most from linear to a
   * clamp and back a few times before the search settles or repeats itself.
   */
  private static final int ITERATIONS_PER_SECTION = 4;

  /**
   * Most bistable sections (strong positive feedback) whose every combination of states is tried:
   * 3^6 = 729 searches. Beyond it the search keeps the state it reaches from all outputs linear and
   * says so.
   */
  static final int MAX_BISTABLE_SECTIONS = 6;

  /** Said when a stage has more bistable sections than the search tries exhaustively. */
  static final String TOO_MANY_BISTABLE =
      "this stage has too many bistable sections to search exhaustively (more than "
          + MAX_BISTABLE_SECTIONS
          + "); results assume each of them at the limit its output leans towards with every"
          + " output linear";

  /**
   * Free sections up to which a search that did not settle falls back to trying every combination
   * of states (3^9 = 19,683 solves); only a search that cycles although no section is bistable gets
   * there.
   */
  private static final int MAX_ENUMERATED_SECTIONS = 9;

  /** Chord steps allowed after a change of a stage with junctions before a full solve instead. */
  private static final int CHORD_STEPS = 40;

  /** Relative size of a chord step at which it has settled (volts per volt, plus 1 V). */
  private static final double CHORD_SETTLED = 1e-13;

  private final Network network;
  private final Layout layout;
  private final Map<String, Integer> partIndex;

  private CompiledStage(Network network, Layout layout, Map<String, Integer> partIndex) {
    this.network = network;
    this.layout = layout;
    this.partIndex = partIndex;
  }

  /** Compiles a stage under the given conditions. */
  static CompiledStage of(Stage stage, Conditions conditions) {
    Network network = new Network(stage, conditions);
    String[] refs = new String[network.sections.length];
    for (int k = 0; k < refs.length; k++) {
      refs[k] = network.sections[k].ref();
    }
    Map<String, Integer> parts = new HashMap<>(network.partRefs.length * 2);
    for (int p = 0; p < network.partRefs.length; p++) {
      parts.put(network.partRefs[p], p);
    }
    return new CompiledStage(network, new Layout(stage, network.nets, refs), parts);
  }

  /** One consistent state in index form: volts per net, state per section. */
  private record State(double[] volts, SectionState[] states) {}

  // ---------------------------------------------------------------- the face

  @Override
  public Stage stage() {
    return network.stage;
  }

  @Override
  public List<String> nets() {
    return List.of(network.nets);
  }

  @Override
  public SolveResult solve() {
    Outcome outcome = solveStates();
    if (outcome instanceof Floats f) {
      return new SolveResult.Floating(f.nets);
    }
    if (outcome instanceof Unsettled u) {
      return new SolveResult.NoConsistentState(u.section, u.reason);
    }
    List<OperatingPoint> points = new ArrayList<>();
    Settled settled = (Settled) outcome;
    for (State state : settled.states) {
      points.add(pointOf(state));
    }
    return new SolveResult.Solved(points, settled.notes);
  }

  @Override
  public Optional<OperatingPoint> settleFrom(OperatingPoint near) {
    State state = solveNear(statesOf(near), vectorOf(near));
    return state == null ? Optional.empty() : Optional.of(pointOf(state));
  }

  @Override
  public Optional<Linearized> linearize(OperatingPoint point) {
    SectionState[] states = statesOf(point);
    double[] x = vectorOf(point);
    boolean[] collapsed = collapsedAt(x);
    Network.DcSystem system = network.solveDc(states, collapsed, x);
    return system == null
        ? Optional.empty()
        : Optional.of(new Linearization(states.clone(), collapsed, system));
  }

  @Override
  public Optional<AcSolution> ac(OperatingPoint point) {
    if (network.acHz == 0) {
      return Optional.empty();
    }
    double[] x = vectorOf(point);
    return acAbout(statesOf(point), collapsedAt(x), x);
  }

  @Override
  public List<OperatingPoint> enumerateConsistent() {
    List<OperatingPoint> found = new ArrayList<>();
    forEachCombination(
        states -> {
          Network.DcSystem system = solveConsistently(states, null);
          if (system != null && isConsistent(states, system.x())) {
            found.add(pointOf(stateOf(states, system.x())));
          }
        });
    return found;
  }

  @Override
  public CompiledStage with(Change... changes) {
    Network copy = network.copyNumbers();
    CompiledStage changed = new CompiledStage(copy, layout, partIndex);
    for (Change change : changes) {
      changed.apply(change);
    }
    return changed;
  }

  @Override
  public double partValue(String ref) {
    return network.value[part(ref)];
  }

  @Override
  public double partPosition(String ref) {
    return network.position[part(ref)];
  }

  @Override
  public double drivenVolts(String net) {
    int i = drivenNet(net);
    return network.driven[i];
  }

  @Override
  public DeviceParams device(String section) {
    return network.params[section(section)];
  }

  @Override
  public boolean isForced(String section) {
    return network.forced[section(section)] != null;
  }

  @Override
  public boolean hasNet(String net) {
    return layout.netIndex.containsKey(net);
  }

  @Override
  public double acHz() {
    return network.acHz;
  }

  @Override
  public Probe probe(List<String> nets) {
    return new Probe(layout, nets);
  }

  // ---------------------------------------------------------------- changes of numbers

  private int part(String ref) {
    Integer p = partIndex.get(ref);
    if (p == null) {
      throw new IllegalArgumentException("the stage has no part " + ref);
    }
    return p;
  }

  private int section(String ref) {
    Integer k = layout.sectionIndex.get(ref);
    if (k == null) {
      throw new IllegalArgumentException("the stage has no section " + ref);
    }
    return k;
  }

  private int drivenNet(String net) {
    Integer i = layout.netIndex.get(net);
    if (i == null || network.unknownOf[i] >= 0) {
      throw new IllegalArgumentException(net + " is not a driven net of the stage");
    }
    return i;
  }

  /** Applies a change to this analysis's own numbers; returns what undoes it. */
  private Change apply(Change change) {
    if (change instanceof Change.PartValue v) {
      int p = part(v.ref());
      double old = network.value[p];
      network.setValue(p, v.value());
      return new Change.PartValue(v.ref(), old);
    }
    if (change instanceof Change.WiperPosition w) {
      int p = part(w.ref());
      if (network.partW[p] < 0) {
        throw new IllegalArgumentException(w.ref() + " is not a trimmer: it has no wiper position");
      }
      double old = network.position[p];
      network.position[p] = w.position();
      return new Change.WiperPosition(w.ref(), old);
    }
    if (change instanceof Change.DrivenVolts d) {
      int i = drivenNet(d.net());
      double old = network.driven[i];
      network.driven[i] = d.volts();
      return new Change.DrivenVolts(d.net(), old);
    }
    Change.Device d = (Change.Device) change;
    int k = section(d.section());
    DeviceParams old = network.params[k];
    network.params[k] = d.params();
    return new Change.Device(d.section(), old);
  }

  // ---------------------------------------------------------------- points and index form

  private OperatingPoint pointOf(State state) {
    return layout.point(state.volts, state.states);
  }

  private SectionState[] statesOf(OperatingPoint point) {
    if (point.states() instanceof Layout.States s && s.layout == layout) {
      return s.states;
    }
    SectionState[] states = new SectionState[layout.sections.length];
    for (int k = 0; k < states.length; k++) {
      states[k] = point.states().get(layout.sections[k]);
      if (states[k] == null) {
        throw new IllegalArgumentException("the point has no state for " + layout.sections[k]);
      }
    }
    return states;
  }

  private double[] voltsOf(OperatingPoint point) {
    if (point.nets() instanceof Layout.NetVolts v && v.layout == layout) {
      return v.volts;
    }
    double[] volts = new double[layout.nets.length];
    for (int i = 0; i < volts.length; i++) {
      Double v = point.nets().get(layout.nets[i]);
      if (v == null) {
        throw new IllegalArgumentException("the point has no voltage for " + layout.nets[i]);
      }
      volts[i] = v;
    }
    return volts;
  }

  private double[] vectorOf(OperatingPoint point) {
    double[] volts = voltsOf(point);
    double[] x = new double[network.size];
    for (int i = 0; i < network.nets.length; i++) {
      int u = network.unknownOf[i];
      if (u >= 0) {
        x[u] = volts[i];
      }
    }
    // The internal sources follow from the nets: re-solving with the states gives them, and the
    // collapsed test reads only nets, so they are left at 0 here. A junction's inner node (behind
    // its series resistance) follows from the voltage across the part.
    network.fillInner(x);
    return x;
  }

  private boolean[] collapsedAt(double[] x) {
    int n = network.sections.length;
    boolean[] collapsed = new boolean[n];
    for (int k = 0; k < n; k++) {
      collapsed[k] = network.sourceNode[k] >= 0 && network.collapsed(x, k);
    }
    return collapsed;
  }

  private Optional<AcSolution> acAbout(SectionState[] states, boolean[] collapsed, double[] dc) {
    double[][] solution = network.solveAc(states, collapsed, dc);
    if (solution == null) {
      return Optional.empty();
    }
    int nets = network.nets.length;
    double[] amplitude = new double[nets];
    double[] phase = new double[nets];
    for (int i = 0; i < nets; i++) {
      int u = network.unknownOf[i];
      if (u >= 0) {
        Phasor p = Phasor.of(solution[0][u], solution[1][u]);
        amplitude[i] = p.amplitude();
        phase[i] = p.phaseDegrees();
      } else {
        amplitude[i] = network.acSource[i];
      }
    }
    return Optional.of(new AcSolution(network.acHz, new Layout.Phasors(layout, amplitude, phase)));
  }

  // ---------------------------------------------------------------- the search

  /** The outcome of a solve in index form. */
  private sealed interface Outcome permits Settled, Floats, Unsettled {}

  private record Settled(List<State> states, List<String> notes) implements Outcome {
    Settled(List<State> states) {
      this(states, List.of());
    }
  }

  private record Floats(List<String> nets) implements Outcome {}

  private record Unsettled(String section, String reason) implements Outcome {}

  /**
   * The saturation search. From all outputs linear, an active-set search moves each inconsistent
   * section towards the limit its demand points at (a clamped one first back to linear). Sections
   * with strong positive feedback (bistable: their linear state is unstable) are not moved by the
   * search; instead every combination of their states is tried, each with the active-set search for
   * the others, and every stable consistent result is kept (a Schmitt trigger has two). More than
   * {@link #MAX_BISTABLE_SECTIONS} bistable sections are not tried exhaustively: the state reached
   * from all outputs linear is kept, with a note.
   */
  private Outcome solveStates() {
    int n = network.sections.length;
    SectionState[] start = new SectionState[n];
    for (int k = 0; k < n; k++) {
      start[k] = network.forced[k] != null ? network.forced[k] : SectionState.LINEAR;
    }
    Network.DcSystem first = solveConsistently(start, null);
    if (first == null) {
      List<String> floating = floatingNets();
      if (!floating.isEmpty()) {
        return new Floats(floating);
      }
      String junction = network.newtonFailure;
      Outcome all = enumerate(true);
      if (all instanceof Unsettled && !junction.isEmpty()) {
        return notSettled(junction);
      }
      return all;
    }
    boolean[] bistable = new boolean[n];
    int count = 0;
    for (int k = 0; k < n; k++) {
      if (network.forced[k] == null && !first.stable(network, k)) {
        bistable[k] = true;
        count++;
      }
    }
    if (count == 0) {
      State found = activeSetSearch(start, first, bistable);
      if (found != null) {
        return new Settled(List.of(found));
      }
      return fallBack(start);
    }
    if (count > MAX_BISTABLE_SECTIONS) {
      SectionState[] leaning = start.clone();
      for (int k = 0; k < n; k++) {
        if (bistable[k]) {
          double[] limits = network.limits(first.x(), k);
          boolean up = network.source(first.x(), k) >= (limits[0] + limits[1]) / 2;
          leaning[k] = up ? SectionState.HIGH : SectionState.LOW;
        }
      }
      State found = activeSetSearch(leaning, null, new boolean[n], bistable);
      return found != null
          ? new Settled(List.of(found), List.of(TOO_MANY_BISTABLE))
          : new Unsettled("", TOO_MANY_BISTABLE + ", and no consistent state was found that way");
    }
    List<State> found = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    forEachCombination(
        start,
        bistable,
        states -> {
          State state = activeSetSearch(states, null, bistable);
          if (state != null && seen.add(Arrays.toString(state.states))) {
            found.add(state);
          }
        });
    if (found.isEmpty()) {
      return fallBack(start);
    }
    // In the order of a full enumeration (first section fastest, high before low before linear),
    // so that the first state is the same whichever way it was found.
    found.sort(CompiledStage::enumerationOrder);
    return new Settled(found);
  }

  private Unsettled notSettled(String junction) {
    return new Unsettled(
        junction,
        "the junction of "
            + junction
            + " did not settle: Newton's method found no operating point within "
            + Network.MAX_NEWTON
            + " steps, even with gmin stepping");
  }

  /**
   * When the search does not settle although no section is bistable: every combination of states
   * for a stage of a few sections, else no consistent state with the reason.
   */
  private Outcome fallBack(SectionState[] start) {
    return enumerate(true);
  }

  private static int enumerationOrder(State a, State b) {
    for (int k = a.states.length - 1; k >= 0; k--) {
      int c = Integer.compare(rank(a.states[k]), rank(b.states[k]));
      if (c != 0) {
        return c;
      }
    }
    return 0;
  }

  private static int rank(SectionState state) {
    return switch (state) {
      case HIGH -> 0;
      case LOW -> 1;
      case LINEAR -> 2;
      case DEAD -> 3;
    };
  }

  private State solveNear(SectionState[] near, double[] guess) {
    SectionState[] start = near.clone();
    Network.DcSystem first = solveConsistently(start, guess);
    if (first == null || !allLinearStable(start, first)) {
      return null;
    }
    return activeSetSearch(start, first, new boolean[start.length]);
  }

  /** A state's factorised system: one step of x ← x + M⁻¹·(b − M'·x) with the old factors. */
  private final class Linearization implements Linearized {
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

    @Override
    public Optional<OperatingPoint> step(Change change) {
      Change undo = apply(change);
      try {
        double[] dx = system.factors().solve(network.residual(states, collapsed, x));
        double[] moved = new double[x.length];
        for (int i = 0; i < x.length; i++) {
          moved[i] = x[i] + dx[i];
        }
        if (network.nonlinear && !chord(moved)) {
          return Optional.empty();
        }
        for (int k = 0; k < states.length; k++) {
          if (network.sourceNode[k] >= 0 && network.collapsed(moved, k) != collapsed[k]) {
            return Optional.empty();
          }
        }
        return isConsistent(states, moved)
            ? Optional.of(pointOf(stateOf(states, moved)))
            : Optional.empty();
      } finally {
        apply(undo);
      }
    }

    /**
     * With junctions one step is not enough: a junction's current is exponential in its voltage, so
     * a change that moves a conducting junction (a rail under a clamp diode, a zener's own voltage)
     * by more than a few N·Vt makes the first step stop near N·Vt, far short (a zener drifted 0.15
     * V moved its node 0.047 V). The step is repeated with the same factors (the chord method)
     * until it settles; the factors stay close to the Jacobian wherever the current stays close,
     * which is what a small change of a conducting junction does. Returns false when it does not
     * settle within {@link #CHORD_STEPS} steps (a junction turning on or off): the caller then
     * solves in full.
     */
    private boolean chord(double[] moved) {
      for (int step = 0; step < CHORD_STEPS; step++) {
        double[] dx = system.factors().solve(network.residual(states, collapsed, moved));
        double largest = 0;
        for (int i = 0; i < moved.length; i++) {
          moved[i] += dx[i];
          largest = Math.max(largest, Math.abs(dx[i]) / (1 + Math.abs(moved[i])));
        }
        if (!(largest < Double.POSITIVE_INFINITY)) {
          return false;
        }
        if (largest < CHORD_SETTLED) {
          return true;
        }
      }
      return false;
    }

    @Override
    public Optional<AcSolution> ac(Change change) {
      if (network.acHz == 0) {
        return Optional.empty();
      }
      Change undo = apply(change);
      try {
        return acAbout(states, collapsed, x);
      } finally {
        apply(undo);
      }
    }
  }

  private List<String> floatingNets() {
    Set<String> dead = new HashSet<>();
    for (int k = 0; k < network.sections.length; k++) {
      if (network.sourceNode[k] < 0) {
        dead.add(network.sections[k].ref());
      }
    }
    return Connectivity.floatingNets(network.stage, dead);
  }

  /**
   * Starting from {@code start}, moves each section whose state is inconsistent to the state its
   * demand points at, until nothing changes; sections marked {@code fixed} keep their state. A
   * clamped output whose demand has left its limit steps back to linear first, never straight to
   * the opposite clamp: jumping over makes two coupled sections swap clamps for ever. Converges in
   * a few steps for negative feedback; a repeated combination, or an end state that is not
   * consistent or has an unstable linear section, ends the search without a result (null).
   *
   * @param first the solved system of {@code start}, or null to solve it here
   */
  private State activeSetSearch(SectionState[] start, Network.DcSystem first, boolean[] fixed) {
    return activeSetSearch(start, first, fixed, null);
  }

  /**
   * As {@link #activeSetSearch(SectionState[], Network.DcSystem, boolean[])}, for the sections
   * marked {@code bistable} (may be null) the other way round: positive feedback makes a clamped
   * output whose demand has left its limit jump to the opposite clamp, and a linear one found
   * unstable where the search comes to rest is moved to the limit its output leans towards (used
   * only where the stage has too many bistable sections to try each combination).
   */
  private State activeSetSearch(
      SectionState[] start, Network.DcSystem first, boolean[] fixed, boolean[] bistable) {
    int n = network.sections.length;
    SectionState[] states = start.clone();
    Set<String> seen = new HashSet<>();
    Network.DcSystem system = first;
    double[] last = first == null ? null : first.x();
    int iterations = ITERATIONS_PER_SECTION * n + 8;
    for (int iteration = 0; iteration < iterations; iteration++) {
      if (!seen.add(Arrays.toString(states))) {
        return null;
      }
      if (system == null) {
        system = solveConsistently(states, last);
        if (system == null) {
          return null;
        }
      }
      double[] x = system.x();
      last = x;
      boolean changed = false;
      for (int k = 0; k < n; k++) {
        if (network.forced[k] != null || fixed[k]) {
          continue;
        }
        SectionState next = preferredState(x, k, states[k]);
        if (bistable != null && bistable[k] && next == SectionState.LINEAR) {
          next = states[k] == SectionState.HIGH ? SectionState.LOW : SectionState.HIGH;
        }
        if (next != states[k]) {
          states[k] = next;
          changed = true;
        }
      }
      if (!changed && bistable != null) {
        for (int k = 0; k < n; k++) {
          if (network.forced[k] == null
              && !fixed[k]
              && states[k] == SectionState.LINEAR
              && !system.stable(network, k)) {
            double[] limits = network.limits(x, k);
            boolean up = network.source(x, k) >= (limits[0] + limits[1]) / 2;
            states[k] = up ? SectionState.HIGH : SectionState.LOW;
            changed = true;
          }
        }
      }
      if (!changed) {
        return isConsistent(states, x) && allLinearStable(states, system)
            ? stateOf(states, x)
            : null;
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
      return SectionState.LINEAR;
    }
    if (now == SectionState.LOW && demand > limits[0] + SLACK) {
      return SectionState.LINEAR;
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
  private Network.DcSystem solveConsistently(SectionState[] states, double[] start) {
    int n = network.sections.length;
    boolean[] collapsed = new boolean[n];
    double[] guess = start != null ? start : new double[network.size];
    for (int round = 0; round < 3; round++) {
      for (int k = 0; k < n; k++) {
        collapsed[k] = network.sourceNode[k] >= 0 && network.collapsed(guess, k);
      }
      Network.DcSystem system = network.solveDc(states, collapsed, start == null ? null : guess);
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
      start = guess;
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
          Network.DcSystem system = solveConsistently(states, null);
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
    SectionState[] start = new SectionState[n];
    boolean[] all = new boolean[n];
    for (int k = 0; k < n; k++) {
      start[k] = network.forced[k] != null ? network.forced[k] : SectionState.LINEAR;
      all[k] = network.forced[k] == null;
    }
    forEachCombination(start, all, action);
  }

  /**
   * Calls {@code action} with {@code start} varied over every combination of states of the sections
   * marked in {@code vary} (HIGH first, the first section fastest).
   */
  private void forEachCombination(
      SectionState[] start, boolean[] vary, Consumer<SectionState[]> action) {
    int n = network.sections.length;
    SectionState[] choices = {SectionState.HIGH, SectionState.LOW, SectionState.LINEAR};
    int[] digit = new int[n];
    while (true) {
      SectionState[] states = new SectionState[n];
      for (int k = 0; k < n; k++) {
        states[k] = vary[k] ? choices[digit[k]] : start[k];
      }
      action.accept(states);
      int k = 0;
      while (k < n && (!vary[k] || ++digit[k] == choices.length)) {
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
}

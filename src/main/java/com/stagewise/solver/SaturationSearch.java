package com.stagewise.solver;

import com.stagewise.circuit.Connectivity;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * The saturation search of a {@link Network}: which sections are linear, clamped high or clamped
 * low in a consistent, stable operating point. An active-set search from all outputs linear; every
 * combination of the bistable sections' states (strong positive feedback) tried; enumeration of
 * every state only as a fall-back for a few sections.
 */
final class SaturationSearch {
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

  private final Network network;

  /** The states, clamp rows and count of changes of the last system solved, and that system. */
  private SectionState[] lastStates;

  private boolean[] lastCollapsed;
  private int lastChanges;
  private DcSystem lastSystem;

  SaturationSearch(Network network) {
    this.network = network;
  }

  /**
   * Returns the last system this search solved when it is the system of these states and clamp rows
   * with the network's numbers as they are now, else null.
   */
  DcSystem solvedAlready(SectionState[] states, boolean[] collapsed) {
    return lastSystem != null
            && lastChanges == network.changes
            && Arrays.equals(lastStates, states)
            && Arrays.equals(lastCollapsed, collapsed)
        ? lastSystem
        : null;
  }

  /** One consistent state in index form: volts per net, state per section. */
  record State(double[] volts, SectionState[] states) {}

  /** The outcome of a solve in index form. */
  sealed interface Outcome permits Settled, Floats, Unsettled {}

  record Settled(List<State> states, List<String> notes) implements Outcome {
    Settled(List<State> states) {
      this(states, List.of());
    }
  }

  record Floats(List<String> nets) implements Outcome {}

  record Unsettled(String section, String reason) implements Outcome {}

  /**
   * The saturation search. From all outputs linear, an active-set search moves each inconsistent
   * section towards the limit its demand points at (a clamped one first back to linear). Sections
   * with strong positive feedback (bistable: their linear state is unstable) are not moved by the
   * search; instead every combination of their states is tried, each with the active-set search for
   * the others, and every stable consistent result is kept (a Schmitt trigger has two). More than
   * {@link #MAX_BISTABLE_SECTIONS} bistable sections are not tried exhaustively: the state reached
   * from all outputs linear is kept, with a note.
   */
  Outcome solveStates() {
    int n = network.sections.length;
    SectionState[] start = new SectionState[n];
    for (int k = 0; k < n; k++) {
      start[k] = network.forced[k] != null ? network.forced[k] : SectionState.LINEAR;
    }
    DcSystem first = solveConsistently(start, null);
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
    for (SectionState[] states : new Combinations(start, bistable)) {
      State state = activeSetSearch(states, null, bistable);
      if (state != null && seen.add(Arrays.toString(state.states))) {
        found.add(state);
      }
    }
    if (found.isEmpty()) {
      return fallBack(start);
    }
    // In the order of a full enumeration (first section fastest, high before low before linear),
    // so that the first state is the same whichever way it was found.
    found.sort(ENUMERATION_ORDER);
    return new Settled(found);
  }

  private Unsettled notSettled(String junction) {
    return new Unsettled(
        junction,
        "the junction of "
            + junction
            + " did not settle: Newton's method found no operating point within "
            + DcEquations.MAX_NEWTON
            + " steps, even with gmin stepping");
  }

  /**
   * When the search does not settle although no section is bistable: every combination of states
   * for a stage of a few sections, else no consistent state with the reason.
   */
  private Outcome fallBack(SectionState[] start) {
    return enumerate(true);
  }

  private static final Comparator<State> ENUMERATION_ORDER = new EnumerationOrder();

  /**
   * The order of a full enumeration: the last section slowest, high before low before linear. (A
   * class rather than a method reference: a fresh command-line JVM spins a class for each on its
   * first call.)
   */
  private static final class EnumerationOrder implements Comparator<State> {
    @Override
    public int compare(State a, State b) {
      for (int k = a.states.length - 1; k >= 0; k--) {
        int c = Integer.compare(rank(a.states[k]), rank(b.states[k]));
        if (c != 0) {
          return c;
        }
      }
      return 0;
    }
  }

  private static int rank(SectionState state) {
    return switch (state) {
      case HIGH -> 0;
      case LOW -> 1;
      case LINEAR -> 2;
      case DEAD -> 3;
    };
  }

  State solveNear(SectionState[] near, double[] guess) {
    SectionState[] start = near.clone();
    DcSystem first = solveConsistently(start, guess);
    if (first == null || !allLinearStable(start, first)) {
      return null;
    }
    return activeSetSearch(start, first, new boolean[start.length]);
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
  private State activeSetSearch(SectionState[] start, DcSystem first, boolean[] fixed) {
    return activeSetSearch(start, first, fixed, null);
  }

  /**
   * As {@link #activeSetSearch(SectionState[], DcSystem, boolean[])}, for the sections marked
   * {@code bistable} (may be null) the other way round: positive feedback makes a clamped output
   * whose demand has left its limit jump to the opposite clamp, and a linear one found unstable
   * where the search comes to rest is moved to the limit its output leans towards (used only where
   * the stage has too many bistable sections to try each combination).
   */
  private State activeSetSearch(
      SectionState[] start, DcSystem first, boolean[] fixed, boolean[] bistable) {
    int n = network.sections.length;
    SectionState[] states = start.clone();
    Set<String> seen = new HashSet<>();
    DcSystem system = first;
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

  /**
   * Whether the search, started from {@code states} with the solution x of those states (whose
   * factors are {@code system}'s), stays there: every section where its demand keeps it, every
   * state consistent, every linear section stable. Exactly the first round of {@link
   * #activeSetSearch} ending without a move.
   */
  boolean keepsEveryState(SectionState[] states, double[] x, DcSystem system) {
    return keepsStates(states, x) && allLinearStable(states, system);
  }

  /** As {@link #keepsEveryState} without the stability test, which the caller makes its own way. */
  boolean keepsStates(SectionState[] states, double[] x) {
    for (int k = 0; k < states.length; k++) {
      if (network.forced[k] == null && preferredState(x, k, states[k]) != states[k]) {
        return false;
      }
    }
    return isConsistent(states, x);
  }

  private boolean allLinearStable(SectionState[] states, DcSystem system) {
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
    double low = network.limitLow(x, k);
    double high = network.limitHigh(x, k);
    if (now == SectionState.LINEAR) {
      double source = network.source(x, k);
      if (source > high + SLACK) {
        return SectionState.HIGH;
      }
      if (source < low - SLACK) {
        return SectionState.LOW;
      }
      return now;
    }
    double demand = network.drive(x, k);
    if (now == SectionState.HIGH && demand < high - SLACK) {
      return SectionState.LINEAR;
    }
    if (now == SectionState.LOW && demand > low + SLACK) {
      return SectionState.LINEAR;
    }
    return now;
  }

  boolean isConsistent(SectionState[] states, double[] x) {
    for (int k = 0; k < network.sections.length; k++) {
      if (network.forced[k] != null) {
        continue;
      }
      double low = network.limitLow(x, k);
      double high = network.limitHigh(x, k);
      double scale = SLACK * Math.max(1, Math.abs(high) + Math.abs(low));
      boolean ok =
          switch (states[k]) {
            case LINEAR -> {
              double source = network.source(x, k);
              yield source >= low - scale && source <= high + scale;
            }
            case HIGH -> network.drive(x, k) >= high - scale;
            case LOW -> network.drive(x, k) <= low + scale;
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
  private DcSystem solveConsistently(SectionState[] states, double[] start) {
    int n = network.sections.length;
    boolean[] collapsed = new boolean[n];
    double[] guess = start != null ? start : new double[network.size];
    for (int round = 0; round < 3; round++) {
      for (int k = 0; k < n; k++) {
        collapsed[k] = network.sourceNode[k] >= 0 && network.collapsed(guess, k);
      }
      DcSystem system = network.solveDc(states, collapsed, start == null ? null : guess);
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
        lastStates = states.clone();
        lastCollapsed = collapsed.clone();
        lastChanges = network.changes;
        lastSystem = system;
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
    for (SectionState[] states : everyCombination()) {
      DcSystem system = solveConsistently(states, null);
      if (system == null || !isConsistent(states, system.x())) {
        continue;
      }
      if (stableOnly && !allLinearStable(states, system)) {
        continue;
      }
      found.add(stateOf(states, system.x()));
    }
    if (found.isEmpty()) {
      String section = network.sections.length > 0 ? network.sections[0].ref() : "";
      return new Unsettled(
          section, "no combination of linear and clamped outputs satisfies every section");
    }
    return new Settled(found);
  }

  /** Returns every combination of states of the free sections (HIGH first). */
  private Combinations everyCombination() {
    int n = network.sections.length;
    SectionState[] start = new SectionState[n];
    boolean[] all = new boolean[n];
    for (int k = 0; k < n; k++) {
      start[k] = network.forced[k] != null ? network.forced[k] : SectionState.LINEAR;
      all[k] = network.forced[k] == null;
    }
    return new Combinations(start, all);
  }

  State stateOf(SectionState[] states, double[] x) {
    double[] volts = new double[network.nets.length];
    for (int i = 0; i < volts.length; i++) {
      volts[i] = network.volts(x, i);
    }
    return new State(volts, states.clone());
  }

  /**
   * Returns every consistent state by trying every combination of section states, with no stability
   * filter.
   */
  List<State> enumerateConsistent() {
    List<State> found = new ArrayList<>();
    for (SectionState[] states : everyCombination()) {
      DcSystem system = solveConsistently(states, null);
      if (system != null && isConsistent(states, system.x())) {
        found.add(stateOf(states, system.x()));
      }
    }
    return found;
  }
}

package com.stagewise.reference;

import com.stagewise.reference.FlatCircuit.Mode;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Solves a flattened circuit with ngspice (ngspice 39, Debian package, as reference simulator) so
 * that a stage with positive feedback lands in a stable state.
 *
 * <p>A DC solve by Newton's method converges to any equilibrium, and for a Schmitt trigger (or a
 * fault that closes a positive loop) that is often the unstable one in the middle, which no real
 * circuit sits in. So each live section is first replaced by a source at its upper or lower limit
 * (a linear circuit, solved by ngspice), and that solution is the starting point ({@code .nodeset})
 * of the real solve. If the chosen state is consistent, ngspice stays there; if not, it moves on to
 * the stage's true state. Only if that start fails does the plain solve run.
 */
final class SpiceSolve {
  private SpiceSolve() {}

  /**
   * Returns ngspice's solution started from the given state of each live section ({@code true} =
   * upper limit), falling back to a plain solve and then to relaxed tolerances.
   *
   * @param high per section index, whether to start at the upper limit
   */
  static Ngspice.Outcome from(FlatCircuit flat, String title, boolean[] high) {
    return attempt(flat, title, high).outcome();
  }

  /**
   * An outcome and how it was reached.
   *
   * @param how {@code start} (from the chosen state), {@code plain} or {@code relaxed}
   */
  record Attempt(Ngspice.Outcome outcome, String how) {}

  /** As {@link #from}, saying which way the solution was reached. */
  static Attempt attempt(FlatCircuit flat, String title, boolean[] high) {
    FlatCircuit forced = flat.copy();
    for (int k = 0; k < forced.sections.size(); k++) {
      if (forced.sections.get(k).mode() == Mode.LIVE) {
        forced.sections.set(
            k, forced.sections.get(k).withMode(high[k] ? Mode.STUCK_HIGH : Mode.STUCK_LOW));
      }
    }
    Ngspice.Outcome start = Ngspice.run(SpiceNetlist.of(forced, title, false));
    if (start instanceof Ngspice.Solved s) {
      Map<String, Double> nodeset = new HashMap<>();
      s.printed()
          .forEach(
              (name, volts) -> {
                // Our nets (nN) and each section's internal source (sKo) exist in both circuits.
                if (name.matches("n\\d+|s\\d+o")) {
                  nodeset.put(name, volts);
                }
              });
      Ngspice.Outcome outcome = Ngspice.run(SpiceNetlist.of(flat, title, false, nodeset));
      if (outcome instanceof Ngspice.Solved) {
        return new Attempt(outcome, "start");
      }
    }
    Ngspice.Outcome plain = Ngspice.run(SpiceNetlist.of(flat, title, false));
    return plain instanceof Ngspice.Solved
        ? new Attempt(plain, "plain")
        : new Attempt(Ngspice.run(SpiceNetlist.of(flat, title, true)), "relaxed");
  }

  /**
   * Returns the distinct stable states ngspice finds from every section high and from every section
   * low (one for a stage with negative feedback, two for a Schmitt trigger).
   */
  static List<Ngspice.Solved> states(FlatCircuit flat, String title) {
    List<Ngspice.Solved> states = new ArrayList<>();
    for (boolean high : new boolean[] {true, false}) {
      boolean[] start = new boolean[flat.sections.size()];
      java.util.Arrays.fill(start, high);
      if (from(flat, title, start) instanceof Ngspice.Solved s
          && states.stream().noneMatch(t -> same(t, s))) {
        states.add(s);
      }
    }
    return states;
  }

  private static boolean same(Ngspice.Solved a, Ngspice.Solved b) {
    for (Map.Entry<String, Double> e : a.dc().entrySet()) {
      if (Math.abs(e.getValue() - b.dc().get(e.getKey())) > 1e-6) {
        return false;
      }
    }
    return true;
  }
}

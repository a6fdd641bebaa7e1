package com.stagewise.diagnosis;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.Stage;
import com.stagewise.solver.Analysis;
import com.stagewise.solver.Change;
import com.stagewise.solver.Conditions;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Compiles the scenarios of one fault for the solver, one after the other. The points of a drift
 * grid (a part's value, a trimmer's position, a rail's volts) differ from the first only in that
 * number: they share its compiled stage ({@link Analysis#with}) instead of each being compiled
 * anew. Any other scenario is compiled in full and becomes the one the next are compared with.
 *
 * <p>A compiled stage with a changed number solves exactly as the stage compiled with that number
 * (the same arrays, the same value in them). Not for use by several threads at once.
 */
final class ScenarioCompiler {
  private Scenario baseScenario;
  private Analysis base;
  private Object attachment;

  /** The changes that made the last compiled scenario from the full compilation; null for it. */
  private List<Change> lastChanges;

  /**
   * A factorised point of a scenario derived from the current full compilation, in the search's
   * starting states, from which the next grid points are solved ({@link
   * Analysis.Linearized#solveWith}); null when there is none.
   */
  private Analysis.Linearized anchor;

  /** Returns the analysis of a scenario: derived from the last full compilation where it can be. */
  Analysis compile(Scenario scenario) {
    if (base != null) {
      List<Change> changes = difference(baseScenario, scenario);
      if (changes != null) {
        lastChanges = changes;
        return changes.isEmpty() ? base : base.with(changes.toArray(new Change[0]));
      }
    }
    baseScenario = scenario;
    base = Analysis.of(scenario.stage(), scenario.conditions());
    attachment = null;
    lastChanges = null;
    anchor = null;
    return base;
  }

  /**
   * Returns the point of the last compiled scenario found from the anchor (one number changed from
   * the anchor's scenario; see {@link Analysis.Linearized#solveWith}), or null when there is no
   * anchor or it cannot answer (then solve in full).
   */
  com.stagewise.solver.OperatingPoint solveFromAnchor() {
    if (anchor == null || lastChanges == null || lastChanges.size() != 1) {
      return null;
    }
    return anchor.solveWith(lastChanges.get(0)).orElse(null);
  }

  /** Keeps a factorised point as the anchor of the next grid points. */
  void anchor(Analysis.Linearized linearized) {
    anchor = linearized;
  }

  /**
   * Returns what the caller attached to the current full compilation (work worked out once for all
   * the analyses derived from it, such as which net each test point reads), or null.
   */
  Object attachment() {
    return attachment;
  }

  /** Keeps something with the current full compilation, until the next one. */
  void attach(Object value) {
    attachment = value;
  }

  /**
   * The changes of numbers that make {@code to} from {@code from}: a part's value (a resistor or
   * capacitor), a trimmer's position or a driven net's volts; null when anything else differs (a
   * part added or removed, a net moved, a junction's value, a forced output, a device).
   */
  private static List<Change> difference(Scenario from, Scenario to) {
    Conditions a = from.conditions();
    Conditions b = to.conditions();
    if (!a.devices().equals(b.devices()) || !a.forced().equals(b.forced())) {
      return null;
    }
    Stage s = from.stage();
    Stage t = to.stage();
    if (s != t
        && (!s.ground().equals(t.ground())
            || !s.rails().equals(t.rails())
            || !s.inputs().equals(t.inputs())
            || !s.amplifiers().equals(t.amplifiers())
            || s.parts().size() != t.parts().size())) {
      return null;
    }
    List<Change> changes = new ArrayList<>(1);
    if (s != t) {
      for (int i = 0; i < s.parts().size(); i++) {
        Part p = s.parts().get(i);
        Part q = t.parts().get(i);
        if (p.equals(q)) {
          continue;
        }
        Change change = partChange(p, q);
        if (change == null) {
          return null;
        }
        changes.add(change);
      }
    }
    if (!a.driven().equals(b.driven())) {
      Map<String, Double> before = a.driven();
      Map<String, Double> after = b.driven();
      if (!before.keySet().equals(after.keySet()) && !after.keySet().containsAll(before.keySet())) {
        return null;
      }
      for (Map.Entry<String, Double> e : after.entrySet()) {
        if (!Objects.equals(before.get(e.getKey()), e.getValue())) {
          if (!t.isDriven(e.getKey())) {
            return null;
          }
          changes.add(new Change.DrivenVolts(e.getKey(), e.getValue()));
        }
      }
    }
    return changes;
  }

  /** The change that makes part q from part p, when only its value or wiper position differs. */
  private static Change partChange(Part p, Part q) {
    if (!p.ref().equals(q.ref()) || p.kind().isJunction()) {
      return null;
    }
    if (p.withValue(q.value()).equals(q)) {
      return new Change.PartValue(q.ref(), q.value());
    }
    if (p.kind().isTrimmer() && p.withPosition(q.position()).equals(q)) {
      return new Change.WiperPosition(q.ref(), q.position());
    }
    return null;
  }
}

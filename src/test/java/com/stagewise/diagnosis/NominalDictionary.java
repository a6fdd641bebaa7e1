package com.stagewise.diagnosis;

import com.stagewise.circuit.Stage;
import com.stagewise.solver.Analysis;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.SolveResult;
import java.util.List;

/**
 * The work that the ngspice fault-dictionary benchmark gives ngspice, done by our solver: one
 * circuit per fault of the catalogue, each solved once at DC (and at the AC frequency where the
 * stage has an AC input), a drifted value at the grid point nearest ×5 or ÷5 as the ngspice deck
 * has it, a floating net tied one way. For a same-work ratio beside the full diagnosis's, which
 * does far more (every grid point, the spreads, the ranking, the next probe). Not a test: benchmark
 * support, test sources.
 */
public final class NominalDictionary {
  private NominalDictionary() {}

  /**
   * Solves every fault's circuit once; returns how many settled (so that nothing is optimised
   * away).
   */
  public static int solveAll(Stage stage) {
    int settled = 0;
    for (Fault fault : FaultCatalogue.of(stage).faults()) {
      Scenario scenario = nominal(stage, fault);
      Analysis analysis = Analysis.of(scenario.stage(), scenario.conditions());
      if (analysis.solve() instanceof SolveResult.Solved solved) {
        settled++;
        if (analysis.acHz() > 0) {
          settled += analysis.ac(solved.primary()).isPresent() ? 1 : 0;
        }
      }
    }
    return settled;
  }

  /** The fault's first scenario, or on a grid of a part's value the point nearest ×5 or ÷5. */
  private static Scenario nominal(Stage stage, Fault fault) {
    List<Scenario> scenarios = FaultModel.scenarios(stage, Conditions.NOMINAL, fault);
    Scenario best = scenarios.get(0);
    if (fault.kind() == FaultKind.HIGH || fault.kind() == FaultKind.LOW) {
      double marked = stage.part(fault.subject()).map(p -> p.value()).orElse(Double.NaN);
      double target = fault.kind() == FaultKind.HIGH ? 5 * marked : marked / 5;
      for (Scenario s : scenarios) {
        if (Math.abs(Math.log(s.value() / target)) < Math.abs(Math.log(best.value() / target))) {
          best = s;
        }
      }
    }
    return best;
  }
}

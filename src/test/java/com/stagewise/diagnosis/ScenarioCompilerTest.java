package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.solver.AcSolution;
import com.stagewise.solver.Analysis;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.SolveResult;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * The scenarios of a fault that share one compiled stage (a drift grid: only a value, a wiper
 * position or a rail's volts changes) solve exactly as each compiled on its own (STYLE.md: the same
 * answer from two methods), on every fault of every template: the same states, and every net's
 * volts and AC amplitude equal to the last bit.
 */
class ScenarioCompilerTest {

  @Test
  void sharedCompilation_solvesAsAFreshOne_forEveryScenarioOfEveryTemplate() {
    int shared = 0;
    int compared = 0;
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      for (Fault fault : FaultCatalogue.of(stage).faults()) {
        ScenarioCompiler compiler = new ScenarioCompiler();
        Analysis first = null;
        for (Scenario scenario : FaultModel.scenarios(stage, Conditions.NOMINAL, fault)) {
          Analysis quick = compiler.compile(scenario);
          if (first == null) {
            first = quick;
          } else if (quick != first && quick.stage() == first.stage()) {
            shared++;
          } else {
            first = quick;
          }
          Analysis fresh = Analysis.of(scenario.stage(), scenario.conditions());
          String what = template.name() + " " + fault.id() + " " + scenario.value();
          compare(what, fresh, quick, scenario.stage());
          compared++;
        }
      }
    }
    assertThat(compared).isGreaterThan(1000);
    // Every drifted part and low rail of every template is a grid of 40 points sharing one stage.
    assertThat(shared).isGreaterThan(500);
  }

  private static void compare(String what, Analysis fresh, Analysis quick, Stage stage) {
    SolveResult a = fresh.solve();
    SolveResult b = quick.solve();
    assertThat(b.getClass()).as(what).isEqualTo(a.getClass());
    if (!(a instanceof SolveResult.Solved sa)) {
      return;
    }
    List<OperatingPoint> pa = sa.points();
    List<OperatingPoint> pb = ((SolveResult.Solved) b).points();
    assertThat(pb).as(what).hasSameSizeAs(pa);
    for (int i = 0; i < pa.size(); i++) {
      assertThat(pb.get(i).states()).as(what).isEqualTo(pa.get(i).states());
      Optional<AcSolution> acA = fresh.ac(pa.get(i));
      Optional<AcSolution> acB = quick.ac(pb.get(i));
      assertThat(acB.isPresent()).as(what).isEqualTo(acA.isPresent());
      for (String net : stage.nets()) {
        assertThat(pb.get(i).at(net)).as("%s at %s", what, net).isEqualTo(pa.get(i).at(net));
        if (acA.isPresent()) {
          assertThat(acB.get().nets().get(net).amplitude())
              .as("%s AC at %s", what, net)
              .isEqualTo(acA.get().nets().get(net).amplitude());
        }
      }
    }
  }
}

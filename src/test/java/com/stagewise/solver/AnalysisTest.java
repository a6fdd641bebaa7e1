package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * The solver's face for repeated solves: its first-order re-solve against a full solve, its AC
 * re-solve against a fresh one, and its values against {@link StageSolver}'s. The cross-check is of
 * two methods of the same model (STYLE.md: the same answer from two methods); the full solve itself
 * is checked against ngspice in {@code SpiceReferenceTest}.
 */
class AnalysisTest {
  @Test
  void linearisedStep_isExactToFirstOrder_onEveryTemplate() {
    int checked = 0;
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      Analysis analysis = Analysis.of(stage, Conditions.NOMINAL);
      if (!(analysis.solve() instanceof SolveResult.Solved solved)) {
        continue;
      }
      OperatingPoint point = solved.primary();
      Analysis.Linearized linear = analysis.linearize(point).orElseThrow();
      for (Part part : stage.parts()) {
        if (part.value() == 0) {
          continue;
        }
        double coarse = error(analysis, linear, point, part.ref(), part.value() * 1.001);
        double fine = error(analysis, linear, point, part.ref(), part.value() * 1.0001);
        if (Double.isNaN(coarse) || Double.isNaN(fine)) {
          continue; // a section changed state: the step declines, as it should
        }
        // Exact to first order: the error falls with the square of the change (ten times smaller
        // change, a hundred times smaller error), allowing for rounding near 1e-12 V.
        assertThat(fine)
            .as(
                "%s, %s: error %s V at 0.1 %%, %s V at 0.01 %%",
                template.name(), part.ref(), coarse, fine)
            .isLessThanOrEqualTo(coarse / 30 + 1e-11);
        assertThat(coarse).as("%s, %s", template.name(), part.ref()).isLessThan(1e-3);
        checked++;
      }
    }
    assertThat(checked).isGreaterThan(30);
  }

  @Test
  void linearisedStep_isExactForARailChange_sinceTheSystemIsLinearInItsSources() {
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      if (hasJunction(stage)) {
        continue; // a junction makes the system nonlinear in its sources: see the next test
      }
      Analysis analysis = Analysis.of(stage, Conditions.NOMINAL);
      if (!(analysis.solve() instanceof SolveResult.Solved solved)) {
        continue;
      }
      OperatingPoint point = solved.primary();
      Analysis.Linearized linear = analysis.linearize(point).orElseThrow();
      for (Rail rail : stage.rails()) {
        Change change = new Change.DrivenVolts(rail.net(), rail.volts() * 1.02);
        Optional<OperatingPoint> stepped = linear.step(change);
        Optional<OperatingPoint> full = analysis.with(change).settleFrom(point);
        if (stepped.isEmpty() || full.isEmpty()) {
          continue;
        }
        for (String net : stage.nets()) {
          assertThat(stepped.get().at(net))
              .as("%s, %s moved, at %s", template.name(), rail.net(), net)
              .isCloseTo(full.get().at(net), org.assertj.core.api.Assertions.within(1e-9));
        }
      }
    }
  }

  @Test
  void linearisedStep_withJunctions_isExactToFirstOrderForRailsAndWipers() {
    // With diodes the DC system is nonlinear, so the kept factors are Newton's Jacobian at the
    // point and one step is exact to first order only: the error falls with the square of the
    // change (Newton's method converges quadratically; any numerical-analysis text).
    int checked = 0;
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      boolean trimmer = stage.parts().stream().anyMatch(p -> p.kind().isTrimmer());
      if (!hasJunction(stage) && !trimmer) {
        continue;
      }
      Analysis analysis = Analysis.of(stage, Conditions.NOMINAL);
      if (!(analysis.solve() instanceof SolveResult.Solved solved)) {
        continue;
      }
      OperatingPoint point = solved.primary();
      Analysis.Linearized linear = analysis.linearize(point).orElseThrow();
      List<Change[]> pairs = new ArrayList<>();
      for (Rail rail : stage.rails()) {
        pairs.add(
            new Change[] {
              new Change.DrivenVolts(rail.net(), rail.volts() * 1.001),
              new Change.DrivenVolts(rail.net(), rail.volts() * 1.0001)
            });
      }
      for (Part part : stage.parts()) {
        if (part.kind().isTrimmer()) {
          pairs.add(
              new Change[] {
                new Change.WiperPosition(part.ref(), part.position() + 0.001),
                new Change.WiperPosition(part.ref(), part.position() + 0.0001)
              });
        }
      }
      for (Change[] pair : pairs) {
        double coarse = error(analysis, linear, point, pair[0]);
        double fine = error(analysis, linear, point, pair[1]);
        if (Double.isNaN(coarse) || Double.isNaN(fine)) {
          continue;
        }
        assertThat(fine)
            .as("%s, %s: error %s V, then %s V", template.name(), pair[0], coarse, fine)
            .isLessThanOrEqualTo(coarse / 30 + 1e-11);
        // A conducting junction's current is exponential in its voltage, so the second-order
        // term of a 15 mV rail step is about ΔV²/(2·N·Vt) ≈ 0.015² / (2 × 0.049) ≈ 2.3 mV for a
        // silicon diode (N = 1.9) that follows the rail; below 5 mV is first order at work.
        assertThat(coarse).as("%s, %s", template.name(), pair[0]).isLessThan(5e-3);
        checked++;
      }
    }
    assertThat(checked).isGreaterThan(10);
  }

  private static boolean hasJunction(Stage stage) {
    return stage.parts().stream().anyMatch(p -> p.kind().isJunction());
  }

  @Test
  void acAfterAChange_equalsAFreshAcSolve() {
    int checked = 0;
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      Analysis analysis = Analysis.of(stage, Conditions.NOMINAL);
      if (analysis.acHz() == 0 || !(analysis.solve() instanceof SolveResult.Solved solved)) {
        continue;
      }
      OperatingPoint point = solved.primary();
      Analysis.Linearized linear = analysis.linearize(point).orElseThrow();
      List<Change> changes = new ArrayList<>();
      for (Part part : stage.parts()) {
        changes.add(new Change.PartValue(part.ref(), part.value() * 1.3));
      }
      for (Amplifier amp : stage.amplifiers()) {
        changes.add(new Change.Device(amp.ref(), analysis.device(amp.ref()).withGain(2e4)));
      }
      for (Change change : changes) {
        AcSolution quick = linear.ac(change).orElseThrow();
        AcSolution fresh = analysis.with(change).ac(point).orElseThrow();
        for (String net : stage.nets()) {
          double expected = fresh.nets().get(net).amplitude();
          assertThat(quick.nets().get(net).amplitude())
              .as("%s, %s, at %s", template.name(), change, net)
              .isCloseTo(expected, org.assertj.core.api.Assertions.within(1e-9 * (1 + expected)));
          checked++;
        }
      }
    }
    assertThat(checked).isGreaterThan(20);
  }

  @Test
  void pointsAndAc_areStageSolversValues() {
    Stage stage = Templates.named("inverting").build();
    Analysis analysis = Analysis.of(stage, Conditions.NOMINAL);
    OperatingPoint fast = ((SolveResult.Solved) analysis.solve()).primary();
    OperatingPoint plain = ((SolveResult.Solved) StageSolver.solve(stage)).primary();
    assertThat(fast).isEqualTo(plain);
    assertThat(fast.pins())
        .isEqualTo(
            stage.pinNets().keySet().stream()
                .collect(java.util.stream.Collectors.toMap(p -> p, plain::at)));
    assertThat(analysis.ac(plain)).isEqualTo(StageSolver.ac(stage, fast));
  }

  @Test
  void with_leavesTheOriginalAlone() {
    Stage stage = Templates.named("inverting").build();
    Analysis analysis = Analysis.of(stage, Conditions.NOMINAL);
    Part first = stage.parts().get(0);
    Analysis changed = analysis.with(new Change.PartValue(first.ref(), first.value() * 2));
    assertThat(changed.partValue(first.ref())).isEqualTo(first.value() * 2);
    assertThat(analysis.partValue(first.ref())).isEqualTo(first.value());
    assertThat(changed.solve()).isNotEqualTo(analysis.solve());
  }

  @Test
  void unknownNames_areRefusedWithTheName() {
    Analysis analysis = Analysis.of(Templates.named("inverting").build(), Conditions.NOMINAL);
    assertThatThrownBy(() -> analysis.with(new Change.PartValue("R99", 1)))
        .hasMessageContaining("R99");
    assertThatThrownBy(() -> analysis.probe(List.of("NOWHERE"))).hasMessageContaining("NOWHERE");
    assertThatThrownBy(() -> analysis.device("U9A")).hasMessageContaining("U9A");
  }

  /** The largest difference over the nets between the first-order step and a full solve. */
  private static double error(
      Analysis analysis, Analysis.Linearized linear, OperatingPoint point, String ref, double v) {
    return error(analysis, linear, point, new Change.PartValue(ref, v));
  }

  private static double error(
      Analysis analysis, Analysis.Linearized linear, OperatingPoint point, Change change) {
    Optional<OperatingPoint> stepped = linear.step(change);
    Optional<OperatingPoint> full = analysis.with(change).settleFrom(point);
    if (stepped.isEmpty() || full.isEmpty()) {
      return Double.NaN;
    }
    double worst = 0;
    for (String net : analysis.nets()) {
      worst = Math.max(worst, Math.abs(stepped.get().at(net) - full.get().at(net)));
    }
    return worst;
  }
}

package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import com.stagewise.circuit.TestStage;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** Independent cross-checks of the solver on many random stages. */
class SolverPropertyTest {
  private static final int STAGES = 3000;
  private static final double VOLTS = 1e-6;

  @Test
  void saturationSearch_agreesWithBruteForceEnumeration() {
    Random random = new Random(20261202L);
    int solvedOnce = 0;
    int saturated = 0;
    int multiple = 0;
    for (int i = 0; i < STAGES; i++) {
      Stage stage = RandomStages.next(random);
      SolveResult result = StageSolver.solve(stage);
      if (result instanceof SolveResult.Floating) {
        continue;
      }
      List<OperatingPoint> all = StageSolver.enumerateConsistent(stage, Conditions.NOMINAL);
      if (result instanceof SolveResult.Solved solved) {
        for (OperatingPoint point : solved.points()) {
          assertThat(all)
              .as("stage %d: every point the search returns is consistent by enumeration", i)
              .anySatisfy(candidate -> assertSamePoint(point, candidate));
        }
        if (all.size() == 1) {
          assertThat(solved.points()).hasSize(1);
          solvedOnce++;
        } else {
          multiple++;
        }
        if (solved.primary().states().containsValue(SectionState.HIGH)
            || solved.primary().states().containsValue(SectionState.LOW)) {
          saturated++;
        }
      } else {
        // No stable state: every consistent combination must hold a linear section (an unstable
        // equilibrium); a combination of clamped outputs only would have been stable.
        for (OperatingPoint point : all) {
          assertThat(point.states()).containsValue(SectionState.LINEAR);
        }
      }
    }
    // The random stages must exercise the interesting cases, or the test proves little.
    assertThat(solvedOnce).isGreaterThan(STAGES / 4);
    assertThat(saturated).isGreaterThan(STAGES / 10);
    assertThat(multiple).isGreaterThan(10);
  }

  @Test
  void superposition_fullSolveEqualsSumOfSingleSourceSolves() {
    // Superposition holds for a linear network: with every section linear, the response to all
    // sources equals the sum of the responses to each source alone, the others at 0 V.
    Random random = new Random(7L);
    int checked = 0;
    for (int i = 0; i < STAGES && checked < 500; i++) {
      Stage stage = RandomStages.next(random);
      SolveResult result = StageSolver.solve(stage);
      if (!(result instanceof SolveResult.Solved solved)
          || solved.points().size() != 1
          || !solved.primary().states().values().stream().allMatch(s -> s == SectionState.LINEAR)) {
        continue;
      }
      OperatingPoint full = solved.primary();
      double[] sum = new double[stage.nets().size()];
      List<String> sources = new java.util.ArrayList<>();
      stage.inputs().forEach(input -> sources.add(input.net()));
      stage.rails().forEach(rail -> sources.add(rail.net()));
      for (String source : sources) {
        Conditions alone = Conditions.NOMINAL;
        for (String other : sources) {
          if (!other.equals(source)) {
            alone = alone.withDriven(other, 0.0);
          }
        }
        Network network = new Network(stage, alone);
        SectionState[] linear = new SectionState[stage.amplifiers().size()];
        Arrays.fill(linear, SectionState.LINEAR);
        double[] x = network.solveDc(linear, new boolean[linear.length]).x();
        int n = 0;
        for (String net : stage.nets()) {
          sum[n] += network.volts(x, n);
          n++;
        }
      }
      int n = 0;
      for (String net : stage.nets()) {
        double expected = full.nets().get(net);
        assertThat(sum[n++])
            .as("net %s of stage %d", net, i)
            .isCloseTo(
                expected,
                org.assertj.core.data.Offset.offset(1e-6 * Math.max(1, Math.abs(expected))));
      }
      checked++;
    }
    assertThat(checked).isGreaterThan(100);
  }

  @Test
  void superposition_ofTheSolverItself_overInputs() {
    // The same property through the public solve: scaling one input's level and solving again.
    Stage base =
        TestStage.splitSupply(15)
            .input("IN1", 0.4)
            .input("IN2", -0.3)
            .r("R1", 10e3, "IN1", "SUM")
            .r("R2", 22e3, "IN2", "SUM")
            .r("RF", 47e3, "SUM", "OUT")
            .amp("U1A", "GND", "SUM", "OUT")
            .build();
    double both = StageSolverTest.solveOne(base).at("OUT");
    double first =
        StageSolverTest.solveOne(
                base.withInputs(List.of(TestInput.dc("IN1", 0.4), TestInput.dc("IN2", 0))))
            .at("OUT");
    double second =
        StageSolverTest.solveOne(
                base.withInputs(List.of(TestInput.dc("IN1", 0), TestInput.dc("IN2", -0.3))))
            .at("OUT");
    assertThat(first + second).isCloseTo(both, org.assertj.core.data.Offset.offset(VOLTS));
  }

  private static void assertSamePoint(OperatingPoint expected, OperatingPoint actual) {
    assertThat(actual.states()).isEqualTo(expected.states());
    expected
        .nets()
        .forEach(
            (net, volts) ->
                assertThat(actual.nets().get(net))
                    .isCloseTo(
                        volts,
                        org.assertj.core.data.Offset.offset(VOLTS * Math.max(1, Math.abs(volts)))));
  }
}

package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestStage;
import com.stagewise.interchange.StageSheet;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The saturation search on long chains and on chains with bistable sections (test sheets under
 * src/test/resources/stages, invented for these checks). Expected values are the textbook gains of
 * inverting (−Rf/Rin), non-inverting (1 + Rf/Rg) and follower stages, and an output clamped at the
 * rail less the class's nominal headroom (DESIGN.md: classic-bipolar, 1.5 V).
 */
class SaturationSearchTest {
  private static final double VOLTS = 1e-3;

  private static Stage sheet(String name) {
    return StageSheet.read(Path.of("src", "test", "resources", "stages", name + ".stage.json"));
  }

  @Test
  void twelveSectionChain_withOneClippedSection_solvesToItsOneState() {
    SolveResult result = StageSolver.solve(sheet("chain-12-clipped"));
    assertThat(result).isInstanceOf(SolveResult.Solved.class);
    SolveResult.Solved solved = (SolveResult.Solved) result;
    assertThat(solved.points()).hasSize(1);
    assertThat(solved.notes()).isEmpty();
    OperatingPoint point = solved.primary();
    // IN 1 V: −1 V, then ×48 would be −48 V: the sixth section clamps 1.5 V above −15 V (its
    // 50 Ω output resistance and the load move the pin by tens of millivolts).
    assertThat(point.at("S5")).isCloseTo(-1, within(VOLTS));
    assertThat(point.at("S6")).isCloseTo(-13.5, within(0.05));
    assertThat(point.states().get("U2B")).isEqualTo(SectionState.LOW);
    // Downstream gains −0.5, −0.5, −1, 1, −1, 1 take the clamped level on, every section linear.
    assertThat(point.at("S7")).isCloseTo(-point.at("S6") / 2, within(VOLTS));
    assertThat(point.at("S12")).isCloseTo(point.at("S6") / 4, within(VOLTS));
    long clamped = point.states().values().stream().filter(s -> s != SectionState.LINEAR).count();
    assertThat(clamped).isEqualTo(1);
  }

  @Test
  void twelveSectionChain_healthy_followsTheTextbookGains() {
    OperatingPoint point = ((SolveResult.Solved) StageSolver.solve(sheet("chain-12"))).primary();
    double[] expected = {-1, -2, -2, 1, -1, -2, 1, -0.5, 0.5, 0.5, -0.5, -0.5};
    for (int i = 0; i < expected.length; i++) {
      assertThat(point.at("S" + (i + 1))).as("S%d", i + 1).isCloseTo(expected[i], within(VOLTS));
    }
  }

  @Test
  void chainsWithFourSchmittTriggers_giveEveryStableCombination() {
    // Each Schmitt trigger sees a level inside its thresholds (±1.35 V: 13.5 V × 10k/100k), so
    // each holds either clamp: 2^4 stable states, every one found, and each output at a clamp.
    for (String name : List.of("chain-7-bistable", "chain-9-bistable")) {
      Stage stage = sheet(name);
      SolveResult.Solved solved = (SolveResult.Solved) StageSolver.solve(stage);
      assertThat(solved.points()).as(name).hasSize(16);
      assertThat(solved.points().stream().map(OperatingPoint::states).distinct()).hasSize(16);
      // The same set as trying every combination of states (the brute-force cross-check).
      List<Map<String, SectionState>> stable =
          StageSolver.enumerateConsistent(stage, Conditions.NOMINAL).stream()
              .filter(p -> solved.points().stream().anyMatch(q -> q.states().equals(p.states())))
              .map(OperatingPoint::states)
              .toList();
      assertThat(stable).as(name).hasSize(16);
    }
  }

  @Test
  void moreBistableSectionsThanTheLimit_keepTheStateFromAllLinear_andSaySo() {
    TestStage chain = TestStage.splitSupply(15).input("IN", 0.5);
    String previous = "IN";
    for (int i = 1; i <= SaturationSearch.MAX_BISTABLE_SECTIONS + 1; i++) {
      // A non-inverting Schmitt trigger: in+ between the previous output (10k) and its own (100k).
      chain
          .r("RI" + i, 10e3, previous, "P" + i)
          .r("RF" + i, 100e3, "S" + i, "P" + i)
          .amp("U" + i, "P" + i, "GND", "S" + i);
      previous = "S" + i;
    }
    SolveResult result = StageSolver.solve(chain.build());
    assertThat(result).isInstanceOf(SolveResult.Solved.class);
    assertThat(((SolveResult.Solved) result).notes())
        .containsExactly(SaturationSearch.TOO_MANY_BISTABLE);
    assertThat(SaturationSearch.TOO_MANY_BISTABLE)
        .startsWith("this stage has too many bistable sections to search exhaustively");
  }
}

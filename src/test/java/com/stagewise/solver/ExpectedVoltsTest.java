package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestStage;
import org.junit.jupiter.api.Test;

class ExpectedVoltsTest {
  /** One tolerance for the closed-form checks below, in volts. */
  private static final double VOLTS = 2e-3;

  @Test
  void invertingAmplifier_rangeIsTheClosedFormTolerancePropagation() {
    // Textbook inverting amplifier: Vout = -Vin·R2/R1 = -1 V × 47k/10k = -4.7 V. With 1 % parts
    // the largest fall comes from R1 at -1 % (-4.7/0.99 = -4.7475 V) and the largest rise from
    // R1 at +1 % (-4.7/1.01 = -4.6535 V), one part at a time, each widened by the 5 mV offset
    // margin (DESIGN.md, classic-bipolar offset ±5 mV).
    Stage stage =
        TestStage.splitSupply(15)
            .input("IN", 1)
            .r("R1", 10e3, "IN", "SUM")
            .r("R2", 47e3, "SUM", "OUT")
            .amp("U1A", "GND", "SUM", "OUT")
            .build();
    ExpectedVolts expected = ExpectedVolts.of(stage);
    assertThat(expected.solved()).isTrue();
    assertThat(expected.at("OUT")).isCloseTo(-4.7, within(VOLTS));
    assertThat(expected.low("OUT")).isCloseTo(-4.7 / 0.99 - 0.005, within(VOLTS));
    assertThat(expected.high("OUT")).isCloseTo(-4.7 / 1.01 + 0.005, within(VOLTS));
    // The output pin of a dual-8 section A is pin 1 (DESIGN.md pinouts): the same range.
    assertThat(expected.low("U1.1")).isEqualTo(expected.low("OUT"));
    // A rail's range is its own tolerance: 15 V ± 5 %, plus the margin.
    assertThat(expected.high("VCC")).isCloseTo(15.75 + 0.005, within(1e-9));
  }

  @Test
  void everyNominal_liesWithinItsRange() {
    Stage stage =
        TestStage.splitSupply(12)
            .input("IN", 0.5)
            .r("R1", 4.7e3, "IN", "SUM")
            .r("R2", 22e3, "SUM", "OUT")
            .r("RL", 2e3, "OUT", "GND")
            .amp("U1A", "GND", "SUM", "OUT")
            .build();
    ExpectedVolts expected = ExpectedVolts.of(stage);
    expected
        .nominal()
        .forEach(
            (at, v) -> {
              assertThat(expected.low(at)).as(at).isLessThan(v);
              assertThat(expected.high(at)).as(at).isGreaterThan(v);
            });
  }

  @Test
  void floatingStage_givesTheSolversOneMessage() {
    // A follower's input coupled through a capacitor with no bias resistor: nothing but the
    // capacitor and an op-amp input touch X, so it has no DC path (capacitors are open at DC).
    Stage stage =
        TestStage.splitSupply(15)
            .input("IN", 1)
            .c("C1", 1e-7, "IN", "X")
            .amp("U1A", "X", "OUT", "OUT")
            .r("R1", 1e4, "OUT", "GND")
            .build();
    SolveResult result = StageSolver.solve(stage);
    ExpectedVolts expected = ExpectedVolts.of(stage);
    assertThat(expected.solved()).isFalse();
    assertThat(expected.problem()).isEqualTo(result.problem());
    assertThat(expected.problem()).startsWith("no DC path sets the voltage of ");
    assertThat(result.field()).isEqualTo("nets");
  }
}

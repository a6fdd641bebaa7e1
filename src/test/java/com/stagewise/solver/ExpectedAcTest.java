package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import com.stagewise.circuit.TestStage;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The healthy AC amplitudes beside each test point, checked against textbook closed forms. */
class ExpectedAcTest {
  /**
   * Relative tolerance of the closed-form checks: the op-amp's finite open-loop gain (2e5,
   * DESIGN.md) moves a closed-loop gain of 4.7 by about (1 + 4.7) / 2e5 ≈ 3e-5.
   */
  private static final double RELATIVE = 2e-4;

  private static Stage inverting(double farads) {
    TestStage stage =
        TestStage.splitSupply(15)
            .input("IN", 0, 0.1, 1000)
            .r("R1", 10e3, "IN", "SUM")
            .r("R2", 47e3, "SUM", "OUT")
            .amp("U1A", "GND", "SUM", "OUT");
    if (farads > 0) {
      stage.c("C1", farads, "SUM", "OUT");
    }
    return stage.build();
  }

  @Test
  void invertingAmplifier_amplitudeAndBandAreTheClosedForm() {
    // Textbook inverting amplifier: |Vout| = Vin·R2/R1 = 0.1 V × 47k/10k = 0.47 V peak. With 1 %
    // resistors, one part at a time: the largest amplitude comes from R1 at -1 % (0.47/0.99) and
    // the smallest from R2 at -1 % (0.47 × 0.99), as for the DC range (ExpectedVolts).
    ExpectedAc ac = ExpectedAc.of(inverting(0));
    assertThat(ac.solved()).isTrue();
    assertThat(ac.hz()).isEqualTo(1000);
    assertThat(ac.at("OUT")).isCloseTo(0.47, within(0.47 * RELATIVE));
    assertThat(ac.high("OUT")).isCloseTo(0.47 / 0.99, within(0.47 * RELATIVE));
    assertThat(ac.low("OUT")).isCloseTo(0.47 * 0.99, within(0.47 * RELATIVE));
    // The driven input carries the generator's amplitude exactly; the virtual earth almost none.
    assertThat(ac.at("IN")).isEqualTo(0.1);
    assertThat(ac.at("SUM")).isLessThan(1e-5);
    // Section A's output is pin 1 of a dual-8 package (DESIGN.md pinouts): the same figures.
    assertThat(ac.at("U1.1")).isEqualTo(ac.at("OUT"));
    assertThat(ac.low("U1.1")).isEqualTo(ac.low("OUT"));
  }

  @Test
  void lowPassStage_atAnotherTestFrequency_followsTheSinglePoleResponse() {
    // Textbook single-pole low-pass (C across the feedback resistor): |G| = (R2/R1)/√(1 + (f/fc)²)
    // with fc = 1/(2π·R2·C) = 1/(2π × 47 kΩ × 100 nF) ≈ 33.86 Hz; at f = fc the gain is 3 dB down.
    Stage stage = inverting(100e-9);
    double fc = 1 / (2 * Math.PI * 47e3 * 100e-9);
    for (double hz : new double[] {fc, 10 * fc, 1000}) {
      TestInput input = stage.inputs().get(0).withHz(hz);
      ExpectedAc ac = ExpectedAc.of(stage.withInputs(List.of(input)));
      double closedForm = 0.47 / Math.sqrt(1 + (hz / fc) * (hz / fc));
      assertThat(ac.hz()).isEqualTo(hz);
      assertThat(ac.at("OUT")).as("at %s Hz", hz).isCloseTo(closedForm, within(closedForm * 1e-3));
      assertThat(ac.low("OUT")).isLessThan(ac.at("OUT"));
      assertThat(ac.high("OUT")).isGreaterThan(ac.at("OUT"));
    }
  }

  @Test
  void stageWithoutAcInput_hasNoExpectation() {
    Stage dcOnly =
        TestStage.splitSupply(15)
            .input("IN", 1)
            .r("R1", 10e3, "IN", "SUM")
            .r("R2", 47e3, "SUM", "OUT")
            .amp("U1A", "GND", "SUM", "OUT")
            .build();
    ExpectedAc ac = ExpectedAc.of(dcOnly);
    assertThat(ac.solved()).isFalse();
    assertThat(ac.problem()).contains("no AC test input");
    assertThat(ac.at("OUT")).isNaN();
  }

  @Test
  void saturatedOutput_passesNoAc() {
    // DESIGN.md: AC is small-signal about the DC point, and a clamped output passes none. A 5 V DC
    // input times -4.7 asks for -23.5 V, past the -15 V rail: the output sits at its lower limit.
    Stage clipped =
        TestStage.splitSupply(15)
            .input("IN", 5, 0.1, 1000)
            .r("R1", 10e3, "IN", "SUM")
            .r("R2", 47e3, "SUM", "OUT")
            .amp("U1A", "GND", "SUM", "OUT")
            .build();
    ExpectedAc ac = ExpectedAc.of(clipped);
    assertThat(ac.solved()).isTrue();
    // Only what the input pushes through R1 and R2 into the 50 Ω output resistance (DESIGN.md)
    // reaches OUT: 0.1 V × 50/(10k + 47k + 50) ≈ 88 µV, against 0.47 V when linear.
    assertThat(ac.at("OUT")).isCloseTo(0.1 * 50 / 57_050, within(2e-5));
  }
}

package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.LedColour;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Closed forms for stages with junctions: the Shockley equation worked by hand, the precision
 * rectifier (textbook: its output is the input's positive half, within the op-amp's gain error),
 * the zener-referenced buffer (its output sits at the zener's voltage) and the diode limiter.
 */
class JunctionSolverTest {
  /** Diode figures and a resistor from a rail: the current is exactly 1 mA at the hand value. */
  static OperatingPoint diodeAtOneMilliamp(Part diode, double handVolts) {
    Stage stage =
        new Stage(
            "diode at 1 mA",
            "",
            "GND",
            List.of(new Rail("VCC", 10 + handVolts, 0.05)),
            List.of(),
            List.of(Part.resistor("R1", 10_000, 0.01, "VCC", "A"), diode),
            List.of());
    return ((SolveResult.Solved) StageSolver.solve(stage)).points().get(0);
  }

  @Test
  void siliconDiode_forwardVoltageAtOneMilliamp_matchesTheEquationByHand() {
    // By hand: N·Vt·ln(I/Is + 1) + I·Rs with N = 1.9, Is = 2 nA, Rs = 0.6 Ω, Vt = 25.8649 mV
    // (kT/q at 27 °C): 1.9 × 0.0258649 × ln(500001) + 0.0006 = 0.64548 V.
    double hand = 0.64548;
    OperatingPoint point =
        diodeAtOneMilliamp(Part.diode("D1", DiodeClass.SILICON, "A", "GND"), hand);
    assertThat(point.at("A")).isCloseTo(hand, org.assertj.core.data.Offset.offset(2e-5));
    assertThat(Part.diode("D1", DiodeClass.SILICON, "A", "GND").junction().forwardVolts(1e-3))
        .isBetween(0.6, 0.7); // DESIGN.md: about 0.6–0.7 V at 1 mA (from memory)
  }

  @Test
  void schottkyDiode_forwardVoltageAtOneMilliamp_matchesTheEquationByHand() {
    // By hand: 1.05 × 0.0258649 × ln(66667.7) + 0.001 × 2 = 0.30366 V (about 0.3 V, DESIGN.md).
    double hand = 0.30366;
    OperatingPoint point =
        diodeAtOneMilliamp(Part.diode("D1", DiodeClass.SCHOTTKY, "A", "GND"), hand);
    assertThat(point.at("A")).isCloseTo(hand, org.assertj.core.data.Offset.offset(2e-5));
  }

  @Test
  void leds_forwardVoltageRisesFromRedToBlue() {
    // DESIGN.md: red about 1.8 V … blue about 3 V (typical figures from memory), at 10 mA.
    double red = Part.led("D1", LedColour.RED, "A", "K").junction().forwardVolts(10e-3);
    double blue = Part.led("D1", LedColour.BLUE, "A", "K").junction().forwardVolts(10e-3);
    assertThat(red).isCloseTo(1.8, org.assertj.core.data.Offset.offset(1e-9));
    assertThat(blue).isCloseTo(3.0, org.assertj.core.data.Offset.offset(1e-9));
  }

  @ParameterizedTest
  @ValueSource(doubles = {-5, -1, -0.2, -0.01, 0.01, 0.2, 1, 5})
  void precisionRectifier_outputIsThePositiveHalfOfTheInput(double vin) {
    StageTemplate template = Templates.named("precision-rectifier");
    Stage stage = template.build(Map.of("vin", Double.toString(vin)));
    OperatingPoint point = ((SolveResult.Solved) StageSolver.solve(stage)).points().get(0);
    // Textbook: RECT = max(vin, 0). Gain error with A = 2e5: vin·(1 − 1/A) plus the diode's drop
    // divided by A; below zero, the off diode's leakage (nA) through the 10 kΩ load.
    double expected = Math.max(vin, 0);
    double error = Math.abs(vin) * 1e-5 + 1e-4;
    assertThat(point.at("RECT")).isCloseTo(expected, org.assertj.core.data.Offset.offset(error));
    assertThat(point.states().get("U1A"))
        .isEqualTo(vin > 0 ? SectionState.LINEAR : SectionState.LOW);
  }

  @Test
  void zenerReference_outputSitsAtTheZenerVoltage() {
    Stage stage = Templates.named("zener-reference").build();
    OperatingPoint point = ((SolveResult.Solved) StageSolver.solve(stage)).points().get(0);
    // The zener carries (15 − 5.1)/2.2k = 4.5 mA, near its 5 mA test current; its dynamic
    // resistance (N·Vt/I + Rs, about 15 Ω) moves it by about 7 mV from the marked 5.1 V.
    assertThat(point.at("REF")).isCloseTo(5.1, org.assertj.core.data.Offset.offset(0.015));
    assertThat(point.at("OUT"))
        .isCloseTo(point.at("REF"), org.assertj.core.data.Offset.offset(1e-4));
  }

  @Test
  void diodeLimiter_holdsTheOutputWithinADiodeDrop() {
    Stage stage = Templates.named("diode-limiter").build(Map.of("vin", "0.5"));
    OperatingPoint point = ((SolveResult.Solved) StageSolver.solve(stage)).points().get(0);
    // Linear gain −10 would give −5 V; D2 (anode OUT, cathode SUM) conducts 50 µA... the output
    // sits one diode drop below the virtual earth (textbook limiter).
    assertThat(point.at("OUT")).isBetween(-0.65, -0.45);
    Stage small = Templates.named("diode-limiter").build(Map.of("vin", "0.01"));
    OperatingPoint linear = ((SolveResult.Solved) StageSolver.solve(small)).points().get(0);
    assertThat(linear.at("OUT")).isCloseTo(-0.1, org.assertj.core.data.Offset.offset(0.002));
  }

  @Test
  void reverseBiasedDiode_passesOnlyItsLeakage() {
    Stage stage =
        new Stage(
            "reverse diode",
            "",
            "GND",
            List.of(new Rail("VCC", 15, 0.05)),
            List.of(TestInput.dc("IN", 3)),
            List.of(
                Part.resistor("R1", 1e6, 0.01, "IN", "A"),
                Part.diode("D1", DiodeClass.SILICON, "A", "VCC")),
            List.of());
    OperatingPoint point = ((SolveResult.Solved) StageSolver.solve(stage)).points().get(0);
    // Reverse biased by 12 V: the leakage (Is = 2 nA, plus 12 pA through gmin) flows from VCC into
    // A and lifts it by about 2 mV across R1.
    assertThat(point.at("A")).isBetween(3.0019, 3.0021);
  }
}

package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertEquals;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestStage;
import java.util.Map;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class StageSolverTest {
  /** One tolerance for closed-form checks: far below a 6000-count meter's resolution. */
  private static final double VOLTS = 1e-4;

  static void assertVoltsNear(double expected, double actual, double tolerance) {
    assertEquals(
        expected, actual, tolerance, () -> "expected " + expected + " V, got " + actual + " V");
  }

  static OperatingPoint solveOne(Stage stage) {
    return solveOne(stage, Conditions.NOMINAL);
  }

  static OperatingPoint solveOne(Stage stage, Conditions conditions) {
    SolveResult result = StageSolver.solve(stage, conditions);
    assertThat(result).isInstanceOf(SolveResult.Solved.class);
    SolveResult.Solved solved = (SolveResult.Solved) result;
    assertThat(solved.points()).hasSize(1);
    return solved.primary();
  }

  /** Conditions with one gain for every section and an output resistance too small to matter. */
  static Conditions idealish(Stage stage, double gain) {
    Conditions c = Conditions.NOMINAL;
    for (var amp : stage.amplifiers()) {
      c = c.withDevice(amp.ref(), DeviceParams.nominal(amp.deviceClass()).withGain(gain));
    }
    return c;
  }

  @Nested
  class ClosedForm {
    @Test
    void inverting_gainIsMinusR2OverR1() {
      // Closed-form ideal op-amp result: Vout = -R2/R1 · Vin; with A = 2e5 the error is < 0.003 %.
      OperatingPoint p = solveOne(TestStage.inverting(10e3, 47e3, 1.0));
      assertVoltsNear(-4.7, p.at("OUT"), 1e-3);
      assertVoltsNear(0, p.at("SUM"), 1e-4);
      assertThat(p.states()).containsEntry("U1A", SectionState.LINEAR);
      assertVoltsNear(p.at("OUT"), p.at("U1.1"), 0);
    }

    @ParameterizedTest(name = "A = {0} gives {1}")
    @CsvSource({"1e3, -90.83", "1e4, -99.00", "1e5, -99.90"})
    void inverting_finiteGain_matchesSedraSmithWorkedNumbers(double gain, double expected) {
      // Sedra & Smith, Microelectronic Circuits, ch. 2: R1 = 1k, R2 = 100k,
      // G = -(R2/R1) / (1 + (1 + R2/R1)/A): -90.83 at A = 1e3, -99.00 at 1e4, -99.90 at 1e5.
      Stage stage = TestStage.inverting(1e3, 100e3, 0.01);
      OperatingPoint p = solveOne(stage, idealish(stage, gain));
      // The book's figures are rounded to two decimals; our 50 Ω output resistance adds < 0.01.
      assertVoltsNear(expected, p.at("OUT") / 0.01, 0.01);
    }

    @Test
    void nonInverting_gainIsOnePlusR2OverR1() {
      // Closed-form ideal op-amp result: Vout = (1 + R2/R1) · Vin.
      Stage stage =
          TestStage.splitSupply(15)
              .input("IN", 0.5)
              .r("R1", 10e3, "FB", "GND")
              .r("R2", 22e3, "FB", "OUT")
              .amp("U1A", "IN", "FB", "OUT")
              .build();
      assertVoltsNear(1.6, solveOne(stage).at("OUT"), 1e-3);
    }

    @Test
    void follower_outputEqualsInput() {
      // Closed-form ideal op-amp result: a follower has gain 1.
      Stage stage =
          TestStage.splitSupply(12)
              .input("IN", 2.5)
              .r("RL", 10e3, "OUT", "GND")
              .amp("U1A", "IN", "OUT", "OUT")
              .build();
      assertVoltsNear(2.5, solveOne(stage).at("OUT"), 1e-4);
    }

    @Test
    void summing_outputIsWeightedSum() {
      // Closed-form ideal op-amp result: Vout = -RF·(V1/R1 + V2/R2 + V3/R3).
      Stage stage =
          TestStage.splitSupply(15)
              .input("IN1", 0.3)
              .input("IN2", -0.2)
              .input("IN3", 1.0)
              .r("R1", 10e3, "IN1", "SUM")
              .r("R2", 20e3, "IN2", "SUM")
              .r("R3", 47e3, "IN3", "SUM")
              .r("RF", 33e3, "SUM", "OUT")
              .amp("U1A", "GND", "SUM", "OUT")
              .build();
      double expected = -33e3 * (0.3 / 10e3 + -0.2 / 20e3 + 1.0 / 47e3);
      assertVoltsNear(expected, solveOne(stage).at("OUT"), 1e-3);
    }

    @Test
    void difference_outputIsScaledDifference() {
      // Closed-form ideal op-amp result: with R1 = R3 and R2 = R4, Vout = (R2/R1)·(V2 − V1).
      Stage stage =
          TestStage.splitSupply(15)
              .input("V1", 1.2)
              .input("V2", 1.5)
              .r("R1", 10e3, "V1", "INM")
              .r("R2", 100e3, "INM", "OUT")
              .r("R3", 10e3, "V2", "INP")
              .r("R4", 100e3, "INP", "GND")
              .amp("U1A", "INP", "INM", "OUT")
              .build();
      assertVoltsNear(3.0, solveOne(stage).at("OUT"), 1e-3);
    }

    @Test
    void instrumentation_gainIsOnePlusTwoRfOverRgTimesR4OverR3() {
      // Closed-form ideal op-amp result for the three-op-amp instrumentation amplifier:
      // Vout = (1 + 2·RF/RG)·(R4/R3)·(V2 − V1).
      double rf = 24.9e3;
      double rg = 5e3;
      Stage stage =
          TestStage.splitSupply(15)
              .input("V1", 0.100)
              .input("V2", 0.120)
              .amp("U1A", "V1", "G1", "O1")
              .amp("U1B", "V2", "G2", "O2")
              .r("RF1", rf, "O1", "G1")
              .r("RG", rg, "G1", "G2")
              .r("RF2", rf, "G2", "O2")
              .r("R3A", 10e3, "O1", "DM")
              .r("R4A", 20e3, "DM", "OUT")
              .r("R3B", 10e3, "O2", "DP")
              .r("R4B", 20e3, "DP", "GND")
              .amp("U1C", "DP", "DM", "OUT")
              .build();
      double expected = (1 + 2 * rf / rg) * 2 * 0.020;
      assertVoltsNear(expected, solveOne(stage).at("OUT"), 2e-3);
    }
  }

  @Nested
  class Saturation {
    @Test
    void inverting_largeInput_clampsAtRailLessHeadroom() {
      // Classic-bipolar headroom 1.5 V (DESIGN.md): -10 × 2 V would be -20 V; it stops at -13.5 V.
      OperatingPoint p = solveOne(TestStage.inverting(10e3, 100e3, 2.0));
      assertThat(p.states()).containsEntry("U1A", SectionState.LOW);
      // The 50 Ω output resistance feeds R2 + R1 back to IN: (2 + 13.5) V · 50 / 110.05k = 7 mV.
      assertVoltsNear(-13.5 + 15.5 * 50 / 110.05e3, p.at("OUT"), 1e-6);
      // Feedback lost: the inverting input no longer sits at 0 V (common practice).
      assertThat(Math.abs(p.at("SUM"))).isGreaterThan(0.5);
    }

    @Test
    void missingRail_clipsOutputNearZero() {
      // A rail that is missing is a supply net at 0 V; the same model clips the output (DESIGN.md).
      Stage stage = TestStage.inverting(10e3, 47e3, -1.0);
      OperatingPoint p = solveOne(stage, Conditions.NOMINAL.withDriven("VCC", 0.0));
      assertThat(p.states()).containsEntry("U1A", SectionState.HIGH);
      assertVoltsNear(-1.5, p.at("OUT"), 1e-3);
    }

    @Test
    void groundSensing_singleSupplyWithMissingRail_outputSitsAtGround() {
      Stage stage =
          TestStage.splitSupply(15)
              .rail("V5", 5)
              .input("IN", 1.0)
              .r("R1", 10e3, "FB", "GND")
              .r("R2", 10e3, "FB", "OUT")
              .amp("U1A", DeviceClass.GROUND_SENSING, "IN", "FB", "OUT", "V5", "GND")
              .build();
      OperatingPoint p = solveOne(stage, Conditions.NOMINAL.withDriven("V5", 0.0));
      assertVoltsNear(0, p.at("OUT"), 1e-3);
    }

    @Test
    void schmittTrigger_reportsBothStableStates() {
      // An inverting Schmitt trigger at 0 V input has two stable states (common practice).
      Stage stage =
          TestStage.splitSupply(12)
              .input("IN", 0.0)
              .r("R1", 10e3, "REF", "GND")
              .r("R2", 100e3, "REF", "OUT")
              .amp("U1A", "REF", "IN", "OUT")
              .build();
      SolveResult result = StageSolver.solve(stage);
      assertThat(result).isInstanceOf(SolveResult.Solved.class);
      var points = ((SolveResult.Solved) result).points();
      assertThat(points).hasSize(2);
      assertThat(points.get(0).states()).containsEntry("U1A", SectionState.HIGH);
      assertThat(points.get(1).states()).containsEntry("U1A", SectionState.LOW);
      // 10.5 V internal, less the drop across 50 Ω into R2 + R1 = 110k.
      double out = 10.5 * 110e3 / 110.05e3;
      assertVoltsNear(out, points.get(0).at("OUT"), 1e-6);
      assertVoltsNear(out / 11, points.get(0).at("REF"), 1e-6);
    }

    @Test
    void schmittTrigger_inputBeyondThreshold_hasOneState() {
      Stage stage =
          TestStage.splitSupply(12)
              .input("IN", 2.0)
              .r("R1", 10e3, "REF", "GND")
              .r("R2", 100e3, "REF", "OUT")
              .amp("U1A", "REF", "IN", "OUT")
              .build();
      OperatingPoint p = solveOne(stage);
      assertThat(p.states()).containsEntry("U1A", SectionState.LOW);
    }

    @Test
    void forcedStates_areHonoured() {
      Stage stage = TestStage.inverting(10e3, 47e3, 1.0);
      // 13.5 V behind 50 Ω, loaded by R2 + R1 = 57k back to IN at 1 V.
      assertVoltsNear(
          13.5 - 12.5 * 50 / 57.05e3,
          solveOne(stage, Conditions.NOMINAL.withForced("U1A", SectionState.HIGH)).at("OUT"),
          1e-6);
      OperatingPoint dead =
          solveOne(stage, Conditions.NOMINAL.withForced("U1A", SectionState.DEAD));
      // A dead output: OUT is pulled only through R2 and R1 from IN, so it reads IN.
      assertVoltsNear(1.0, dead.at("OUT"), VOLTS);
      assertThat(dead.states()).containsEntry("U1A", SectionState.DEAD);
    }
  }

  @Nested
  class Results {
    @Test
    void floatingNet_isNamed() {
      Stage stage =
          TestStage.splitSupply(15)
              .input("IN", 1.0)
              .c("C1", 100e-9, "IN", "X")
              .r("R2", 10e3, "FB", "OUT")
              .r("R3", 10e3, "FB", "GND")
              .amp("U1A", "X", "FB", "OUT")
              .build();
      SolveResult result = StageSolver.solve(stage);
      assertThat(result).isEqualTo(new SolveResult.Floating(java.util.List.of("X")));
    }

    @Test
    void deadOutput_withNothingElseOnItsNet_isNamedFloating() {
      // A follower whose section no longer drives: OUT touches only the dead output and in-.
      Stage stage =
          TestStage.splitSupply(15).input("IN", 1.0).amp("U1A", "IN", "OUT", "OUT").build();
      SolveResult result =
          StageSolver.solve(stage, Conditions.NOMINAL.withForced("U1A", SectionState.DEAD));
      assertThat(result).isEqualTo(new SolveResult.Floating(java.util.List.of("OUT")));
    }

    @Test
    void pins_followTheirNets() {
      OperatingPoint p = solveOne(TestStage.inverting(10e3, 47e3, 1.0));
      Map<String, Double> pins = p.pins();
      // quad-14 section A: out 1, in- 2, in+ 3, v+ 4, v- 11 (DESIGN.md pinout).
      assertThat(pins.keySet()).containsExactly("U1.1", "U1.2", "U1.3", "U1.4", "U1.11");
      assertVoltsNear(15, pins.get("U1.4"), 0);
      assertVoltsNear(-15, pins.get("U1.11"), 0);
    }
  }

  @Nested
  class Ac {
    @Test
    void inverting_acGainAndPhase() {
      Stage stage =
          TestStage.splitSupply(15)
              .input("IN", 0, 0.1, 1000)
              .r("R1", 10e3, "IN", "SUM")
              .r("R2", 47e3, "SUM", "OUT")
              .amp("U1A", "GND", "SUM", "OUT")
              .build();
      OperatingPoint p = solveOne(stage);
      AcSolution ac = StageSolver.ac(stage, p).orElseThrow();
      assertVoltsNear(0.47, ac.nets().get("OUT").amplitude(), 1e-4);
      assertThat(Math.abs(ac.nets().get("OUT").phaseDegrees()))
          .isCloseTo(180, org.assertj.core.data.Offset.offset(0.01));
    }

    @Test
    void integratorWithDcResistor_dcGainAndCorner() {
      // Closed form: DC gain -RF/R, corner 1/(2π·RF·C), where |H| is down 3 dB (×1/√2).
      double r = 10e3;
      double rf = 100e3;
      double c = 10e-9;
      double corner = 1 / (2 * Math.PI * rf * c);
      Stage stage =
          TestStage.splitSupply(15)
              .input("IN", 0.1, 0.1, corner)
              .r("R1", r, "IN", "SUM")
              .r("RF", rf, "SUM", "OUT")
              .c("C1", c, "SUM", "OUT")
              .amp("U1A", "GND", "SUM", "OUT")
              .build();
      OperatingPoint p = solveOne(stage);
      assertVoltsNear(-1.0, p.at("OUT"), 1e-3);
      AcSolution ac = StageSolver.ac(stage, p).orElseThrow();
      assertThat(ac.nets().get("OUT").amplitude() / 0.1)
          .isCloseTo(10 / Math.sqrt(2), org.assertj.core.data.Offset.offset(1e-3));
    }

    @Test
    void sallenKeyLowPass_gainAtF0IsQ() {
      // Sallen & Key, IRE Trans. Circuit Theory, 1955: unity-gain low-pass,
      // f0 = 1/(2π·sqrt(R1R2C1C2)), Q = sqrt(R1R2C1C2)/(C2(R1+R2)); at f0 |H| = Q.
      // 10k, 10k, 22n, 10n gives about 1.073 kHz and Q about 0.742.
      double r1 = 10e3;
      double r2 = 10e3;
      double c1 = 22e-9;
      double c2 = 10e-9;
      double f0 = 1 / (2 * Math.PI * Math.sqrt(r1 * r2 * c1 * c2));
      double q = Math.sqrt(r1 * r2 * c1 * c2) / (c2 * (r1 + r2));
      assertThat(f0).isCloseTo(1073, org.assertj.core.data.Offset.offset(1.0));
      assertThat(q).isCloseTo(0.742, org.assertj.core.data.Offset.offset(0.001));
      Stage stage =
          TestStage.splitSupply(15)
              .input("IN", 0, 1.0, f0)
              .r("R1", r1, "IN", "A")
              .r("R2", r2, "A", "B")
              .c("C1", c1, "A", "OUT")
              .c("C2", c2, "B", "GND")
              .amp("U1A", "B", "OUT", "OUT")
              .build();
      AcSolution ac = StageSolver.ac(stage, solveOne(stage)).orElseThrow();
      assertThat(ac.nets().get("OUT").amplitude())
          .isCloseTo(q, org.assertj.core.data.Offset.offset(1e-3));
      // At f0 a second-order low-pass lags by 90 degrees.
      assertThat(ac.nets().get("OUT").phaseDegrees())
          .isCloseTo(-90, org.assertj.core.data.Offset.offset(0.1));
    }

    @Test
    void clampedOutput_passesNoAc() {
      // DESIGN.md: a saturated output passes no AC.
      Stage stage =
          TestStage.splitSupply(15)
              .input("IN", 3.0, 0.1, 1000)
              .r("R1", 10e3, "IN", "SUM")
              .r("R2", 100e3, "SUM", "OUT")
              .amp("U1A", "GND", "SUM", "OUT")
              .build();
      OperatingPoint p = solveOne(stage);
      AcSolution ac = StageSolver.ac(stage, p).orElseThrow();
      // Only the 50 Ω output resistance's share of the input's AC, through R1 + R2, remains.
      assertThat(ac.nets().get("OUT").amplitude())
          .isCloseTo(0.1 * 50 / 110.05e3, org.assertj.core.data.Offset.offset(1e-9));
    }
  }
}

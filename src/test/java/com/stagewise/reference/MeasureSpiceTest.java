package com.stagewise.reference;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.interchange.JsonField;
import com.stagewise.interchange.SolutionJson;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.Phasor;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * AC amplitudes stated as RMS, peak or peak-to-peak, against ngspice 39 (Debian package, the
 * reference simulator) on every stage template with an AC input.
 *
 * <p>Each template's input amplitude is stated in each measure in turn (the same number, so the
 * real signal differs). ngspice is driven with the peak worked out here by the textbook relations
 * (peak = RMS·√2, peak = peak-to-peak / 2), and its {@code .ac} magnitudes (peaks, as its AC
 * sources are) are turned back into the measure by the same relations; {@code solve --json}'s
 * amplitudes, which say their measure, must agree within {@link SpiceComparison#AC_FRACTION}.
 */
class MeasureSpiceTest {

  @BeforeAll
  static void ngspiceIsInstalled() {
    assertTrue(Ngspice.available(), Ngspice.MISSING);
  }

  record Case(String template, AcMeasure measure, Stage stage) {
    @Override
    public String toString() {
      return template + " in " + measure.word();
    }
  }

  static Stream<Case> cases() {
    List<Case> cases = new ArrayList<>();
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      if (stage.inputs().stream().noneMatch(TestInput::hasAc)) {
        continue;
      }
      for (AcMeasure measure : AcMeasure.values()) {
        cases.add(new Case(template.name(), measure, stage));
      }
    }
    return cases.stream();
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("cases")
  void solveJsonAmplitudes_inEachMeasure_agreeWithNgspice(Case c) {
    Stage stated =
        c.stage()
            .withInputs(
                c.stage().inputs().stream()
                    .map(i -> new TestInput(i.net(), i.dc(), i.ac(), i.hz(), c.measure()))
                    .toList());
    // The same inputs as peaks, by the textbook relations and not by the program's own.
    Stage asPeak =
        c.stage()
            .withInputs(
                c.stage().inputs().stream()
                    .map(i -> new TestInput(i.net(), i.dc(), peakOf(i.ac(), c.measure()), i.hz()))
                    .toList());
    FlatCircuit flat = FlatCircuit.of(asPeak, Conditions.NOMINAL);
    List<Ngspice.Solved> states = SpiceSolve.states(flat, c.template());
    assertThat(states).as("ngspice solutions of %s", c.template()).isNotEmpty();
    Map<String, Phasor> reference = SpiceComparison.of(flat, states).ac();
    assertThat(reference).as("ngspice AC magnitudes").isNotEmpty();

    SolveResult.Solved solved = (SolveResult.Solved) StageSolver.solve(stated);
    String json =
        SolutionJson.write(solved, StageSolver.ac(stated, solved.primary()), null, c.measure());
    JsonField ac = JsonField.parseRoot(json, "solution").require("ac", "the AC response");
    assertThat(ac.require("measure", "the measure").text()).isEqualTo(c.measure().word());
    JsonField nets = ac.require("nets", "the nets");
    List<String> problems = new ArrayList<>();
    for (Map.Entry<String, Phasor> e : reference.entrySet()) {
      double expected = inMeasure(e.getValue().amplitude(), c.measure());
      double ours =
          nets.require(e.getKey(), "the net").require("amplitude", "").number("the amplitude");
      double allowed = SpiceComparison.AC_FRACTION * expected + SpiceComparison.AC_FLOOR_VOLTS;
      if (Math.abs(ours - expected) > allowed) {
        problems.add(
            String.format(
                Locale.ROOT, "%s: ours %.9g V, ngspice %.9g V", e.getKey(), ours, expected));
      }
    }
    assertThat(problems).as("AC amplitudes of %s", c).isEmpty();
  }

  /** Peak of a sine stated in a measure: RMS·√2, peak-to-peak / 2 (textbook relations). */
  private static double peakOf(double value, AcMeasure measure) {
    return switch (measure) {
      case PEAK -> value;
      case RMS -> value * Math.sqrt(2);
      case PP -> value / 2;
    };
  }

  /** A sine's peak stated in a measure: peak / √2 for RMS, 2 × peak for peak-to-peak. */
  private static double inMeasure(double peak, AcMeasure measure) {
    return switch (measure) {
      case PEAK -> peak;
      case RMS -> peak / Math.sqrt(2);
      case PP -> 2 * peak;
    };
  }
}

package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Templates;
import com.stagewise.solver.Analysis;
import com.stagewise.solver.Change;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.DeviceParams;
import com.stagewise.solver.Probe;
import com.stagewise.solver.SolveResult;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The prediction spread from sensitivities (what the diagnosis uses) against Monte Carlo sampling
 * of the same uncertain parameters: two methods, one answer, on working stages of several
 * templates.
 */
class SpreadCrossCheckTest {
  private static final int SAMPLES = 3000;

  @ParameterizedTest
  @ValueSource(
      strings = {
        "inverting",
        "non-inverting",
        "summing",
        "difference",
        "instrumentation",
        "single-supply-inverting"
      })
  void sensitivitySpread_matchesMonteCarlo(String template) {
    Stage stage = Templates.named(template).build();
    TestPoints points = new TestPoints(stage);
    Prediction p =
        new Predictor(points, stage)
            .predict(new Scenario(stage, Conditions.NOMINAL, 1, Double.NaN, ""), true)
            .get(0);
    double[] mc = monteCarloSd(stage, points, new Random(11));
    int compared = 0;
    for (int i = 0; i < points.size; i++) {
      if (mc[i] < 2e-3) {
        continue; // below a meter's resolution; ratios of tiny numbers say nothing
      }
      compared++;
      // Sampling error of a standard deviation from 3000 samples is about 1.3 %; the rest is the
      // linearisation and the one-sided gain step. Within 25 % is plenty for a likelihood.
      assertThat(p.dcSd()[i] / mc[i])
          .as("%s at %s", template, points.names.get(i))
          .isBetween(0.75, 1.25);
    }
    assertThat(compared).isGreaterThan(0);
  }

  /** Standard deviation at each test point over random units: every parameter uniform in range. */
  static double[] monteCarloSd(Stage stage, TestPoints points, Random random) {
    Analysis base = Analysis.of(stage, Conditions.NOMINAL);
    List<Part> parts = stage.parts();
    double[] sum = new double[points.size];
    double[] squares = new double[points.size];
    var pins = stage.pinNets();
    List<String> nets = new ArrayList<>();
    for (int i = 0; i < points.size; i++) {
      nets.add(points.isPin(i) ? pins.get(points.names.get(i)) : points.names.get(i));
    }
    Probe probe = base.probe(nets);
    int n = 0;
    for (int s = 0; s < SAMPLES; s++) {
      List<Change> changes = new ArrayList<>();
      for (Part part : parts) {
        changes.add(
            new Change.PartValue(
                part.ref(), part.value() * (1 + part.tolerance() * (2 * random.nextDouble() - 1))));
      }
      for (Rail rail : stage.rails()) {
        changes.add(
            new Change.DrivenVolts(
                rail.net(), rail.volts() * (1 + rail.tolerance() * (2 * random.nextDouble() - 1))));
      }
      for (int k = 0; k < stage.amplifiers().size(); k++) {
        DeviceClass type = stage.amplifiers().get(k).deviceClass();
        double gain =
            type.openLoopGain().low()
                * Math.pow(
                    type.openLoopGain().high() / type.openLoopGain().low(), random.nextDouble());
        double offset = type.offset().high() * (2 * random.nextDouble() - 1);
        double bias = type.biasCurrent().high() * (2 * random.nextDouble() - 1);
        double low =
            type.headroomLow().low()
                + (type.headroomLow().high() - type.headroomLow().low()) * random.nextDouble();
        double high =
            type.headroomHigh().low()
                + (type.headroomHigh().high() - type.headroomHigh().low()) * random.nextDouble();
        changes.add(
            new Change.Device(
                stage.amplifiers().get(k).ref(),
                new DeviceParams(gain, offset, bias, bias, type.outputResistance(), low, high)));
      }
      if (base.with(changes.toArray(new Change[0])).solve() instanceof SolveResult.Solved solved) {
        double[] v = probe.dc(solved.primary());
        for (int i = 0; i < points.size; i++) {
          sum[i] += v[i];
          squares[i] += v[i] * v[i];
        }
        n++;
      }
    }
    double[] sd = new double[points.size];
    for (int i = 0; i < points.size; i++) {
      double mean = sum[i] / n;
      sd[i] = Math.sqrt(Math.max(0, squares[i] / n - mean * mean));
    }
    return sd;
  }
}

package com.stagewise.diagnosis;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.DeviceParams;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A program run by hand, not a test: for the healthy units of the truth set on the stages with
 * diodes, zeners, LEDs or trimmers, prints the verdict, the leading suspects and the readings that
 * lie furthest from the healthy prediction (in standard deviations of its total spread), so that a
 * false alarm can be traced to the test point and the part behind it.
 *
 * <p>{@code java -cp target/test-classes:target/classes:…
 * com.stagewise.diagnosis.HealthyCallMeasure}
 */
final class HealthyCallMeasure {
  private HealthyCallMeasure() {}

  public static void main(String[] args) {
    for (TruthCases.StageCases stage : TruthCases.load()) {
      boolean newer =
          stage.stage().parts().stream()
              .anyMatch(p -> p.kind().isJunction() || p.kind().isTrimmer());
      if (!newer && args.length == 0) {
        continue;
      }
      Diagnoser diagnoser = Diagnoser.of(stage.stage());
      TestPoints points = new TestPoints(stage.stage());
      Prediction healthy = healthyPrediction(stage.stage(), points);
      int called = 0;
      int count = 0;
      for (TruthCases.Case c : stage.cases()) {
        if (!c.fault().equals("healthy")) {
          continue;
        }
        count++;
        ReadingSet set = c.full(stage.meter());
        Diagnosis d = diagnoser.diagnose(set, 5);
        boolean ok = d.verdict() == Verdict.HEALTHY;
        called += ok ? 1 : 0;
        if (ok && args.length == 0) {
          continue;
        }
        StringBuilder line = new StringBuilder();
        line.append(String.format(Locale.ROOT, "%-40s %-12s", stage.name(), d.verdict()));
        for (int i = 0; i < Math.min(3, d.suspects().size()); i++) {
          Suspect s = d.suspects().get(i);
          line.append(String.format(Locale.ROOT, " %s %.3f", s.fault(), s.probability()));
        }
        System.out.println(line);
        List<String> worst = new ArrayList<>();
        for (Reading r : set.readings()) {
          Evidence.Bound b = Evidence.bind(points, set, r, stage.stage());
          double z =
              (r.value() - Evidence.mean(healthy, b)) / Math.sqrt(Evidence.variance(healthy, b));
          if (Math.abs(z) > Double.parseDouble(System.getProperty("z", "2"))) {
            worst.add(
                String.format(
                    Locale.ROOT,
                    "    %s read %.4f, healthy %.4f ± %.4f (spread), z = %.1f",
                    r.at(),
                    r.value(),
                    Evidence.mean(healthy, b),
                    healthy.dcSd()[b.point()],
                    z));
          }
        }
        worst.forEach(System.out::println);
      }
      System.out.printf(
          Locale.ROOT, "%-40s healthy called %d of %d%n", stage.name(), called, count);
    }
  }

  /** The healthy hypothesis's prediction, made as the diagnoser makes it. */
  static Prediction healthyPrediction(Stage stage, TestPoints points) {
    Conditions conditions = Conditions.NOMINAL;
    for (Amplifier amp : stage.amplifiers()) {
      DeviceClass type = amp.deviceClass();
      double bias = (type.biasCurrent().low() + type.biasCurrent().high()) / 2;
      conditions =
          conditions.withDevice(
              amp.ref(),
              DeviceParams.nominal(type)
                  .withBias(bias, bias)
                  .withHeadroom(
                      (type.headroomLow().low() + type.headroomLow().high()) / 2,
                      (type.headroomHigh().low() + type.headroomHigh().high()) / 2));
    }
    Predictor predictor = new Predictor(points, stage);
    return predictor.predict(new Scenario(stage, conditions, 1, Double.NaN, ""), true).get(0);
  }
}

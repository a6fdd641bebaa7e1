package com.stagewise.diagnosis;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.solver.AcSolution;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.DeviceParams;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.Phasor;
import com.stagewise.solver.SectionState;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.util.ArrayList;
import java.util.List;
import java.util.function.UnaryOperator;

/**
 * Predicts what every test point reads under one scenario, with its spread.
 *
 * <p>The method is a mix of corners and sensitivities. Corners first: each section's input offset
 * is set to both ends of its class's range; where that flips a section between linear and a limit
 * (an open loop whose sign only the offset decides), the scenario splits into both outcomes. Then
 * sensitivities about each outcome's operating point: every uncertain parameter (part values within
 * tolerance, rails within tolerance, offset, bias current, headroom and gain within the class's
 * ranges) is moved by one standard deviation and the solve repeated; the changes add in quadrature.
 * A move that crosses a limit shows up as a large change, which widens the spread where a reading
 * sits near a saturation edge: the honest answer there.
 */
final class Predictor {
  /** Standard deviation of a uniform distribution over ±1, in units of the half-width. */
  private static final double UNIFORM_SD = 1 / Math.sqrt(3);

  private final TestPoints points;
  private final double span;

  Predictor(TestPoints points, Stage base) {
    this.points = points;
    double max = 1;
    for (Rail rail : base.rails()) {
      max = Math.max(max, Math.abs(rail.volts()));
    }
    this.span = max;
  }

  /**
   * Returns the predictions of a scenario: one, or two where the outcome splits.
   *
   * @param withSpread whether to compute the spread (false leaves it zero, for grid points whose
   *     spread is borrowed from a neighbour)
   */
  List<Prediction> predict(Scenario scenario, boolean withSpread) {
    Stage stage = scenario.stage();
    Conditions conditions = scenario.conditions();
    SolveResult result = StageSolver.solve(stage, conditions);
    if (!(result instanceof SolveResult.Solved solved)) {
      return List.of(unpredictable(scenario));
    }
    List<Outcome> outcomes = new ArrayList<>();
    if (solved.points().size() > 1) {
      for (OperatingPoint point : solved.points()) {
        outcomes.add(new Outcome(point, conditions, scenario.weight() / solved.points().size(), "settles " + describe(point)));
      }
    } else {
      outcomes.addAll(offsetCorners(stage, conditions, solved.primary(), scenario.weight()));
    }
    List<Prediction> predictions = new ArrayList<>();
    boolean ac = stage.inputs().stream().anyMatch(i -> i.hasAc());
    for (Outcome outcome : outcomes) {
      double[] dcMean = dcValues(outcome.point);
      double[] acMean = ac ? acValues(stage, outcome.conditions, outcome.point) : null;
      double[] dcVar = new double[points.size];
      double[] acVar = ac ? new double[points.size] : null;
      if (withSpread) {
        for (Perturbation p : perturbations(stage, outcome.conditions)) {
          Stage s = p.stage.apply(stage);
          Conditions c = p.conditions.apply(outcome.conditions);
          SolveResult r = StageSolver.solve(s, c);
          if (!(r instanceof SolveResult.Solved moved)) {
            continue;
          }
          OperatingPoint near = matching(moved, outcome.point);
          addSquares(dcVar, dcValues(near), dcMean);
          if (ac) {
            addSquares(acVar, acValues(s, c, near), acMean);
          }
        }
      }
      String label = join(scenario.label(), outcome.label);
      predictions.add(
          new Prediction(
              outcome.weight,
              dcMean,
              sqrt(dcVar),
              acMean,
              ac ? sqrt(acVar) : null,
              scenario.value(),
              label,
              outcome.point.states()));
    }
    return predictions;
  }

  private record Outcome(OperatingPoint point, Conditions conditions, double weight, String label) {}

  private record Perturbation(UnaryOperator<Stage> stage, UnaryOperator<Conditions> conditions) {}

  private List<Outcome> offsetCorners(Stage stage, Conditions conditions, OperatingPoint nominal, double weight) {
    for (Amplifier amp : stage.amplifiers()) {
      if (conditions.forcedState(amp.ref()).isPresent()) {
        continue;
      }
      DeviceParams params = conditions.device(amp);
      double max = amp.deviceClass().offset().high();
      Conditions plus = conditions.withDevice(amp.ref(), params.withOffset(params.offset() + max));
      Conditions minus = conditions.withDevice(amp.ref(), params.withOffset(params.offset() - max));
      OperatingPoint up = primary(StageSolver.solve(stage, plus));
      OperatingPoint down = primary(StageSolver.solve(stage, minus));
      if (up == null || down == null) {
        continue;
      }
      SectionState now = nominal.states().get(amp.ref());
      SectionState upState = up.states().get(amp.ref());
      SectionState downState = down.states().get(amp.ref());
      if (upState != downState && (upState != now || downState != now)) {
        return List.of(
            new Outcome(up, plus, weight / 2, amp.ref() + " offset positive"),
            new Outcome(down, minus, weight / 2, amp.ref() + " offset negative"));
      }
    }
    return List.of(new Outcome(nominal, conditions, weight, ""));
  }

  private static OperatingPoint primary(SolveResult result) {
    return result instanceof SolveResult.Solved s ? s.primary() : null;
  }

  private static OperatingPoint matching(SolveResult.Solved solved, OperatingPoint target) {
    for (OperatingPoint point : solved.points()) {
      if (point.states().equals(target.states())) {
        return point;
      }
    }
    return solved.primary();
  }

  private List<Perturbation> perturbations(Stage stage, Conditions conditions) {
    List<Perturbation> list = new ArrayList<>();
    for (Part part : stage.parts()) {
      if (part.tolerance() > 0 && !part.ref().startsWith("~")) {
        double value = part.value() * (1 + part.tolerance() * UNIFORM_SD);
        list.add(new Perturbation(s -> s.withPart(part.ref(), p -> p.withValue(value)), c -> c));
      }
    }
    for (Rail rail : stage.rails()) {
      double volts = conditions.driven().getOrDefault(rail.net(), rail.volts());
      double moved = volts * (1 + rail.tolerance() * UNIFORM_SD);
      list.add(new Perturbation(s -> s, c -> c.withDriven(rail.net(), moved)));
    }
    boolean drifting = stage.parts().stream().anyMatch(part -> part.ref().startsWith(FaultModel.DRIFT_TIE));
    for (Amplifier amp : stage.amplifiers()) {
      DeviceParams p = conditions.device(amp);
      DeviceClass type = amp.deviceClass();
      String ref = amp.ref();
      double offset = p.offset() + type.offset().high() * UNIFORM_SD;
      double bias = type.biasCurrent().high() * UNIFORM_SD;
      double low = p.headroomLow() + (type.headroomLow().high() - type.headroomLow().low()) / Math.sqrt(12);
      double high = p.headroomHigh() + (type.headroomHigh().high() - type.headroomHigh().low()) / Math.sqrt(12);
      list.add(new Perturbation(s -> s, c -> c.withDevice(ref, c.device(amp).withOffset(offset))));
      if (!drifting) {
        // Where a floating input is tied to a rail to stand for its drift, the bias current is
        // already what put it there; moving it again through the tie would be counted twice.
        list.add(new Perturbation(s -> s, c -> c.withDevice(ref, c.device(amp).withBias(bias, bias))));
      }
      list.add(new Perturbation(s -> s, c -> c.withDevice(ref, c.device(amp).withHeadroom(low, p.headroomHigh()))));
      list.add(new Perturbation(s -> s, c -> c.withDevice(ref, c.device(amp).withHeadroom(p.headroomLow(), high))));
      // Gain is spread over a decade or more; the low end of the class's range is the honest step.
      list.add(new Perturbation(s -> s, c -> c.withDevice(ref, c.device(amp).withGain(type.openLoopGain().low()))));
    }
    return list;
  }

  private double[] dcValues(OperatingPoint point) {
    double[] values = new double[points.size];
    for (int i = 0; i < points.size; i++) {
      String name = points.names.get(i);
      Double v = points.isPin(i) ? point.pins().get(name) : point.nets().get(name);
      if (v == null && points.isPin(i)) {
        v = point.nets().get(points.netOf.get(i));
      }
      // A net that the fault took every part away from reads like a bare pad: about 0 V.
      values[i] = v == null ? 0 : v;
    }
    return values;
  }

  private double[] acValues(Stage stage, Conditions conditions, OperatingPoint point) {
    double[] values = new double[points.size];
    AcSolution ac = StageSolver.ac(stage, conditions, point).orElse(null);
    if (ac == null) {
      return values;
    }
    java.util.Map<String, String> pinNets = stage.pinNets();
    for (int i = 0; i < points.size; i++) {
      String name = points.names.get(i);
      String net = points.isPin(i) ? pinNets.getOrDefault(name, points.netOf.get(i)) : name;
      Phasor phasor = ac.nets().get(net);
      values[i] = phasor == null ? 0 : phasor.amplitude();
    }
    return values;
  }

  private Prediction unpredictable(Scenario scenario) {
    // No consistent state (e.g. the fault makes the stage oscillate): any reading within the rails.
    double[] mean = new double[points.size];
    double[] sd = new double[points.size];
    java.util.Arrays.fill(sd, span);
    return new Prediction(scenario.weight(), mean, sd, mean.clone(), sd.clone(), scenario.value(), join(scenario.label(), "no steady state"), java.util.Map.of());
  }

  private static String describe(OperatingPoint point) {
    List<String> parts = new ArrayList<>();
    point.states().forEach((ref, state) -> parts.add(ref + " " + state.word()));
    return String.join(", ", parts);
  }

  private static void addSquares(double[] sum, double[] moved, double[] base) {
    for (int i = 0; i < sum.length; i++) {
      double d = moved[i] - base[i];
      sum[i] += d * d;
    }
  }

  private static double[] sqrt(double[] values) {
    double[] out = new double[values.length];
    for (int i = 0; i < values.length; i++) {
      out[i] = Math.sqrt(values[i]);
    }
    return out;
  }

  private static String join(String a, String b) {
    if (a.isEmpty()) {
      return b;
    }
    return b.isEmpty() ? a : a + ", " + b;
  }
}

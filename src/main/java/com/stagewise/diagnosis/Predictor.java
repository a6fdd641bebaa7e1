package com.stagewise.diagnosis;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.solver.CompiledStage;
import com.stagewise.solver.DeviceParams;
import com.stagewise.solver.SectionState;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

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
 * sits near a saturation edge: the honest answer there. The stage is compiled once per scenario and
 * only numbers change between the solves.
 */
final class Predictor {
  /** Standard deviation of a uniform distribution over ±1, in units of the half-width. */
  private static final double UNIFORM_SD = 1 / Math.sqrt(3);

  private final TestPoints points;
  private final double span;
  private final Map<List<Amplifier>, Map<String, String>> pinCache =
      new java.util.IdentityHashMap<>();

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
    CompiledStage cs = CompiledStage.of(stage, scenario.conditions());
    if (drifting(stage)) {
      // A floating input tied to a rail stands for its bias current's drift; the current itself,
      // pushed through the tie, would move the node by hundreds of volts.
      for (int k = 0; k < cs.sectionCount(); k++) {
        cs.setDevice(k, cs.device(k).withBias(0, 0));
      }
    }
    int[] at = pointNets(stage, cs);
    CompiledStage.Outcome outcome = cs.solve();
    if (!(outcome instanceof CompiledStage.Settled settled)) {
      return List.of(unpredictable(scenario));
    }
    List<Outcome> outcomes = new ArrayList<>();
    if (settled.states().size() > 1) {
      for (CompiledStage.State state : settled.states()) {
        outcomes.add(
            new Outcome(
                state,
                -1,
                0,
                scenario.weight() / settled.states().size(),
                "settles " + describe(stage, state)));
      }
    } else if (withSpread || !scenario.onGrid()) {
      outcomes.addAll(offsetCorners(stage, cs, settled.states().get(0), scenario.weight()));
    } else {
      outcomes.add(new Outcome(settled.states().get(0), -1, 0, scenario.weight(), ""));
    }
    boolean ac = cs.acHz() > 0;
    List<Perturbation> perturbations = withSpread ? perturbations(stage, cs) : List.of();
    List<Prediction> predictions = new ArrayList<>();
    for (Outcome o : outcomes) {
      DeviceParams saved = o.section >= 0 ? cs.device(o.section) : null;
      if (o.section >= 0) {
        cs.setDevice(o.section, saved.withOffset(o.offset));
      }
      double[] dcMean = pick(o.state.volts(), at);
      double[] acMean = ac ? acValues(cs, o.state, at) : null;
      double[] dcVar = new double[points.size];
      double[] acVar = ac ? new double[points.size] : null;
      CompiledStage.Linearization linear = perturbations.isEmpty() ? null : cs.linearize(o.state);
      for (Perturbation p : perturbations) {
        p.apply(cs);
        CompiledStage.State near = linear == null ? null : linear.step();
        if (near == null) {
          // A section changes state within one standard deviation: search again from this state,
          // and solve in full only if that does not settle.
          near = cs.solveNear(o.state);
        }
        if (near == null) {
          CompiledStage.Outcome moved = cs.solve();
          near = moved instanceof CompiledStage.Settled m ? matching(m, o.state) : null;
        }
        if (near != null) {
          addSquares(dcVar, pick(near.volts(), at), dcMean);
          // Only part values and gain move the small-signal response of a settled state.
          if (ac && p.movesAc) {
            addSquares(acVar, acValues(cs, near, at), acMean);
          }
        }
        p.undo(cs);
      }
      if (o.section >= 0) {
        cs.setDevice(o.section, saved);
      }
      predictions.add(
          new Prediction(
              o.weight,
              dcMean,
              sqrt(dcVar),
              acMean,
              ac ? sqrt(acVar) : null,
              scenario.value(),
              join(scenario.label(), o.label),
              states(stage, o.state)));
    }
    return predictions;
  }

  /**
   * One outcome of a scenario: a settled state, and the section whose offset was set to reach it
   * (-1 when none).
   */
  private record Outcome(
      CompiledStage.State state, int section, double offset, double weight, String label) {}

  /** A change of one number of a compiled stage by one standard deviation, and its undoing. */
  private static final class Perturbation {
    private final java.util.function.Consumer<CompiledStage> apply;
    private final java.util.function.Consumer<CompiledStage> undo;
    private final boolean movesAc;

    Perturbation(
        java.util.function.Consumer<CompiledStage> apply,
        java.util.function.Consumer<CompiledStage> undo,
        boolean movesAc) {
      this.apply = apply;
      this.undo = undo;
      this.movesAc = movesAc;
    }

    void apply(CompiledStage cs) {
      apply.accept(cs);
    }

    void undo(CompiledStage cs) {
      undo.accept(cs);
    }
  }

  /** Maps each test point to the scenario's net index (a lifted pin reads its own net). */
  private int[] pointNets(Stage stage, CompiledStage cs) {
    // Scenarios of one fault share their sections (a drift grid changes only a value), so the pin
    // map is kept per list of sections.
    Map<String, String> pins =
        pinCache.computeIfAbsent(stage.amplifiers(), amps -> stage.pinNets());
    int[] at = new int[points.size];
    for (int i = 0; i < points.size; i++) {
      String name = points.names.get(i);
      String net = points.isPin(i) ? pins.getOrDefault(name, points.netOf.get(i)) : name;
      at[i] = cs.net(net);
    }
    return at;
  }

  private List<Outcome> offsetCorners(
      Stage stage, CompiledStage cs, CompiledStage.State nominal, double weight) {
    for (int k = 0; k < cs.sectionCount(); k++) {
      if (cs.isForced(k)) {
        continue;
      }
      DeviceParams params = cs.device(k);
      double max = stage.amplifiers().get(k).deviceClass().offset().high();
      cs.setDevice(k, params.withOffset(params.offset() + max));
      CompiledStage.State up = near(cs, nominal);
      cs.setDevice(k, params.withOffset(params.offset() - max));
      CompiledStage.State down = near(cs, nominal);
      cs.setDevice(k, params);
      if (up == null || down == null) {
        continue;
      }
      SectionState now = nominal.states()[k];
      SectionState upState = up.states()[k];
      SectionState downState = down.states()[k];
      if (upState != downState && (upState != now || downState != now)) {
        String ref = stage.amplifiers().get(k).ref();
        return List.of(
            new Outcome(up, k, params.offset() + max, weight / 2, ref + " offset positive"),
            new Outcome(down, k, params.offset() - max, weight / 2, ref + " offset negative"));
      }
    }
    return List.of(new Outcome(nominal, -1, 0, weight, ""));
  }

  /** The state the stage settles in from {@code from}'s states, else its first state, else null. */
  private static CompiledStage.State near(CompiledStage cs, CompiledStage.State from) {
    CompiledStage.State state = cs.solveNear(from);
    return state != null ? state : first(cs.solve());
  }

  private static CompiledStage.State first(CompiledStage.Outcome outcome) {
    return outcome instanceof CompiledStage.Settled s ? s.states().get(0) : null;
  }

  private static CompiledStage.State matching(
      CompiledStage.Settled settled, CompiledStage.State target) {
    for (CompiledStage.State state : settled.states()) {
      if (Arrays.equals(state.states(), target.states())) {
        return state;
      }
    }
    return settled.states().get(0);
  }

  private List<Perturbation> perturbations(Stage stage, CompiledStage cs) {
    List<Perturbation> list = new ArrayList<>();
    List<Part> parts = stage.parts();
    for (int p = 0; p < parts.size(); p++) {
      Part part = parts.get(p);
      if (part.tolerance() > 0 && !part.ref().startsWith("~")) {
        int index = p;
        double nominal = cs.partValue(p);
        double moved = nominal * (1 + part.tolerance() * UNIFORM_SD);
        list.add(
            new Perturbation(
                c -> c.setPartValue(index, moved), c -> c.setPartValue(index, nominal), true));
      }
    }
    for (Rail rail : stage.rails()) {
      int net = cs.net(rail.net());
      double volts = cs.drivenVolts(net);
      double moved = volts * (1 + rail.tolerance() * UNIFORM_SD);
      list.add(
          new Perturbation(
              c -> c.setDrivenVolts(net, moved), c -> c.setDrivenVolts(net, volts), false));
    }
    boolean drifting = drifting(stage);
    for (int k = 0; k < cs.sectionCount(); k++) {
      Amplifier amp = stage.amplifiers().get(k);
      DeviceClass type = amp.deviceClass();
      int section = k;
      double offsetStep = type.offset().high() * UNIFORM_SD;
      // Uniform over the class's range: its standard deviation is the width over √12.
      double biasStep = (type.biasCurrent().high() - type.biasCurrent().low()) / Math.sqrt(12);
      double lowStep = (type.headroomLow().high() - type.headroomLow().low()) / Math.sqrt(12);
      double highStep = (type.headroomHigh().high() - type.headroomHigh().low()) / Math.sqrt(12);
      list.add(device(section, p -> p.withOffset(p.offset() + offsetStep), false));
      if (!drifting) {
        // Where a floating input is tied to a rail to stand for its drift, the bias current is
        // already what put it there; moving it again through the tie would count it twice.
        list.add(
            device(
                section,
                p -> p.withBias(p.biasPlus() + biasStep, p.biasMinus() + biasStep),
                false));
      }
      list.add(
          device(section, p -> p.withHeadroom(p.headroomLow() + lowStep, p.headroomHigh()), false));
      list.add(
          device(
              section, p -> p.withHeadroom(p.headroomLow(), p.headroomHigh() + highStep), false));
      // Gain is spread over a decade or more; the low end of the class's range is the honest step.
      double lowGain = type.openLoopGain().low();
      list.add(device(section, p -> p.withGain(lowGain), true));
    }
    return list;
  }

  private static boolean drifting(Stage stage) {
    return stage.parts().stream().anyMatch(part -> part.ref().startsWith(FaultModel.DRIFT_TIE));
  }

  private static Perturbation device(
      int k, java.util.function.UnaryOperator<DeviceParams> change, boolean movesAc) {
    DeviceParams[] saved = new DeviceParams[1];
    return new Perturbation(
        c -> {
          saved[0] = c.device(k);
          c.setDevice(k, change.apply(saved[0]));
        },
        c -> c.setDevice(k, saved[0]),
        movesAc);
  }

  private double[] pick(double[] volts, int[] at) {
    double[] values = new double[points.size];
    for (int i = 0; i < points.size; i++) {
      // A net that the fault took every part away from reads like a bare pad: about 0 V.
      values[i] = at[i] < 0 ? 0 : volts[at[i]];
    }
    return values;
  }

  private double[] acValues(CompiledStage cs, CompiledStage.State state, int[] at) {
    double[][] ac = cs.ac(state);
    double[] values = new double[points.size];
    if (ac == null) {
      return values;
    }
    for (int i = 0; i < points.size; i++) {
      values[i] = at[i] < 0 ? 0 : ac[0][at[i]];
    }
    return values;
  }

  private Prediction unpredictable(Scenario scenario) {
    // No consistent state (e.g. the fault makes the stage oscillate): any reading within the rails.
    double[] mean = new double[points.size];
    double[] sd = new double[points.size];
    Arrays.fill(sd, span);
    return new Prediction(
        scenario.weight(),
        mean,
        sd,
        mean.clone(),
        sd.clone(),
        scenario.value(),
        join(scenario.label(), "no steady state"),
        Map.of());
  }

  private static Map<String, SectionState> states(Stage stage, CompiledStage.State state) {
    Map<String, SectionState> map = new LinkedHashMap<>();
    for (int k = 0; k < state.states().length; k++) {
      map.put(stage.amplifiers().get(k).ref(), state.states()[k]);
    }
    return map;
  }

  private static String describe(Stage stage, CompiledStage.State state) {
    List<String> parts = new ArrayList<>();
    states(stage, state).forEach((ref, s) -> parts.add(ref + " " + s.word()));
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

package com.stagewise.diagnosis;

import com.stagewise.circuit.Stage;
import com.stagewise.solver.Conditions;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Builds the hypotheses of a stage: every fault of the catalogue with its prior and the predictions
 * of its scenarios (a drifted value on a grid, interpolated between grid points, under a
 * log-uniform prior).
 */
final class Hypotheses {
  /** Grid points whose spread is computed; the others borrow it from the nearest of these. */
  private static final int SPREAD_EVERY = 8;

  /** Interpolated steps between neighbouring grid points of a drifted value. */
  private static final int SUB_STEPS = 4;

  private Hypotheses() {}

  /**
   * Returns every hypothesis of the catalogue with its prior and the predictions of its scenarios,
   * the inputs held at {@code inputs} (the sheet's levels, or the measured ones).
   */
  static List<Diagnoser.Hypothesis> build(
      Stage stage,
      TestPoints points,
      FaultCatalogue.Entries catalogue,
      Map<String, Double> priors,
      Map<String, Double> inputs) {
    Conditions conditions = Conditions.NOMINAL;
    // Predictions start from the middle of each class's ranges (bias current, headroom), where a
    // random working part is most likely to sit; the solver's nominal takes bias as zero.
    for (com.stagewise.circuit.Amplifier amp : stage.amplifiers()) {
      com.stagewise.circuit.DeviceClass type = amp.deviceClass();
      double bias = mid(type.biasCurrent());
      conditions =
          conditions.withDevice(
              amp.ref(),
              com.stagewise.solver.DeviceParams.nominal(type)
                  .withBias(bias, bias)
                  .withHeadroom(mid(type.headroomLow()), mid(type.headroomHigh())));
    }
    for (Map.Entry<String, Double> e : inputs.entrySet()) {
      conditions = conditions.withDriven(e.getKey(), e.getValue());
    }
    Predictor predictor = new Predictor(points, stage);
    Conditions base = conditions;
    List<Fault> faults = catalogue.faults();
    // The hypotheses are independent of each other: each is predicted on its own (on every core
    // the common pool offers) and the list is put together in the catalogue's order, so the result
    // is the same, to the last bit, whatever the number of threads. Faults tried on a grid of
    // values cost tens of times more than the others: they are offered first, so that no thread
    // is left with one of them at the end while the others wait.
    int[] order = new int[faults.size()];
    int next = 0;
    for (int pass = 0; pass < 2; pass++) {
      for (int i = 0; i < faults.size(); i++) {
        if (onGrid(faults.get(i).kind()) == (pass == 0)) {
          order[next++] = i;
        }
      }
    }
    Diagnoser.Hypothesis[] built = new Diagnoser.Hypothesis[faults.size()];
    EveryCore.forEach(
        order.length, new BuildOne(stage, base, faults, order, priors, predictor, built));
    return List.of(built);
  }

  /**
   * Builds the hypothesis of one fault (by its place in the order) into its slot. A class rather
   * than a lambda: each lambda spins a class of its own on first use, paid by a fresh run.
   */
  private record BuildOne(
      Stage stage,
      Conditions base,
      List<Fault> faults,
      int[] order,
      Map<String, Double> priors,
      Predictor predictor,
      Diagnoser.Hypothesis[] built)
      implements java.util.function.IntConsumer {
    @Override
    public void accept(int j) {
      Fault fault = faults.get(order[j]);
      List<Scenario> scenarios = FaultModel.scenarios(stage, base, fault);
      List<Prediction> predictions = predictAll(predictor, scenarios);
      built[order[j]] = new Diagnoser.Hypothesis(fault, priors.get(fault.id()), predictions);
    }
  }

  /** Whether a fault of this kind is tried on a grid of values (a drift, a low rail, a leak). */
  private static boolean onGrid(FaultKind kind) {
    return switch (kind) {
      case HIGH, LOW, RAIL_LOW, LEAKY, MISSET -> true;
      default -> false;
    };
  }

  private static double mid(com.stagewise.circuit.Range range) {
    return (range.low() + range.high()) / 2;
  }

  private static List<Prediction> predictAll(Predictor predictor, List<Scenario> scenarios) {
    boolean grid = scenarios.size() > 1 && FaultModel.allOnGrid(scenarios);
    ScenarioCompiler compiler = new ScenarioCompiler();
    if (!grid) {
      List<Prediction> out = new ArrayList<>();
      for (Scenario s : scenarios) {
        out.addAll(predictor.predict(s, true, compiler));
      }
      return out;
    }
    int n = scenarios.size();
    List<List<Prediction>> raw = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      boolean spread = i % SPREAD_EVERY == 0 || i == n - 1;
      raw.add(predictor.predict(scenarios.get(i), spread, compiler));
    }
    // Borrow the spread of the nearest grid point that has one.
    for (int i = 0; i < n; i++) {
      if (i % SPREAD_EVERY == 0 || i == n - 1) {
        continue;
      }
      int lower = i - i % SPREAD_EVERY;
      int upper = Math.min(lower + SPREAD_EVERY, n - 1);
      int from = i - lower <= upper - i ? lower : upper;
      List<Prediction> borrowed = new ArrayList<>();
      for (int k = 0; k < raw.get(i).size(); k++) {
        Prediction p = raw.get(i).get(k);
        Prediction donor = raw.get(from).get(Math.min(k, raw.get(from).size() - 1));
        borrowed.add(
            new Prediction(
                p.weight(),
                p.dcMean(),
                donor.dcSd(),
                AcPart.borrow(compiler, p.ac(), donor.ac()),
                p.value(),
                p.label(),
                p.states()));
      }
      raw.set(i, borrowed);
    }
    boolean simple = true;
    for (List<Prediction> list : raw) {
      simple &= list.size() == 1;
    }
    List<Prediction> out = new ArrayList<>((n - 1) * SUB_STEPS + 1);
    if (!simple) {
      CompensatedSum sum = new CompensatedSum();
      for (List<Prediction> list : raw) {
        out.addAll(list);
        for (Prediction p : list) {
          sum.add(p.weight());
        }
      }
      double total = sum.total();
      List<Prediction> weighed = new ArrayList<>(out.size());
      for (Prediction p : out) {
        weighed.add(p.withWeight(p.weight() / total));
      }
      return java.util.Collections.unmodifiableList(weighed);
    }
    // A log-uniform prior over the drifted value: equal weight per interpolated step.
    int steps = (n - 1) * SUB_STEPS + 1;
    for (int i = 0; i < n - 1; i++) {
      Prediction a = raw.get(i).get(0);
      Prediction b = raw.get(i + 1).get(0);
      for (int k = 0; k < SUB_STEPS; k++) {
        double t = (double) k / SUB_STEPS;
        // Geometric between drifted values; linear where a grid holds 0 (a trimmer's end).
        double value =
            a.value() > 0 && b.value() > 0
                ? a.value() * Math.pow(b.value() / a.value(), t)
                : a.value() + (b.value() - a.value()) * t;
        out.add(a.toward(b, t, 1.0 / steps, value, compiler));
      }
    }
    out.add(raw.get(n - 1).get(0).withWeight(1.0 / steps));
    return out;
  }
}

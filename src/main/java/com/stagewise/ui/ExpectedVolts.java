package com.stagewise.ui;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What a healthy stage reads at each test point: the nominal volts, and a healthy range from the
 * parts' and rails' tolerances.
 *
 * <p>The range moves each part and rail to either end of its tolerance, one at a time, and keeps
 * the largest rise and fall at each point (a one-at-a-time estimate, common practice for a first
 * check), widened by {@link #OFFSET_MARGIN} for device offsets.
 *
 * @param nominal volts at every net and used pin with nominal parts
 * @param low the lower end of the healthy range at each test point
 * @param high the upper end of the healthy range at each test point
 * @param states the sections' states with nominal parts ("linear", "high", "low")
 * @param problem why the stage could not be solved (empty when it was)
 */
public record ExpectedVolts(
    Map<String, Double> nominal,
    Map<String, Double> low,
    Map<String, Double> high,
    Map<String, String> states,
    String problem) {

  /** Returns whether the stage was solved. */
  public boolean solved() {
    return problem.isEmpty();
  }

  /** Returns the nominal volts at a test point, or NaN when unknown. */
  public double at(String testPoint) {
    return nominal.getOrDefault(testPoint, Double.NaN);
  }

  /**
   * Solves the stage and its tolerance corners. Slow for big stages: call off the screen's thread.
   */
  public static ExpectedVolts of(Stage stage) {
    SolveResult result = StageSolver.solve(stage);
    if (!(result instanceof SolveResult.Solved solved)) {
      String why;
      if (result instanceof SolveResult.Floating f) {
        why =
            "nothing sets the voltage of "
                + String.join(", ", f.nets())
                + "; check the parts' nets";
      } else if (result instanceof SolveResult.NoConsistentState n) {
        why = "section " + n.section() + " has no steady state: " + n.reason();
      } else {
        why = "the stage could not be solved";
      }
      return new ExpectedVolts(Map.of(), Map.of(), Map.of(), Map.of(), why);
    }
    OperatingPoint point = solved.primary();
    Map<String, Double> nominal = new LinkedHashMap<>(point.nets());
    nominal.putAll(point.pins());
    Map<String, Double> up = new LinkedHashMap<>();
    Map<String, Double> down = new LinkedHashMap<>();
    nominal
        .keySet()
        .forEach(
            k -> {
              up.put(k, 0.0);
              down.put(k, 0.0);
            });
    for (Stage corner : corners(stage)) {
      if (StageSolver.solve(corner) instanceof SolveResult.Solved c) {
        OperatingPoint p = c.primary();
        for (String key : nominal.keySet()) {
          Double v = p.nets().containsKey(key) ? p.nets().get(key) : p.pins().get(key);
          if (v == null) {
            continue;
          }
          double delta = v - nominal.get(key);
          if (delta > 0) {
            up.merge(key, delta, Math::max);
          } else {
            down.merge(key, -delta, Math::max);
          }
        }
      }
    }
    // The range runs from nominal less the biggest fall to nominal plus the biggest rise over the
    // corners, widened for the device offsets that solve() leaves at zero.
    Map<String, Double> low = new LinkedHashMap<>();
    Map<String, Double> high = new LinkedHashMap<>();
    for (String key : nominal.keySet()) {
      low.put(key, nominal.get(key) - down.get(key) - OFFSET_MARGIN);
      high.put(key, nominal.get(key) + up.get(key) + OFFSET_MARGIN);
    }
    Map<String, String> states = new LinkedHashMap<>();
    point.states().forEach((ref, state) -> states.put(ref, state.word()));
    return new ExpectedVolts(nominal, low, high, states, "");
  }

  /** Volts added on each side for device offsets (the classic-bipolar offset range, DESIGN.md). */
  static final double OFFSET_MARGIN = 0.005;

  private static List<Stage> corners(Stage stage) {
    List<Stage> corners = new ArrayList<>();
    for (Part part : stage.parts()) {
      if (part.tolerance() > 0 && part.value() > 0) {
        for (int sign : new int[] {-1, 1}) {
          double value = part.value() * (1 + sign * part.tolerance());
          corners.add(stage.withPart(part.ref(), p -> p.withValue(value)));
        }
      }
    }
    for (Rail rail : stage.rails()) {
      if (rail.tolerance() > 0) {
        for (int sign : new int[] {-1, 1}) {
          List<Rail> rails = new ArrayList<>();
          for (Rail r : stage.rails()) {
            rails.add(
                r.net().equals(rail.net())
                    ? new Rail(r.net(), r.volts() * (1 + sign * r.tolerance()), r.tolerance())
                    : r);
          }
          corners.add(stage.withRails(rails));
        }
      }
    }
    return corners;
  }
}

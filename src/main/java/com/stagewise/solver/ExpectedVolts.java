package com.stagewise.solver;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What a healthy stage reads at each test point: the nominal volts, and a healthy range from the
 * parts' and rails' tolerances (tolerance propagation). {@code stagewise solve} prints it, and the
 * app shows it beside each test point.
 *
 * <p>The range moves each part and rail to either end of its tolerance, one at a time, and keeps
 * the largest rise and fall at each point (a one-at-a-time estimate, common practice for a first
 * check), widened by {@link #OFFSET_MARGIN} for device offsets. A corner that cannot be solved, or
 * whose state differs so much that a value is not finite, is left out of the range.
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

  /** Returns the lower end of the healthy range at a test point, or NaN when unknown. */
  public double low(String testPoint) {
    return low.getOrDefault(testPoint, Double.NaN);
  }

  /** Returns the upper end of the healthy range at a test point, or NaN when unknown. */
  public double high(String testPoint) {
    return high.getOrDefault(testPoint, Double.NaN);
  }

  /**
   * Solves the stage and its tolerance corners (two more solves per part and rail with a
   * tolerance). Slow for big stages: call off the screen's thread.
   *
   * @return the nominal volts and healthy ranges, or, when the stage cannot be solved, empty maps
   *     and the solver's one message ({@link SolveResult#problem()})
   */
  public static ExpectedVolts of(Stage stage) {
    return of(stage, StageSolver.solve(stage));
  }

  /**
   * As {@link #of(Stage)}, from the nominal solve already made.
   *
   * @param result the solver's result for {@code stage} with nominal conditions
   */
  public static ExpectedVolts of(Stage stage, SolveResult result) {
    if (!(result instanceof SolveResult.Solved solved)) {
      return new ExpectedVolts(Map.of(), Map.of(), Map.of(), Map.of(), result.problem());
    }
    OperatingPoint point = solved.primary();
    Map<String, Double> nominal = new LinkedHashMap<>(point.nets());
    nominal.putAll(point.pins());
    Map<String, Double> up = new LinkedHashMap<>();
    Map<String, Double> down = new LinkedHashMap<>();
    for (String key : nominal.keySet()) {
      up.put(key, 0.0);
      down.put(key, 0.0);
    }
    for (Stage corner : corners(stage)) {
      if (StageSolver.solve(corner) instanceof SolveResult.Solved c) {
        OperatingPoint p = c.primary();
        for (String key : nominal.keySet()) {
          Double v = p.nets().containsKey(key) ? p.nets().get(key) : p.pins().get(key);
          if (v == null || !Double.isFinite(v)) {
            continue;
          }
          double delta = v - nominal.get(key);
          if (delta > 0) {
            raise(up, key, delta);
          } else {
            raise(down, key, -delta);
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
    for (Map.Entry<String, SectionState> state : point.states().entrySet()) {
      states.put(state.getKey(), state.getValue().word());
    }
    return new ExpectedVolts(nominal, low, high, states, "");
  }

  /**
   * Keeps the larger of {@code key}'s value and {@code amount} (as {@code merge(key, amount,
   * Math::max)}, without the method reference: a fresh command-line JVM spins a class for each).
   */
  private static void raise(Map<String, Double> extremes, String key, double amount) {
    Double old = extremes.get(key);
    extremes.put(key, old == null ? amount : Math.max(old, amount));
  }

  /** Volts added on each side for device offsets (the classic-bipolar offset range, DESIGN.md). */
  static final double OFFSET_MARGIN = 0.005;

  /** Returns the stage with each part and rail at either end of its tolerance, one at a time. */
  static List<Stage> corners(Stage stage) {
    List<Stage> corners = new ArrayList<>();
    for (Part part : stage.parts()) {
      if (part.tolerance() > 0 && part.value() > 0) {
        for (int sign : new int[] {-1, 1}) {
          double value = part.value() * (1 + sign * part.tolerance());
          corners.add(stage.withPart(part.withValue(value)));
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

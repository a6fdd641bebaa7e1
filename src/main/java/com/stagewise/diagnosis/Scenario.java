package com.stagewise.diagnosis;

import com.stagewise.circuit.Stage;
import com.stagewise.solver.Conditions;

/**
 * One concrete circuit that a fault hypothesis stands for: the stage with the fault applied, the
 * solver conditions, and its weight among the hypothesis's scenarios.
 *
 * <p>A hypothesis has several scenarios when its outcome is not fixed by the fault alone: a
 * floating input may drift to either rail; a drifted part has an unknown value, tried on a grid.
 *
 * @param stage the stage with the fault applied
 * @param conditions the solver conditions (forced outputs, rail voltages)
 * @param weight the scenario's share of the hypothesis's prior, summing to 1 over the hypothesis
 * @param value for a grid scenario, the drifted part's value (ohms, farads) or the low rail's
 *     volts; NaN otherwise
 * @param label a few words for the why, e.g. "in+ drifts to v+"
 */
record Scenario(Stage stage, Conditions conditions, double weight, double value, String label) {

  Scenario withWeight(double newWeight) {
    return new Scenario(stage, conditions, newWeight, value, label);
  }

  boolean onGrid() {
    return !Double.isNaN(value);
  }
}

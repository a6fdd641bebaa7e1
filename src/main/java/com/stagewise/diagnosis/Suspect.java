package com.stagewise.diagnosis;

import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * One fault hypothesis in a suspect list.
 *
 * @param fault the fault id, e.g. {@code R2:open}
 * @param probability the posterior probability; sums to 1 over the list
 * @param consistent whether every reading lies within this fault's predicted spread
 * @param group the faults (this one included) that the readings so far cannot tell apart from it
 * @param why which readings it explains and which it does not, in plain words
 * @param estimatedValue for a drifted part, its estimated value (ohms or farads); for a low rail,
 *     its estimated volts; else empty
 * @param predicted the volts this fault predicts at every test point (its best-fitting scenario)
 * @param predictedAc the AC amplitude (peak volts) this fault predicts at every test point at the
 *     stage's test frequency, in the same scenario; empty when the stage has no AC input
 */
public record Suspect(
    String fault,
    double probability,
    boolean consistent,
    List<String> group,
    String why,
    OptionalDouble estimatedValue,
    Map<String, Double> predicted,
    Map<String, Double> predictedAc) {

  /** Copies the collections. */
  public Suspect {
    group = List.copyOf(group);
    predicted = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(predicted));
    predictedAc = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(predictedAc));
  }

  /** Returns a suspect with no AC predictions (a stage without an AC input). */
  public Suspect(
      String fault,
      double probability,
      boolean consistent,
      List<String> group,
      String why,
      OptionalDouble estimatedValue,
      Map<String, Double> predicted) {
    this(fault, probability, consistent, group, why, estimatedValue, predicted, Map.of());
  }
}

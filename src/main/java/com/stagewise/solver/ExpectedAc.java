package com.stagewise.solver;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Range;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;

/**
 * What a healthy stage reads in AC at each test point: the nominal amplitude of the test signal
 * there, as a peak in volts, and a healthy range from the parts' and rails' tolerances — the AC
 * counterpart of {@link ExpectedVolts}, by the same one-at-a-time corners, and each op-amp
 * section's open-loop gain at either end of its class's range. The app shows it on the cards of AC
 * readings, converted to the measure the reading is stated in.
 *
 * <p>The analysis is the solver's small-signal AC about each corner's operating point, at the
 * frequency of the stage's AC input ({@link StageSolver#ac}); a saturated output passes no AC. A
 * stage with another test frequency ({@link TestInput#withHz}) has its own expectation.
 *
 * @param hz the frequency of the test signal in hertz (0 when the stage has no AC input)
 * @param nominal peak volts at every net and used pin with nominal parts
 * @param low the lower end of the healthy range at each test point (peak volts, never below 0)
 * @param high the upper end of the healthy range at each test point (peak volts)
 * @param problem why there is no expectation (empty when there is one)
 */
public record ExpectedAc(
    double hz,
    Map<String, Double> nominal,
    Map<String, Double> low,
    Map<String, Double> high,
    String problem) {

  /** Keeps the maps unmodifiable. */
  public ExpectedAc {
    nominal = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(nominal));
    low = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(low));
    high = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(high));
  }

  /** Returns whether there is an expectation (the stage has an AC input and was solved). */
  public boolean solved() {
    return problem.isEmpty();
  }

  /** Returns the nominal peak volts at a test point, or NaN when unknown. */
  public double at(String testPoint) {
    return nominal.getOrDefault(testPoint, Double.NaN);
  }

  /** Returns the lower end of the healthy range at a test point (peak volts), or NaN. */
  public double low(String testPoint) {
    return low.getOrDefault(testPoint, Double.NaN);
  }

  /** Returns the upper end of the healthy range at a test point (peak volts), or NaN. */
  public double high(String testPoint) {
    return high.getOrDefault(testPoint, Double.NaN);
  }

  /**
   * Solves the stage and its tolerance corners at DC and then in AC. Slow for big stages: call off
   * the screen's thread.
   *
   * @return the nominal amplitudes and healthy ranges; when the stage has no AC input or cannot be
   *     solved, empty maps and the reason
   */
  public static ExpectedAc of(Stage stage) {
    double hz =
        stage.inputs().stream()
            .filter(TestInput::hasAc)
            .mapToDouble(TestInput::hz)
            .findFirst()
            .orElse(0);
    if (hz == 0) {
      return none(0, "the stage has no AC test input");
    }
    Optional<Map<String, Double>> nominal = amplitudes(stage, Conditions.NOMINAL);
    if (nominal.isEmpty()) {
      return none(hz, StageSolver.solve(stage).problem());
    }
    Map<String, Double> up = new LinkedHashMap<>();
    Map<String, Double> down = new LinkedHashMap<>();
    for (Stage corner : ExpectedVolts.corners(stage)) {
      spread(nominal.get(), amplitudes(corner, Conditions.NOMINAL), up, down);
    }
    // Each section's open-loop gain at either end of its class's range (DESIGN.md, the electrical
    // model), one section at a time like the parts: with a large noise gain, near a corner of the
    // feedback network, a low-gain part reads well below the nominal amplitude.
    for (Amplifier amp : stage.amplifiers()) {
      Range gain = amp.deviceClass().openLoopGain();
      for (double end : new double[] {gain.low(), gain.high()}) {
        Conditions conditions =
            Conditions.NOMINAL.withDevice(amp.ref(), Conditions.NOMINAL.device(amp).withGain(end));
        spread(nominal.get(), amplitudes(stage, conditions), up, down);
      }
    }
    Map<String, Double> low = new LinkedHashMap<>();
    Map<String, Double> high = new LinkedHashMap<>();
    for (Map.Entry<String, Double> e : nominal.get().entrySet()) {
      String key = e.getKey();
      low.put(key, Math.max(0, e.getValue() - down.getOrDefault(key, 0.0)));
      high.put(key, e.getValue() + up.getOrDefault(key, 0.0));
    }
    return new ExpectedAc(hz, nominal.get(), low, high, "");
  }

  /** Widens the rises and falls by how far one corner's amplitudes moved from the nominal ones. */
  private static void spread(
      Map<String, Double> nominal,
      Optional<Map<String, Double>> moved,
      Map<String, Double> up,
      Map<String, Double> down) {
    if (moved.isEmpty()) {
      return;
    }
    for (Map.Entry<String, Double> e : nominal.entrySet()) {
      Double v = moved.get().get(e.getKey());
      if (v == null || !Double.isFinite(v)) {
        continue;
      }
      double delta = v - e.getValue();
      if (delta > 0) {
        up.merge(e.getKey(), delta, Math::max);
      } else {
        down.merge(e.getKey(), -delta, Math::max);
      }
    }
  }

  private static ExpectedAc none(double hz, String why) {
    return new ExpectedAc(hz, Map.of(), Map.of(), Map.of(), why);
  }

  /** Returns the peak amplitude at every net and used pin, or empty when there is none. */
  private static Optional<Map<String, Double>> amplitudes(Stage stage, Conditions conditions) {
    if (!(StageSolver.solve(stage, conditions) instanceof SolveResult.Solved solved)) {
      return Optional.empty();
    }
    Optional<AcSolution> ac = StageSolver.ac(stage, conditions, solved.primary());
    if (ac.isEmpty()) {
      return Optional.empty();
    }
    Map<String, Double> at = new LinkedHashMap<>();
    ac.get().nets().forEach((net, phasor) -> at.put(net, phasor.amplitude()));
    stage
        .pinNets()
        .forEach(
            (pin, net) -> {
              Double v = at.get(net);
              if (v != null) {
                at.put(pin, v);
              }
            });
    return Optional.of(at);
  }
}

package com.stagewise.solver;

import com.stagewise.circuit.Stage;
import java.util.Collection;
import java.util.List;
import java.util.Optional;

/**
 * Says what every net and package pin of a stage should read: modified nodal analysis at DC with an
 * exact search for the saturation state of every op-amp section, and small-signal AC about the DC
 * point.
 *
 * <p>Each section is linear (its internal source equals gain times the differential input), clamped
 * high or clamped low; the limits follow the actual voltages at the section's own supply pins, so a
 * missing rail needs no special case. A consistent state is one where every linear section's source
 * lies within its limits and every clamped section's demand lies beyond the limit it is clamped at.
 * The search starts with every section linear and moves each inconsistent one towards the limit its
 * demand points at; where strong positive feedback is present (or the search cycles) every
 * combination of states is tried and the stable consistent ones are kept. See {@link Analysis} for
 * the fast form used by the diagnosis.
 */
public final class StageSolver {
  private StageSolver() {}

  /** The reason given when a solve gives voltages that are not finite numbers. */
  static final String NOT_FINITE =
      "the computed voltages are not finite numbers (expected part values, rails and inputs within"
          + " their plausible ranges)";

  /** Solves a stage with nominal parts and nominal device parameters. */
  public static SolveResult solve(Stage stage) {
    return solve(stage, Conditions.NOMINAL);
  }

  /**
   * Solves a stage at DC under the given conditions.
   *
   * @return every stable consistent operating point, or which nets float, or which section has no
   *     consistent state; never NaN voltages
   */
  public static SolveResult solve(Stage stage, Conditions conditions) {
    SolveResult result = Analysis.of(stage, conditions).solve();
    if (result instanceof SolveResult.Solved solved) {
      for (OperatingPoint point : solved.points()) {
        if (!allFinite(point.nets().values())) {
          // The edge of the result: a value the matrix could not hold never leaves the solver.
          return new SolveResult.NoConsistentState("", NOT_FINITE);
        }
      }
    }
    return result;
  }

  /**
   * Returns the small-signal AC response about an operating point, at the frequency of the first
   * test input that has an AC amplitude; empty when no input has one.
   *
   * <p>Inputs with AC at another frequency are taken as AC ground. A clamped output passes no AC
   * from its inputs; a dead output drives nothing.
   */
  public static Optional<AcSolution> ac(Stage stage, OperatingPoint point) {
    return ac(stage, Conditions.NOMINAL, point);
  }

  /** As {@link #ac(Stage, OperatingPoint)}, under the given conditions. */
  public static Optional<AcSolution> ac(Stage stage, Conditions conditions, OperatingPoint point) {
    Optional<AcSolution> ac = Analysis.of(stage, conditions).ac(point);
    // The edge of the result: no AC response rather than one that is not a number.
    if (ac.isPresent() && !allFinite(ac.get())) {
      return Optional.empty();
    }
    return ac;
  }

  // Plain loops rather than streams here: a fresh command-line JVM would load the stream classes
  // and
  // spin a class for each lambda just for these checks.

  private static boolean allFinite(Collection<Double> volts) {
    for (Double v : volts) {
      if (!Double.isFinite(v)) {
        return false;
      }
    }
    return true;
  }

  private static boolean allFinite(AcSolution ac) {
    for (Phasor p : ac.nets().values()) {
      if (!Double.isFinite(p.amplitude()) || !Double.isFinite(p.phaseDegrees())) {
        return false;
      }
    }
    return true;
  }

  /**
   * Returns every consistent operating point by trying every combination of section states, with no
   * stability filter. Exposed for cross-checks of the search; slow for many sections.
   */
  public static List<OperatingPoint> enumerateConsistent(Stage stage, Conditions conditions) {
    return Analysis.of(stage, conditions).enumerateConsistent();
  }
}

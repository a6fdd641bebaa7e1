package com.stagewise.solver;

import com.stagewise.circuit.Stage;
import java.util.List;
import java.util.Optional;

/**
 * A stage prepared once for many solves that differ only in numbers: the solver's face for work
 * such as tolerance spreads and fault grids. Nets, parts and sections are named as in the stage;
 * answers are the same values {@link StageSolver} gives ({@link SolveResult}, {@link
 * OperatingPoint}, {@link AcSolution}).
 *
 * <p>An analysis does not change once made: {@link #with} returns another one with changed numbers.
 * It is not safe for use by several threads at once (it keeps work space between solves).
 */
public sealed interface Analysis permits CompiledStage {

  /** Prepares a stage under the given conditions. */
  static Analysis of(Stage stage, Conditions conditions) {
    return CompiledStage.of(stage, conditions);
  }

  /** Returns the stage. */
  Stage stage();

  /** Returns the nets in the stage's order. */
  List<String> nets();

  /**
   * Solves at DC: every stable consistent operating point, or the floating nets, or which section
   * has no consistent state; never NaN voltages.
   */
  SolveResult solve();

  /**
   * Returns the consistent stable point that the saturation search settles in when it starts from
   * {@code near}'s section states (a point of this stage, perhaps before a change of numbers), or
   * empty when it does not settle from there (then {@link #solve}). Much cheaper than {@link
   * #solve} for stages with several stable states.
   */
  Optional<OperatingPoint> settleFrom(OperatingPoint near);

  /**
   * Returns the factorised system about an operating point, for cheap answers after one small
   * change of numbers; empty when the system is singular there.
   */
  Optional<Linearized> linearize(OperatingPoint point);

  /**
   * Returns the small-signal AC response about an operating point, at the frequency of the first
   * input that has an AC amplitude; empty when no input has AC or the system is singular.
   */
  Optional<AcSolution> ac(OperatingPoint point);

  /**
   * Returns every consistent operating point by trying every combination of section states, with no
   * stability filter. For cross-checks of the search; slow for many sections.
   */
  List<OperatingPoint> enumerateConsistent();

  /**
   * Returns this analysis with changed numbers.
   *
   * @throws IllegalArgumentException if a change names no part, driven net or section of the stage
   */
  Analysis with(Change... changes);

  /**
   * Returns the value of a part (ohms or farads; a zener's volts; 0 for a diode or LED); throws for
   * an unknown designator.
   */
  double partValue(String ref);

  /**
   * Returns a trimmer's wiper position (0 to 1), NaN for a part without a wiper; throws for an
   * unknown designator.
   */
  double partPosition(String ref);

  /** Returns the voltage of a driven net; throws if the net is not driven. */
  double drivenVolts(String net);

  /** Returns the device parameters of a section; throws for an unknown designator. */
  DeviceParams device(String section);

  /** Returns whether a fault forces the section's output (stuck or dead). */
  boolean isForced(String section);

  /** Returns whether the stage has a net of this name. */
  boolean hasNet(String net);

  /** Returns the AC analysis frequency (the first input with AC), or 0 when no input has AC. */
  double acHz();

  /**
   * Returns a reader of the given nets' values from this analysis's points, in the given order.
   *
   * @throws IllegalArgumentException if the stage has no such net
   */
  Probe probe(List<String> nets);

  /**
   * The factorised system of one operating point: answers after one small change of numbers,
   * reusing the factors.
   */
  interface Linearized {
    /**
     * Returns the operating point after the change, to first order (one step {@code x ← x + M⁻¹·(b′
     * − M′·x)} with the old factors), if every section keeps its state; empty when a section would
     * change state (then solve again).
     */
    Optional<OperatingPoint> step(Change change);

    /**
     * Returns the probe's nets' volts at the point {@link #step} gives (the same numbers, in the
     * probe's order), or null where {@code step} is empty: the cheap way to read a few nets after
     * many small changes. The probe must come from the analysis this was linearised from.
     */
    double[] stepRead(Change change, Probe probe);

    /**
     * Returns the point that {@code with(change).settleFrom(point)} gives, found with the kept
     * factors: for a change that moves only the right-hand side of the equations (a driven voltage;
     * a section's offset, bias currents or headroom) on a stage without junctions, the one step is
     * exact, and the point is returned when the search would keep every section in its state there.
     * Empty otherwise (then ask {@code settleFrom}).
     */
    Optional<OperatingPoint> settle(Change change);

    /**
     * Returns the point that {@code with(change).solve()} gives when that is one point with every
     * section in the state the saturation search starts from (linear, or as a fault forces it), and
     * this point is in those states too: found from the kept factors, by one step for a change of
     * the right-hand side (a driven voltage) and by the Sherman–Morrison formula for a resistor's
     * value (its conductance is a rank-one change of the matrix), with each section's stability
     * updated the same way. The numbers differ from a fresh solve's by rounding only. Empty
     * otherwise (a section would leave its state or become unstable, a junction, a trimmer, a
     * capacitor's value, a device change): then solve.
     */
    Optional<OperatingPoint> solveWith(Change change);

    /**
     * Returns the AC response about this point's section states with the change applied; empty as
     * {@link Analysis#ac}. A two-terminal part's value or a linear section's gain is a rank-one
     * update of the kept AC factors (Sherman–Morrison); other changes are solved in full.
     */
    Optional<AcSolution> ac(Change change);

    /**
     * Returns the AC response about this point with no change: the same numbers as {@link
     * Analysis#ac} of the point, from the AC factors that {@link #ac(Change)} keeps (made here if
     * not yet), so that the response and its changes share one factorisation.
     */
    Optional<AcSolution> ac();
  }
}

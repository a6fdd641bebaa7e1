package com.stagewise.solver;

import java.util.List;

/**
 * The outcome of a DC solve: one or more consistent operating points, a floating net, or no
 * consistent combination of section states.
 */
public sealed interface SolveResult
    permits SolveResult.Solved, SolveResult.Floating, SolveResult.NoConsistentState {

  /**
   * The stage has at least one consistent operating point.
   *
   * <p>Stages with negative feedback have exactly one. A stage with strong positive feedback (a
   * Schmitt trigger) may have two stable points; each is listed, the first being the one with the
   * first section high.
   *
   * @param points the stable, consistent operating points, never empty
   */
  record Solved(List<OperatingPoint> points) implements SolveResult {
    /** Copies the list and checks that it is not empty. */
    public Solved {
      points = List.copyOf(points);
      if (points.isEmpty()) {
        throw new IllegalArgumentException("a solved stage has at least one operating point");
      }
    }

    /** Returns the first operating point. */
    public OperatingPoint primary() {
      return points.get(0);
    }
  }

  /**
   * Some nets have no DC path to a driven net, so their voltage is not set by the circuit.
   *
   * @param nets the floating nets, in the stage's net order
   */
  record Floating(List<String> nets) implements SolveResult {
    /** Copies the list. */
    public Floating {
      nets = List.copyOf(nets);
    }
  }

  /**
   * No combination of linear and clamped outputs satisfies every section.
   *
   * @param section the designator of a section that could not be satisfied (may be empty)
   * @param reason what went wrong, in plain words
   */
  record NoConsistentState(String section, String reason) implements SolveResult {}
}

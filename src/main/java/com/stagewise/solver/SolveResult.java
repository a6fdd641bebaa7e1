package com.stagewise.solver;

import java.util.List;

/**
 * The outcome of a DC solve: one or more consistent operating points, a floating net, or no
 * consistent combination of section states.
 */
public sealed interface SolveResult
    permits SolveResult.Solved, SolveResult.Floating, SolveResult.NoConsistentState {

  /**
   * Returns why the stage could not be solved, in plain words and with what was expected: the one
   * message that the app and the command line both show. Empty when the stage was solved.
   */
  String problem();

  /**
   * Returns the field of the stage sheet the problem points at ({@code nets} or {@code
   * amplifiers}); empty when the stage was solved.
   */
  String field();

  /**
   * The stage has at least one consistent operating point.
   *
   * <p>Stages with negative feedback have exactly one. A stage with strong positive feedback (a
   * Schmitt trigger) may have two stable points; each is listed, the first being the one with the
   * first section high.
   *
   * @param points the stable, consistent operating points, never empty
   * @param notes what the search assumed, in plain words (empty when it tried everything)
   */
  record Solved(List<OperatingPoint> points, List<String> notes) implements SolveResult {
    /** Copies the lists and checks that there is a point. */
    public Solved {
      points = List.copyOf(points);
      notes = List.copyOf(notes);
      if (points.isEmpty()) {
        throw new IllegalArgumentException("a solved stage has at least one operating point");
      }
    }

    /** A solve that tried every state it had to: no notes. */
    public Solved(List<OperatingPoint> points) {
      this(points, List.of());
    }

    /** Returns the first operating point. */
    public OperatingPoint primary() {
      return points.get(0);
    }

    @Override
    public String problem() {
      return "";
    }

    @Override
    public String field() {
      return "";
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

    @Override
    public String problem() {
      return "no DC path sets the voltage of "
          + String.join(", ", nets)
          + " (expected a resistor or an output to tie it to ground, a rail or an input)";
    }

    @Override
    public String field() {
      return "nets";
    }
  }

  /**
   * No combination of linear and clamped outputs satisfies every section.
   *
   * @param section the designator of a section that could not be satisfied (may be empty)
   * @param reason what went wrong, in plain words
   */
  record NoConsistentState(String section, String reason) implements SolveResult {
    @Override
    public String problem() {
      return (section.isEmpty() ? "" : section + ": ") + "no consistent state: " + reason;
    }

    @Override
    public String field() {
      return "amplifiers";
    }
  }
}

package com.stagewise.solver;

import java.util.Optional;

/** A state's factorised system: one step of x ← x + M⁻¹·(b − M'·x) with the old factors. */
final class Linearization implements Analysis.Linearized {
  /** Chord steps allowed after a change of a stage with junctions before a full solve instead. */
  private static final int CHORD_STEPS = 40;

  /** Relative size of a chord step at which it has settled (volts per volt, plus 1 V). */
  private static final double CHORD_SETTLED = 1e-13;

  private final CompiledStage analysis;
  private final Network network;
  private final SectionState[] states;
  private final boolean[] collapsed;
  private final double[] x;
  private final DcSystem system;

  /** The AC factors about this point, made on the first AC question. */
  private AcUpdate acUpdate;

  /**
   * The one step with no change ({@code x + M⁻¹·(b − M·x)}, x refined once), made on the first
   * change that leaves the residual as it is: the step of every such change.
   */
  private double[] unmoved;

  /** The unknowns of the point linearised about, as it was given (before the solve refined it). */
  private final double[] given;

  Linearization(
      CompiledStage analysis,
      SectionState[] states,
      boolean[] collapsed,
      DcSystem system,
      double[] given) {
    this.analysis = analysis;
    this.network = analysis.network;
    this.states = states;
    this.collapsed = collapsed;
    this.x = system.x();
    this.system = system;
    this.given = given;
  }

  /** A section's parameters before the change being stepped (null for other changes). */
  private DeviceParams undone;

  @Override
  public Optional<OperatingPoint> step(Change change) {
    Change undo = apply(change);
    try {
      // Read while the change holds: a changed driven net reads its new volts.
      double[] moved = moved(change);
      return moved == null
          ? Optional.empty()
          : Optional.of(analysis.pointOf(analysis.search.stateOf(states, moved)));
    } finally {
      analysis.apply(undo);
    }
  }

  @Override
  public double[] stepRead(Change change, Probe probe) {
    Change undo = apply(change);
    try {
      double[] moved = moved(change);
      return moved == null ? null : probe.read(network, moved);
    } finally {
      analysis.apply(undo);
    }
  }

  /** Applies a change to the network, noting a section's parameters before it; returns the undo. */
  private Change apply(Change change) {
    Change undo = analysis.apply(change);
    undone = undo instanceof Change.Device d ? d.params() : null;
    return undo;
  }

  /**
   * The unknowns after one step with the change applied to the network, or null when a section
   * would change state.
   */
  private double[] moved(Change change) {
    double[] moved = stepFor(change);
    if (network.nonlinear && !chord(moved)) {
      return null;
    }
    for (int k = 0; k < states.length; k++) {
      if (network.sourceNode[k] >= 0 && network.collapsed(moved, k) != collapsed[k]) {
        return null;
      }
    }
    return analysis.search.isConsistent(states, moved) ? moved : null;
  }

  /**
   * The step for a change already applied: where the change leaves the residual as it was, the step
   * with no change (made once, then copied), else a fresh one.
   */
  private double[] stepFor(Change change) {
    if (keepsResidual(change)) {
      // The residual would be the same numbers as with no change, so would the step.
      if (unmoved == null) {
        unmoved = step();
      }
      return unmoved.clone();
    }
    return step();
  }

  /** One step {@code x + M⁻¹·(b − M·x)} with the numbers as the network holds them now. */
  private double[] step() {
    double[] dx = system.factors().solve(network.residual(states, collapsed, x));
    double[] moved = new double[x.length];
    for (int i = 0; i < x.length; i++) {
      moved[i] = x[i] + dx[i];
    }
    return moved;
  }

  /**
   * Whether a change of a section's parameters leaves the DC residual at x exactly as it is, so
   * that its step is the step with no change: the residual holds a section's bias currents and, by
   * its state, its gain and offset (linear), its upper headroom (clamped high) or lower headroom
   * (clamped low), none of them where its limits have collapsed or it is dead; its output
   * resistance always. The change is compared with the parameters the network held before it.
   */
  private boolean keepsResidual(Change change) {
    if (!(change instanceof Change.Device d) || network.nonlinear) {
      return false;
    }
    int k = -1;
    for (int i = 0; i < network.sections.length; i++) {
      if (network.sections[i].ref().equals(d.section())) {
        k = i;
        break;
      }
    }
    DeviceParams before = undone;
    DeviceParams after = d.params();
    if (k < 0
        || before == null
        || before.biasPlus() != after.biasPlus()
        || before.biasMinus() != after.biasMinus()
        || before.outputResistance() != after.outputResistance()) {
      return false;
    }
    if (network.sourceNode[k] < 0) {
      return true;
    }
    return switch (states[k]) {
      case LINEAR -> before.gain() == after.gain() && before.offset() == after.offset();
      case HIGH -> collapsed[k] || before.headroomHigh() == after.headroomHigh();
      case LOW -> collapsed[k] || before.headroomLow() == after.headroomLow();
      case DEAD -> true;
    };
  }

  /**
   * With junctions one step is not enough: a junction's current is exponential in its voltage, so a
   * change that moves a conducting junction (a rail under a clamp diode, a zener's own voltage) by
   * more than a few N·Vt makes the first step stop near N·Vt, far short (a zener drifted 0.15 V
   * moved its node 0.047 V). The step is repeated with the same factors (the chord method) until it
   * settles; the factors stay close to the Jacobian wherever the current stays close, which is what
   * a small change of a conducting junction does. Returns false when it does not settle within
   * {@link #CHORD_STEPS} steps (a junction turning on or off): the caller then solves in full.
   */
  private boolean chord(double[] moved) {
    for (int step = 0; step < CHORD_STEPS; step++) {
      double[] dx = system.factors().solve(network.residual(states, collapsed, moved));
      double largest = 0;
      for (int i = 0; i < moved.length; i++) {
        moved[i] += dx[i];
        largest = Math.max(largest, Math.abs(dx[i]) / (1 + Math.abs(moved[i])));
      }
      if (!(largest < Double.POSITIVE_INFINITY)) {
        return false;
      }
      if (largest < CHORD_SETTLED) {
        return true;
      }
    }
    return false;
  }

  @Override
  public Optional<OperatingPoint> settle(Change change) {
    if (network.nonlinear || !movesRightHandSideOnly(change)) {
      return Optional.empty();
    }
    Change undo = apply(change);
    try {
      // The matrix is the one factorised here, so one step is the exact solution with these
      // states, and each linear section's stability is as it was.
      double[] moved = stepFor(change);
      for (int k = 0; k < states.length; k++) {
        if (network.sourceNode[k] >= 0 && network.collapsed(moved, k) != collapsed[k]) {
          return Optional.empty();
        }
      }
      return analysis.search.keepsEveryState(states, moved, system)
          ? Optional.of(analysis.pointOf(analysis.search.stateOf(states, moved)))
          : Optional.empty();
    } finally {
      analysis.apply(undo);
    }
  }

  @Override
  public Optional<OperatingPoint> solveWith(Change change) {
    if (network.nonlinear || !inStartStates()) {
      return Optional.empty();
    }
    int i = -1;
    int j = -1;
    double delta = 0;
    if (change instanceof Change.PartValue v) {
      int p = analysis.partOrNone(v.ref());
      if (p < 0 || network.capacitor[p] || network.partW[p] >= 0 || network.junction[p] != null) {
        return Optional.empty();
      }
      // The resistor's stamp: conductance g between its two nets, a driven end on the right.
      delta = conductance(v.value()) - conductance(network.value[p]);
      i = network.unknownOf[network.partA[p]];
      j = network.unknownOf[network.partB[p]];
    } else if (!(change instanceof Change.DrivenVolts)) {
      return Optional.empty();
    }
    Change undo = apply(change);
    try {
      // The exact solution is x + M'⁻¹·r' with r' the residual at x after the change. With M' =
      // M + δ·u·uᵀ (u = e_i − e_j), M'⁻¹·r' = y − z·δ·(uᵀy)/(1 + δ·uᵀz), y = M⁻¹·r', z = M⁻¹·u
      // (Sherman and Morrison, 1950; Golub and Van Loan, Matrix Computations, 2.1.4).
      double[] y = system.factors().solve(network.residual(states, collapsed, x));
      double[] z = null;
      double denominator = 1;
      if (delta != 0) {
        double[] u = new double[x.length];
        if (i >= 0) {
          u[i] = 1;
        }
        if (j >= 0) {
          u[j] -= 1;
        }
        z = system.factors().solve(u);
        double product = delta * (at(z, i) - at(z, j));
        denominator = 1 + product;
        if (!(Math.abs(denominator) >= CANCELLATION * (1 + Math.abs(product)))) {
          return Optional.empty();
        }
        double scale = delta * (at(y, i) - at(y, j)) / denominator;
        double terms = 0;
        double result = 0;
        for (int k = 0; k < y.length; k++) {
          double correction = scale * z[k];
          terms = Math.max(terms, Math.abs(y[k]) + Math.abs(correction));
          y[k] -= correction;
          result = Math.max(result, Math.abs(y[k]));
        }
        // A large change (a resistor near short or open) makes y and the correction nearly
        // cancel: beyond GROWTH the update would lose more digits than a fresh solve.
        if (!(terms <= GROWTH * result)) {
          return Optional.empty();
        }
      }
      double[] moved = new double[x.length];
      for (int k = 0; k < x.length; k++) {
        moved[k] = x[k] + y[k];
      }
      for (int k = 0; k < states.length; k++) {
        if (network.sourceNode[k] >= 0 && network.collapsed(moved, k) != collapsed[k]) {
          return Optional.empty();
        }
        if (network.forced[k] == null && !stableAfter(k, z, delta, denominator, i, j)) {
          return Optional.empty();
        }
      }
      return analysis.search.keepsStates(states, moved)
          ? Optional.of(analysis.pointOf(analysis.search.stateOf(states, moved)))
          : Optional.empty();
    } finally {
      analysis.apply(undo);
    }
  }

  /**
   * A denominator {@code 1 + δ·uᵀz} smaller than this share of its terms means the changed matrix
   * is (nearly) singular, where the update loses its digits: a full solve decides (as {@link
   * AcUpdate} does for AC).
   */
  private static final double CANCELLATION = 1e-8;

  /** Largest ratio of the update's terms to its result (one digit lost per decade). */
  private static final double GROWTH = 100;

  /** Columns of M⁻¹ at each section's source node, found on first need (null: not yet). */
  private double[][] sourceColumns;

  /**
   * Whether section k's linear state is stable after the rank-one change: entry (s, s) of the
   * changed inverse, s the section's source node, is {@code (M⁻¹)ss − δ·z_s·(uᵀM⁻¹)_s / (1 +
   * δ·uᵀz)} and must stay positive, as {@link DcSystem#stable} asks of a fresh solve.
   */
  private boolean stableAfter(int k, double[] z, double delta, double denominator, int i, int j) {
    int s = network.sourceNode[k];
    if (s < 0) {
      return true;
    }
    double diagonal = system.factors().inverseDiagonal(s);
    if (z == null) {
      return diagonal > 0;
    }
    if (sourceColumns == null) {
      sourceColumns = new double[states.length][];
    }
    if (sourceColumns[k] == null) {
      double[] unit = new double[x.length];
      unit[s] = 1;
      sourceColumns[k] = system.factors().solve(unit);
    }
    double[] column = sourceColumns[k];
    return diagonal - delta * z[s] * (at(column, i) - at(column, j)) / denominator > 0;
  }

  /** Whether every free section is in the state the search starts from: linear. */
  private boolean inStartStates() {
    for (int k = 0; k < states.length; k++) {
      if (network.forced[k] == null && states[k] != SectionState.LINEAR) {
        return false;
      }
    }
    return true;
  }

  private static double conductance(double ohms) {
    return 1 / Math.max(ohms, Network.MIN_OHMS);
  }

  private static double at(double[] vector, int index) {
    return index < 0 ? 0 : vector[index];
  }

  /**
   * Whether a change moves only the right-hand side of the DC equations: a driven voltage, or a
   * section's offset, bias currents or headroom (its gain and output resistance are in the matrix).
   */
  private boolean movesRightHandSideOnly(Change change) {
    if (change instanceof Change.DrivenVolts) {
      return true;
    }
    if (change instanceof Change.Device d) {
      DeviceParams now = analysis.device(d.section());
      return d.params().gain() == now.gain()
          && d.params().outputResistance() == now.outputResistance();
    }
    return false;
  }

  @Override
  public Optional<AcSolution> ac() {
    if (network.acHz == 0) {
      return Optional.empty();
    }
    if (network.nonlinear) {
      // A junction's small-signal conductance is taken at the DC volts, and the kept factors are
      // about the refined ones: the point's own volts answer, as Analysis.ac does.
      return analysis.acAbout(states, collapsed, given);
    }
    // Without junctions the AC system does not depend on the DC volts, only on the states: the
    // kept factors' response is the full solve's, pivot for pivot and sum for sum.
    AcUpdate update = acUpdate();
    return update == null
        ? analysis.acAbout(states, collapsed, given)
        : analysis.acSolution(update.unchanged());
  }

  private AcUpdate acUpdate() {
    if (acUpdate == null) {
      acUpdate = AcUpdate.of(network, states, collapsed, x);
    }
    return acUpdate;
  }

  @Override
  public Optional<AcSolution> ac(Change change) {
    if (network.acHz == 0) {
      return Optional.empty();
    }
    acUpdate();
    double[][] updated = acUpdate == null ? null : acUpdate.solve(change);
    if (updated != null) {
      return analysis.acSolution(updated);
    }
    Change undo = analysis.apply(change);
    try {
      return analysis.acAbout(states, collapsed, x);
    } finally {
      analysis.apply(undo);
    }
  }
}

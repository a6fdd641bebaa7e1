package com.stagewise.diagnosis;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.solver.AcSolution;
import com.stagewise.solver.Analysis;
import com.stagewise.solver.Change;
import com.stagewise.solver.DeviceParams;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.Probe;
import com.stagewise.solver.SectionState;
import com.stagewise.solver.SolveResult;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Predicts what every test point reads under one scenario, with its spread.
 *
 * <p>The method is a mix of corners and sensitivities. Corners first: each section's input offset
 * is set to both ends of its class's range; where that flips a section between linear and a limit
 * (an open loop whose sign only the offset decides), the scenario splits into both outcomes. Then
 * sensitivities about each outcome's operating point: every uncertain parameter (part values within
 * tolerance, rails within tolerance, offset, bias current, headroom and gain within the class's
 * ranges) is moved by one standard deviation and the solve repeated; the changes add in quadrature.
 * A move that crosses a limit shows up as a large change, which widens the spread where a reading
 * sits near a saturation edge: the honest answer there. The stage is compiled once per scenario and
 * only numbers change between the solves.
 */
final class Predictor {
  private final TestPoints points;
  private final double span;

  /** Pin maps by list of sections; shared by the threads that predict the hypotheses. */
  private final Map<List<Amplifier>, Map<String, String>> pinCache =
      new java.util.IdentityHashMap<>();

  Predictor(TestPoints points, Stage base) {
    this.points = points;
    double max = 1;
    for (Rail rail : base.rails()) {
      max = Math.max(max, Math.abs(rail.volts()));
    }
    this.span = max;
  }

  /** As {@link #predict(Scenario, boolean, ScenarioCompiler)}, the scenario compiled on its own. */
  List<Prediction> predict(Scenario scenario, boolean withSpread) {
    return predict(scenario, withSpread, new ScenarioCompiler());
  }

  /**
   * Returns the predictions of a scenario: one, or two where the outcome splits.
   *
   * @param withSpread whether to compute the spread (false leaves it zero, for grid points whose
   *     spread is borrowed from a neighbour)
   * @param compiler the compiler of this fault's scenarios (one per thread), also the lock under
   *     which the predictions' AC parts are worked out when first asked for
   */
  List<Prediction> predict(Scenario scenario, boolean withSpread, ScenarioCompiler compiler) {
    Stage stage = scenario.stage();
    Analysis cs = compiler.compile(scenario);
    // Which net each test point reads depends only on the compiled stage's nets and sections,
    // which the scenarios derived from one compilation share.
    Reader reader;
    if (compiler.attachment() instanceof Reader kept) {
      reader = kept;
    } else {
      reader = reader(stage, cs);
      compiler.attach(reader);
    }
    if (Perturbation.drifting(stage)) {
      // A floating input tied to a rail stands for its bias current's drift; the current itself,
      // pushed through the tie, would move the node by hundreds of volts.
      List<Change> noBias = new ArrayList<>();
      for (Amplifier amp : stage.amplifiers()) {
        noBias.add(new Change.Device(amp.ref(), cs.device(amp.ref()).withBias(0, 0)));
      }
      cs = cs.with(noBias.toArray(new Change[0]));
    }
    SolveResult outcome = solve(scenario, cs, compiler);
    if (!(outcome instanceof SolveResult.Solved settled)) {
      return List.of(unpredictable(scenario));
    }
    List<Outcome> outcomes = new ArrayList<>();
    if (settled.points().size() > 1) {
      for (OperatingPoint state : settled.points()) {
        outcomes.add(
            new Outcome(
                state,
                null,
                0,
                scenario.weight() / settled.points().size(),
                "settles " + describe(state),
                null));
      }
    } else if (withSpread || !scenario.onGrid()) {
      outcomes.addAll(offsetCorners(stage, cs, settled.primary(), scenario.weight()));
    } else {
      outcomes.add(new Outcome(settled.primary(), null, 0, scenario.weight(), "", null));
    }
    boolean ac = cs.acHz() > 0;
    List<Perturbation> perturbations = withSpread ? Perturbation.all(stage, cs) : List.of();
    List<Prediction> predictions = new ArrayList<>();
    for (Outcome o : outcomes) {
      Analysis at =
          o.section == null
              ? cs
              : cs.with(new Change.Device(o.section, cs.device(o.section).withOffset(o.offset)));
      double[] dcMean = reader.dc(o.point);
      // The nominal outcome's factors were made for its offset corners already: the same ones.
      Analysis.Linearized linear =
          perturbations.isEmpty()
              ? null
              : o.linear != null ? o.linear : at.linearize(o.point).orElse(null);
      double[] dcVar = new double[points.size];
      // The AC steps in the perturbations' order: the AC part is worked out from them on first
      // need (the ranking without AC readings never asks), with the calls the eager loop made.
      List<AcStep> acSteps = new ArrayList<>();
      for (Perturbation p : perturbations) {
        Change change = p.change(at);
        double[] read = linear == null ? null : linear.stepRead(change, reader.probe);
        if (read != null) {
          reader.addSquares(dcVar, read, dcMean);
          // Only part values and gain move the small-signal response of a settled state.
          if (ac && p.movesAc()) {
            acSteps.add(new AcStep(change, null, null));
          }
          continue;
        }
        // A section changes state within one standard deviation: search again from this state,
        // and solve in full only if that does not settle.
        Analysis moved = at.with(change);
        OperatingPoint near = moved.settleFrom(o.point).orElse(null);
        if (near == null) {
          near = moved.solve() instanceof SolveResult.Solved m ? matching(m, o.point) : null;
        }
        if (near != null) {
          addSquares(dcVar, reader.dc(near), dcMean);
          if (ac && p.movesAc()) {
            acSteps.add(new AcStep(null, moved, near));
          }
        }
      }
      OperatingPoint point = o.point;
      AcPart acPart =
          ac ? AcPart.later(compiler, new AcWork(reader, at, linear, point, acSteps)) : null;
      predictions.add(
          new Prediction(
              o.weight,
              dcMean,
              sqrt(dcVar),
              acPart,
              scenario.value(),
              join(scenario.label(), o.label),
              o.point.states()));
    }
    return predictions;
  }

  /**
   * Solves a scenario. A point of a grid (one number changed from the grid's other points) is found
   * from the last grid point that settled with every section linear, where it settles so too (the
   * usual case along a drift): a rank-one update of that point's factors instead of a fresh search
   * ({@link Analysis.Linearized#solveWith}). Every other case is solved in full, and a grid point
   * that settles that way with every section linear becomes the next ones' anchor.
   */
  private static SolveResult solve(Scenario scenario, Analysis cs, ScenarioCompiler compiler) {
    if (!scenario.onGrid()) {
      return cs.solve();
    }
    OperatingPoint quick = compiler.solveFromAnchor();
    if (quick != null) {
      return new SolveResult.Solved(List.of(quick), List.of());
    }
    SolveResult outcome = cs.solve();
    if (outcome instanceof SolveResult.Solved solved
        && solved.points().size() == 1
        && solved.notes().isEmpty()
        && inStartStates(cs, solved.primary())) {
      Analysis.Linearized anchor = cs.linearize(solved.primary()).orElse(null);
      if (anchor != null) {
        compiler.anchor(anchor);
      }
    }
    return outcome;
  }

  /** Whether every section of a point is linear, or as the scenario's fault forces it. */
  private static boolean inStartStates(Analysis cs, OperatingPoint point) {
    for (Map.Entry<String, SectionState> e : point.states().entrySet()) {
      if (e.getValue() != SectionState.LINEAR && !cs.isForced(e.getKey())) {
        return false;
      }
    }
    return true;
  }

  /** An outcome's AC part, worked out on first need (see {@link #ac}). */
  private final class AcWork implements AcPart.Source {
    private final Reader reader;
    private final Analysis at;
    private final Analysis.Linearized linear;
    private final OperatingPoint point;
    private final List<AcStep> steps;

    AcWork(
        Reader reader,
        Analysis at,
        Analysis.Linearized linear,
        OperatingPoint point,
        List<AcStep> steps) {
      this.reader = reader;
      this.at = at;
      this.linear = linear;
      this.point = point;
      this.steps = steps;
    }

    @Override
    public double[][] work() {
      return ac(reader, at, linear, point, steps);
    }
  }

  /**
   * The AC mean and spread ({@code {mean, sd}}) of an outcome: the response about its point (from
   * the linearised point's AC factors where there are some) and each step's change in quadrature.
   */
  private double[][] ac(
      Reader reader,
      Analysis at,
      Analysis.Linearized linear,
      OperatingPoint point,
      List<AcStep> steps) {
    double[] acMean = reader.ac(linear == null ? at.ac(point) : linear.ac());
    double[] acVar = new double[points.size];
    for (AcStep step : steps) {
      Optional<AcSolution> moved =
          step.moved == null ? linear.ac(step.change) : step.moved.ac(step.near);
      addSquares(acVar, reader.ac(moved), acMean);
    }
    return new double[][] {acMean, sqrt(acVar)};
  }

  /**
   * One perturbation's AC change: a change answered with the linearised point's AC factors, or a
   * changed analysis and the point it settled in (change null).
   */
  private record AcStep(Change change, Analysis moved, OperatingPoint near) {}

  /**
   * One outcome of a scenario: a settled point, the section whose offset was set to reach it (null
   * when none), and the point's factorised system where one was made for it (else null).
   */
  private record Outcome(
      OperatingPoint point,
      String section,
      double offset,
      double weight,
      String label,
      Analysis.Linearized linear) {}

  /** Reads the test points from a scenario's points; a net the fault removed reads 0 V. */
  private final class Reader {
    private final Probe probe;
    private final int[] slot;

    Reader(Probe probe, int[] slot) {
      this.probe = probe;
      this.slot = slot;
    }

    double[] dc(OperatingPoint point) {
      return spread(probe.dc(point));
    }

    double[] ac(Optional<AcSolution> response) {
      return response.isPresent()
          ? spread(probe.acAmplitudes(response.get()))
          : new double[points.size];
    }

    /**
     * Adds to {@code sum}, per test point, the square of what {@code spread(read)} reads there less
     * {@code base}: the same numbers without the array between.
     */
    void addSquares(double[] sum, double[] read, double[] base) {
      for (int i = 0; i < sum.length; i++) {
        double d = (slot[i] < 0 ? 0 : read[slot[i]]) - base[i];
        sum[i] += d * d;
      }
    }

    double[] spread(double[] read) {
      double[] values = new double[points.size];
      for (int i = 0; i < points.size; i++) {
        // A net that the fault took every part away from reads like a bare pad: about 0 V.
        values[i] = slot[i] < 0 ? 0 : read[slot[i]];
      }
      return values;
    }
  }

  /** Maps each test point to the scenario's net (a lifted pin reads its own net). */
  private Reader reader(Stage stage, Analysis cs) {
    // Scenarios of one fault share their sections (a drift grid changes only a value), so the pin
    // map is kept per list of sections.
    Map<String, String> pins;
    synchronized (pinCache) {
      pins = pinCache.get(stage.amplifiers());
      if (pins == null) {
        pins = stage.pinNets();
        pinCache.put(stage.amplifiers(), pins);
      }
    }
    List<String> nets = new ArrayList<>();
    Map<String, Integer> seen = new HashMap<>();
    int[] slot = new int[points.size];
    for (int i = 0; i < points.size; i++) {
      String name = points.names.get(i);
      String net = points.isPin(i) ? pins.getOrDefault(name, points.netOf.get(i)) : name;
      if (!cs.hasNet(net)) {
        slot[i] = -1;
        continue;
      }
      Integer known = seen.get(net);
      if (known == null) {
        known = nets.size();
        nets.add(net);
        seen.put(net, known);
      }
      slot[i] = known;
    }
    return new Reader(cs.probe(nets), slot);
  }

  private List<Outcome> offsetCorners(
      Stage stage, Analysis cs, OperatingPoint nominal, double weight) {
    // An offset moves only the right-hand side, so the nominal factors tell cheaply whether both
    // corners keep every state (the usual case); only a corner that moves a state is searched.
    Analysis.Linearized linear = cs.linearize(nominal).orElse(null);
    for (Amplifier amp : stage.amplifiers()) {
      String ref = amp.ref();
      if (cs.isForced(ref)) {
        continue;
      }
      DeviceParams params = cs.device(ref);
      double max = amp.deviceClass().offset().high();
      Change upChange = new Change.Device(ref, params.withOffset(params.offset() + max));
      Change downChange = new Change.Device(ref, params.withOffset(params.offset() - max));
      if (linear != null
          && linear.settle(upChange).isPresent()
          && linear.settle(downChange).isPresent()) {
        // Both corners settle in the nominal states: no split at this section.
        continue;
      }
      OperatingPoint up = near(cs.with(upChange), nominal);
      OperatingPoint down = near(cs.with(downChange), nominal);
      if (up == null || down == null) {
        continue;
      }
      SectionState now = nominal.states().get(ref);
      SectionState upState = up.states().get(ref);
      SectionState downState = down.states().get(ref);
      if (upState != downState && (upState != now || downState != now)) {
        return List.of(
            new Outcome(up, ref, params.offset() + max, weight / 2, ref + " offset positive", null),
            new Outcome(
                down, ref, params.offset() - max, weight / 2, ref + " offset negative", null));
      }
    }
    return List.of(new Outcome(nominal, null, 0, weight, "", linear));
  }

  /** The point the stage settles in from {@code from}'s states, else its first point, else null. */
  private static OperatingPoint near(Analysis cs, OperatingPoint from) {
    Optional<OperatingPoint> state = cs.settleFrom(from);
    if (state.isPresent()) {
      return state.get();
    }
    return cs.solve() instanceof SolveResult.Solved s ? s.primary() : null;
  }

  private static OperatingPoint matching(SolveResult.Solved settled, OperatingPoint target) {
    for (OperatingPoint point : settled.points()) {
      if (point.states().equals(target.states())) {
        return point;
      }
    }
    return settled.primary();
  }

  private Prediction unpredictable(Scenario scenario) {
    // No consistent state (e.g. the fault makes the stage oscillate): any reading within the rails.
    double[] mean = new double[points.size];
    double[] sd = new double[points.size];
    Arrays.fill(sd, span);
    return new Prediction(
        scenario.weight(),
        mean,
        sd,
        AcPart.of(mean.clone(), sd.clone()),
        scenario.value(),
        join(scenario.label(), "no steady state"),
        Map.of());
  }

  private static String describe(OperatingPoint point) {
    List<String> parts = new ArrayList<>();
    for (Map.Entry<String, SectionState> e : point.states().entrySet()) {
      parts.add(e.getKey() + " " + e.getValue().word());
    }
    return String.join(", ", parts);
  }

  private static void addSquares(double[] sum, double[] moved, double[] base) {
    for (int i = 0; i < sum.length; i++) {
      double d = moved[i] - base[i];
      sum[i] += d * d;
    }
  }

  private static double[] sqrt(double[] values) {
    double[] out = new double[values.length];
    for (int i = 0; i < values.length; i++) {
      out[i] = Math.sqrt(values[i]);
    }
    return out;
  }

  private static String join(String a, String b) {
    if (a.isEmpty()) {
      return b;
    }
    return b.isEmpty() ? a : a + ", " + b;
  }
}

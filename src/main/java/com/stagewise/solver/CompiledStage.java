package com.stagewise.solver;

import com.stagewise.circuit.Stage;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The {@link Analysis} of a stage: the stage compiled once into index arrays ({@link Network}),
 * with the saturation search ({@link SaturationSearch}) and the factorised re-solves ({@link
 * Linearization}). Everything index-based stays in the solver; callers see names and the solver's
 * values.
 */
final class CompiledStage implements Analysis {
  final Network network;
  final SaturationSearch search;
  private final Layout layout;
  private final Map<String, Integer> partIndex;

  private CompiledStage(Network network, Layout layout, Map<String, Integer> partIndex) {
    this.network = network;
    this.search = new SaturationSearch(network);
    this.layout = layout;
    this.partIndex = partIndex;
  }

  /** Compiles a stage under the given conditions. */
  static CompiledStage of(Stage stage, Conditions conditions) {
    Network network = new Network(stage, conditions);
    String[] refs = new String[network.sections.length];
    for (int k = 0; k < refs.length; k++) {
      refs[k] = network.sections[k].ref();
    }
    Map<String, Integer> parts = new HashMap<>(network.partRefs.length * 2);
    for (int p = 0; p < network.partRefs.length; p++) {
      parts.put(network.partRefs[p], p);
    }
    return new CompiledStage(network, new Layout(stage, network.nets, refs), parts);
  }

  // ---------------------------------------------------------------- the face

  @Override
  public Stage stage() {
    return network.stage;
  }

  @Override
  public List<String> nets() {
    return List.of(network.nets);
  }

  @Override
  public SolveResult solve() {
    SaturationSearch.Outcome outcome = search.solveStates();
    if (outcome instanceof SaturationSearch.Floats f) {
      return new SolveResult.Floating(f.nets());
    }
    if (outcome instanceof SaturationSearch.Unsettled u) {
      return new SolveResult.NoConsistentState(u.section(), u.reason());
    }
    List<OperatingPoint> points = new ArrayList<>();
    SaturationSearch.Settled settled = (SaturationSearch.Settled) outcome;
    for (SaturationSearch.State state : settled.states()) {
      points.add(pointOf(state));
    }
    return new SolveResult.Solved(points, settled.notes());
  }

  @Override
  public Optional<OperatingPoint> settleFrom(OperatingPoint near) {
    SaturationSearch.State state = search.solveNear(statesOf(near), vectorOf(near));
    return state == null ? Optional.empty() : Optional.of(pointOf(state));
  }

  @Override
  public Optional<Linearized> linearize(OperatingPoint point) {
    SectionState[] states = statesOf(point);
    double[] x = vectorOf(point);
    boolean[] collapsed = collapsedAt(x);
    // The search has usually just solved this very system (the point is its answer): a linear
    // stage's system depends only on the states, the clamp rows and the numbers, so that one is
    // taken, the same factors and unknowns a fresh solve would give to the last bit.
    DcSystem system = network.nonlinear ? null : search.solvedAlready(states, collapsed);
    if (system == null) {
      system = network.solveDc(states, collapsed, x);
    }
    return system == null
        ? Optional.empty()
        : Optional.of(new Linearization(this, states.clone(), collapsed, system, x));
  }

  @Override
  public Optional<AcSolution> ac(OperatingPoint point) {
    if (network.acHz == 0) {
      return Optional.empty();
    }
    double[] x = vectorOf(point);
    return acAbout(statesOf(point), collapsedAt(x), x);
  }

  @Override
  public List<OperatingPoint> enumerateConsistent() {
    List<OperatingPoint> found = new ArrayList<>();
    for (SaturationSearch.State state : search.enumerateConsistent()) {
      found.add(pointOf(state));
    }
    return found;
  }

  @Override
  public CompiledStage with(Change... changes) {
    Network copy = network.copyNumbers();
    CompiledStage changed = new CompiledStage(copy, layout, partIndex);
    for (Change change : changes) {
      changed.apply(change);
    }
    return changed;
  }

  @Override
  public double partValue(String ref) {
    return network.value[part(ref)];
  }

  @Override
  public double partPosition(String ref) {
    return network.position[part(ref)];
  }

  @Override
  public double drivenVolts(String net) {
    int i = drivenNet(net);
    return network.driven[i];
  }

  @Override
  public DeviceParams device(String section) {
    return network.params[section(section)];
  }

  @Override
  public boolean isForced(String section) {
    return network.forced[section(section)] != null;
  }

  @Override
  public boolean hasNet(String net) {
    return layout.netIndex.containsKey(net);
  }

  @Override
  public double acHz() {
    return network.acHz;
  }

  @Override
  public Probe probe(List<String> nets) {
    return new Probe(layout, nets);
  }

  // ---------------------------------------------------------------- changes of numbers

  /** The index of a part, or -1 when the stage has no part of this designator. */
  int partOrNone(String ref) {
    Integer p = partIndex.get(ref);
    return p == null ? -1 : p;
  }

  private int part(String ref) {
    Integer p = partIndex.get(ref);
    if (p == null) {
      throw new IllegalArgumentException("the stage has no part " + ref);
    }
    return p;
  }

  private int section(String ref) {
    Integer k = layout.sectionIndex.get(ref);
    if (k == null) {
      throw new IllegalArgumentException("the stage has no section " + ref);
    }
    return k;
  }

  private int drivenNet(String net) {
    Integer i = layout.netIndex.get(net);
    if (i == null || network.unknownOf[i] >= 0) {
      throw new IllegalArgumentException(net + " is not a driven net of the stage");
    }
    return i;
  }

  /** Applies a change to this analysis's own numbers; returns what undoes it. */
  Change apply(Change change) {
    network.changes++;
    if (change instanceof Change.PartValue v) {
      int p = part(v.ref());
      double old = network.value[p];
      network.setValue(p, v.value());
      return new Change.PartValue(v.ref(), old);
    }
    if (change instanceof Change.WiperPosition w) {
      int p = part(w.ref());
      if (network.partW[p] < 0) {
        throw new IllegalArgumentException(w.ref() + " is not a trimmer: it has no wiper position");
      }
      double old = network.position[p];
      network.position[p] = w.position();
      return new Change.WiperPosition(w.ref(), old);
    }
    if (change instanceof Change.DrivenVolts d) {
      int i = drivenNet(d.net());
      double old = network.driven[i];
      network.driven[i] = d.volts();
      return new Change.DrivenVolts(d.net(), old);
    }
    Change.Device d = (Change.Device) change;
    int k = section(d.section());
    DeviceParams old = network.params[k];
    network.params[k] = d.params();
    return new Change.Device(d.section(), old);
  }

  // ---------------------------------------------------------------- points and index form

  OperatingPoint pointOf(SaturationSearch.State state) {
    return layout.point(state.volts(), state.states());
  }

  private SectionState[] statesOf(OperatingPoint point) {
    if (point.states() instanceof Layout.States s && s.layout == layout) {
      return s.states;
    }
    SectionState[] states = new SectionState[layout.sections.length];
    for (int k = 0; k < states.length; k++) {
      states[k] = point.states().get(layout.sections[k]);
      if (states[k] == null) {
        throw new IllegalArgumentException("the point has no state for " + layout.sections[k]);
      }
    }
    return states;
  }

  private double[] voltsOf(OperatingPoint point) {
    if (point.nets() instanceof Layout.NetVolts v && v.layout == layout) {
      return v.volts;
    }
    double[] volts = new double[layout.nets.length];
    for (int i = 0; i < volts.length; i++) {
      Double v = point.nets().get(layout.nets[i]);
      if (v == null) {
        throw new IllegalArgumentException("the point has no voltage for " + layout.nets[i]);
      }
      volts[i] = v;
    }
    return volts;
  }

  private double[] vectorOf(OperatingPoint point) {
    double[] volts = voltsOf(point);
    double[] x = new double[network.size];
    for (int i = 0; i < network.nets.length; i++) {
      int u = network.unknownOf[i];
      if (u >= 0) {
        x[u] = volts[i];
      }
    }
    // The internal sources follow from the nets: re-solving with the states gives them, and the
    // collapsed test reads only nets, so they are left at 0 here. A junction's inner node (behind
    // its series resistance) follows from the voltage across the part.
    network.fillInner(x);
    return x;
  }

  private boolean[] collapsedAt(double[] x) {
    int n = network.sections.length;
    boolean[] collapsed = new boolean[n];
    for (int k = 0; k < n; k++) {
      collapsed[k] = network.sourceNode[k] >= 0 && network.collapsed(x, k);
    }
    return collapsed;
  }

  Optional<AcSolution> acAbout(SectionState[] states, boolean[] collapsed, double[] dc) {
    return acSolution(network.solveAc(states, collapsed, dc));
  }

  /** The AC response from the unknowns' phasors {@code {re, im}}; empty for null (singular). */
  Optional<AcSolution> acSolution(double[][] solution) {
    if (solution == null) {
      return Optional.empty();
    }
    int nets = network.nets.length;
    double[] amplitude = new double[nets];
    double[] phase = new double[nets];
    for (int i = 0; i < nets; i++) {
      int u = network.unknownOf[i];
      if (u >= 0) {
        Phasor p = Phasor.of(solution[0][u], solution[1][u]);
        amplitude[i] = p.amplitude();
        phase[i] = p.phaseDegrees();
      } else {
        amplitude[i] = network.acSource[i];
      }
    }
    return Optional.of(new AcSolution(network.acHz, new Layout.Phasors(layout, amplitude, phase)));
  }
}

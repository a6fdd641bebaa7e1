package com.stagewise.solver;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * A stage compiled for modified nodal analysis: nets, parts and sections as index arrays, with the
 * numbers (part values, driven voltages, device parameters) held apart so that they can be changed
 * and the stage solved again without compiling it anew.
 *
 * <p>Unknowns are the voltages of the undriven nets, then one internal source node per section that
 * drives (not dead). Each section's internal node connects to its output net through the output
 * resistance; its row holds the section's equation for its current state instead of a current
 * balance (the source's current is then whatever the balance at the output needs).
 */
final class Network {
  /**
   * Resistances below this are modelled at this value: a 0 Ω link or a dead short. 1 mΩ keeps the
   * matrix well conditioned against megohm parts and moves a node by microvolts at most.
   */
  static final double MIN_OHMS = 1e-3;

  final Stage stage;
  final String[] nets;

  /** Per net: its index among the unknowns, or -1 for a driven net. */
  final int[] unknownOf;

  /** Per net: the volts of a driven net, NaN for an undriven one. */
  final double[] driven;

  final String[] partRefs;
  final int[] partA;
  final int[] partB;
  final boolean[] capacitor;
  final double[] value;

  /** Per part: the wiper's net of a trimmer, else -1. */
  final int[] partW;

  /** Per part: a trimmer's wiper position (0 to 1), else NaN. */
  final double[] position;

  /** Per part: the junction of a diode, zener or LED, else null. */
  final Junction[] junction;

  /** Per part: the part as the stage has it (for a zener's figures after a change of value). */
  final Part[] model;

  /**
   * Per part: the unknown of a junction's inner node (between its series resistance and the
   * junction itself), or -1.
   */
  final int[] inner;

  /** Whether any part is a junction: the DC system is then solved by Newton's method. */
  final boolean nonlinear;

  /** The junction that kept the last failed Newton iteration from settling, or "". */
  String newtonFailure = "";

  /**
   * Counts the changes of this network's numbers ({@link CompiledStage#apply}): a system solved at
   * one count is the system of the same states at the same count.
   */
  int changes;

  final Amplifier[] sections;
  final int[] inPlus;
  final int[] inMinus;
  final int[] out;
  final int[] vPlus;
  final int[] vMinus;
  final DeviceParams[] params;
  final SectionState[] forced;

  /** Index of each section's internal node among the unknowns, or -1 for a dead section. */
  final int[] sourceNode;

  final int size;

  /** Per net: the AC amplitude applied there (inputs at the analysis frequency), else 0. */
  final double[] acSource;

  /** The AC analysis frequency: the first input with an AC amplitude; 0 when none. */
  final double acHz;

  Network(Stage stage, Conditions conditions) {
    this.stage = stage;
    List<String> netList = List.copyOf(stage.nets());
    nets = netList.toArray(new String[0]);
    unknownOf = new int[nets.length];
    driven = new double[nets.length];
    Map<String, Double> drivenVolts = stage.drivenVolts();
    int next = 0;
    Map<String, Integer> netIndex = new HashMap<>();
    for (int i = 0; i < nets.length; i++) {
      netIndex.put(nets[i], i);
      Double volts = drivenVolts.get(nets[i]);
      if (volts == null) {
        unknownOf[i] = next++;
        driven[i] = Double.NaN;
      } else {
        unknownOf[i] = -1;
        driven[i] = conditions.driven().getOrDefault(nets[i], volts);
      }
    }
    List<Part> parts = stage.parts();
    partRefs = new String[parts.size()];
    partA = new int[parts.size()];
    partB = new int[parts.size()];
    capacitor = new boolean[parts.size()];
    value = new double[parts.size()];
    partW = new int[parts.size()];
    position = new double[parts.size()];
    junction = new Junction[parts.size()];
    model = parts.toArray(new Part[0]);
    inner = new int[parts.size()];
    boolean anyJunction = false;
    for (int p = 0; p < parts.size(); p++) {
      Part part = parts.get(p);
      partRefs[p] = part.ref();
      partA[p] = netIndex.get(part.netA());
      partB[p] = netIndex.get(part.netB());
      capacitor[p] = part.kind() == PartKind.CAPACITOR;
      value[p] = part.value();
      partW[p] = part.kind().isTrimmer() ? netIndex.get(part.wiper()) : -1;
      position[p] = part.position();
      junction[p] = part.kind().isJunction() ? new Junction(part.junction()) : null;
      anyJunction |= junction[p] != null;
    }
    nonlinear = anyJunction;
    sections = stage.amplifiers().toArray(new Amplifier[0]);
    int n = sections.length;
    inPlus = new int[n];
    inMinus = new int[n];
    out = new int[n];
    vPlus = new int[n];
    vMinus = new int[n];
    params = new DeviceParams[n];
    forced = new SectionState[n];
    sourceNode = new int[n];
    for (int k = 0; k < n; k++) {
      Amplifier amp = sections[k];
      inPlus[k] = netIndex.get(amp.inPlus());
      inMinus[k] = netIndex.get(amp.inMinus());
      out[k] = netIndex.get(amp.out());
      vPlus[k] = netIndex.get(amp.vPlus());
      vMinus[k] = netIndex.get(amp.vMinus());
      params[k] = conditions.device(amp);
      forced[k] = conditions.forcedState(amp.ref()).orElse(null);
      sourceNode[k] = forced[k] == SectionState.DEAD ? -1 : next++;
    }
    for (int p = 0; p < parts.size(); p++) {
      inner[p] = junction[p] != null && junction[p].figures.seriesOhms() > 0 ? next++ : -1;
    }
    size = next;
    acSource = new double[nets.length];
    double hz = 0;
    for (var input : stage.inputs()) {
      if (input.hasAc() && (hz == 0 || input.hz() == hz)) {
        hz = input.hz();
        acSource[netIndex.get(input.net())] = input.peakAc();
      }
    }
    acHz = hz;
  }

  /** A copy that shares the topology and has its own numbers (values, driven volts, devices). */
  private Network(Network other) {
    stage = other.stage;
    nets = other.nets;
    unknownOf = other.unknownOf;
    driven = other.driven.clone();
    partRefs = other.partRefs;
    partA = other.partA;
    partB = other.partB;
    capacitor = other.capacitor;
    value = other.value.clone();
    partW = other.partW;
    position = other.position.clone();
    junction = other.junction.clone();
    model = other.model;
    inner = other.inner;
    nonlinear = other.nonlinear;
    sections = other.sections;
    inPlus = other.inPlus;
    inMinus = other.inMinus;
    out = other.out;
    vPlus = other.vPlus;
    vMinus = other.vMinus;
    params = other.params.clone();
    forced = other.forced;
    sourceNode = other.sourceNode;
    size = other.size;
    acSource = other.acSource;
    acHz = other.acHz;
  }

  /** Returns a copy with its own numbers, to change without touching this one. */
  Network copyNumbers() {
    return new Network(this);
  }

  /** Returns the voltage of net i in a solution vector. */
  double volts(double[] x, int net) {
    int u = unknownOf[net];
    return u < 0 ? driven[net] : x[u];
  }

  /** The output limits of section k given the supply-pin voltages in x: {@code {low, high}}. */
  double[] limits(double[] x, int k) {
    double plus = volts(x, vPlus[k]);
    double minus = volts(x, vMinus[k]);
    double high = plus - params[k].headroomHigh();
    double low = minus + params[k].headroomLow();
    if (high < low) {
      // Too little supply for any swing (a missing rail on a single-supply part): the output
      // sits between its supply pins. Common practice for an unpowered output, as a model.
      double mid = (plus + minus) / 2;
      return new double[] {mid, mid};
    }
    return new double[] {low, high};
  }

  /** The lower limit of section k's output at x: {@code limits(x, k)[0]} without the array. */
  double limitLow(double[] x, int k) {
    double plus = volts(x, vPlus[k]);
    double minus = volts(x, vMinus[k]);
    double high = plus - params[k].headroomHigh();
    double low = minus + params[k].headroomLow();
    return high < low ? (plus + minus) / 2 : low;
  }

  /** The upper limit of section k's output at x: {@code limits(x, k)[1]} without the array. */
  double limitHigh(double[] x, int k) {
    double plus = volts(x, vPlus[k]);
    double minus = volts(x, vMinus[k]);
    double high = plus - params[k].headroomHigh();
    double low = minus + params[k].headroomLow();
    return high < low ? (plus + minus) / 2 : high;
  }

  /** Whether the limits of section k have collapsed to the mid-supply point at x. */
  boolean collapsed(double[] x, int k) {
    return volts(x, vPlus[k]) - params[k].headroomHigh()
        < volts(x, vMinus[k]) + params[k].headroomLow();
  }

  /** The internal source's demanded value {@code A·(v+ − v− + offset)} of section k at x. */
  double drive(double[] x, int k) {
    double vd = volts(x, inPlus[k]) - volts(x, inMinus[k]);
    return params[k].gain() * (vd + params[k].offset());
  }

  /** The internal source's voltage of section k at x (NaN for a dead section). */
  double source(double[] x, int k) {
    return sourceNode[k] < 0 ? Double.NaN : x[sourceNode[k]];
  }

  /** The voltage across part p's junction itself (inner node to cathode) at x. */
  double junctionVolts(double[] x, int p) {
    double cathode = volts(x, partB[p]);
    return (inner[p] >= 0 ? x[inner[p]] : volts(x, partA[p])) - cathode;
  }

  /**
   * Solves the DC system with every section in the given state; returns null when singular (a
   * floating net, or a loop gain of exactly 1) or, with junctions, when Newton's method does not
   * settle (then {@link #newtonFailure} names the junction).
   *
   * @param states one state per section; forced sections must carry their forced state
   * @param collapsedHint per section, whether to use the mid-supply clamp for HIGH/LOW rows
   */
  DcSystem solveDc(SectionState[] states, boolean[] collapsedHint) {
    return solveDc(states, collapsedHint, null);
  }

  /**
   * As {@link #solveDc(SectionState[], boolean[])}, starting Newton's method from {@code guess}
   * (all unknowns; null for the junctions' critical voltages).
   */
  DcSystem solveDc(SectionState[] states, boolean[] collapsedHint, double[] guess) {
    return new DcEquations(this).solve(states, collapsedHint, guess);
  }

  /**
   * Returns the residual {@code b − M·x} of the DC system for the given states at x, computed from
   * the elements without building the matrix. Rows of section sources hold the residual of their
   * state's equation.
   */
  double[] residual(SectionState[] states, boolean[] collapsed, double[] x) {
    return new DcEquations(this).residual(states, collapsed, x);
  }

  /**
   * Solves the small-signal AC system about a DC state at {@link #acHz}; returns {@code {re, im}}
   * per unknown, or null when singular. Inputs whose AC is at another frequency are AC ground.
   */
  double[][] solveAc(SectionState[] states, boolean[] collapsedHint, double[] dc) {
    return new AcEquations(this).solve(states, collapsedHint, dc);
  }

  /** Sets the value of part p; a zener's junction follows its new voltage. */
  void setValue(int p, double newValue) {
    value[p] = newValue;
    if (junction[p] != null && model[p].kind() == PartKind.ZENER) {
      junction[p] = new Junction(model[p].withValue(newValue).junction());
    }
  }

  /** Fills the inner nodes of the junctions in x from the net voltages already there. */
  void fillInner(double[] x) {
    for (int p = 0; p < junction.length; p++) {
      if (junction[p] != null && inner[p] >= 0) {
        double across = volts(x, partA[p]) - volts(x, partB[p]);
        x[inner[p]] = volts(x, partB[p]) + junction[p].junctionVolts(across);
      }
    }
  }

  /**
   * The nets and coefficients c in {@code v_source = Σ c·v(net) + constant} for a state; the
   * coefficients are written into {@code coefficients}, the nets returned.
   */
  int[] sectionTerms(int k, SectionState state, boolean collapsed, double[] coefficients) {
    switch (state) {
      case LINEAR -> {
        coefficients[0] = params[k].gain();
        coefficients[1] = -params[k].gain();
        return new int[] {inPlus[k], inMinus[k]};
      }
      case HIGH, LOW -> {
        if (collapsed) {
          coefficients[0] = 0.5;
          coefficients[1] = 0.5;
          return new int[] {vPlus[k], vMinus[k]};
        }
        coefficients[0] = 1;
        return new int[] {state == SectionState.HIGH ? vPlus[k] : vMinus[k]};
      }
      default -> throw new IllegalStateException("a dead section has no source row");
    }
  }

  double sectionConstant(int k, SectionState state, boolean collapsed) {
    return switch (state) {
      case LINEAR -> params[k].gain() * params[k].offset();
      case HIGH -> collapsed ? 0 : -params[k].headroomHigh();
      case LOW -> collapsed ? 0 : params[k].headroomLow();
      case DEAD -> 0;
    };
  }
}

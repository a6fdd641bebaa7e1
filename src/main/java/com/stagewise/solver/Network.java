package com.stagewise.solver;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import java.util.Arrays;
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
        acSource[netIndex.get(input.net())] = input.ac();
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
    if (!nonlinear) {
      double[][] a = new double[size][size];
      double[] b = new double[size];
      stampLinear(a, b, states, collapsedHint, 0);
      DenseLu.Factors factors = DenseLu.factor(a);
      return factors == null ? null : new DcSystem(factors.solve(b), factors);
    }
    newtonFailure = "";
    DcSystem direct = newton(states, collapsedHint, guess, 0);
    if (direct != null) {
      return direct;
    }
    // Gmin stepping, as SPICE does when plain Newton fails: a conductance from every node to
    // ground, lowered a decade at a time, each solve starting from the last.
    double[] x = guess;
    for (double shunt = 1e-2; shunt >= 1e-13; shunt /= 10) {
      DcSystem stepped = newton(states, collapsedHint, x, shunt);
      if (stepped == null) {
        return null;
      }
      x = stepped.x();
    }
    DcSystem last = newton(states, collapsedHint, x, 0);
    if (last != null) {
      newtonFailure = "";
    }
    return last;
  }

  /** Newton iterations allowed for one DC solve with junctions. */
  static final int MAX_NEWTON = 150;

  /**
   * Newton's method on the DC system with junction-voltage limiting; null when singular or not
   * settled within {@link #MAX_NEWTON} steps.
   */
  private DcSystem newton(
      SectionState[] states, boolean[] collapsedHint, double[] guess, double shunt) {
    double[] x = guess != null ? guess.clone() : new double[size];
    double[] vj = new double[junction.length];
    for (int p = 0; p < junction.length; p++) {
      if (junction[p] != null) {
        vj[p] = guess != null ? junctionVolts(x, p) : junction[p].vcrit;
      }
    }
    for (int iteration = 0; iteration < MAX_NEWTON; iteration++) {
      double[][] a = new double[size][size];
      double[] b = new double[size];
      stampLinear(a, b, states, collapsedHint, shunt);
      for (int p = 0; p < junction.length; p++) {
        if (junction[p] != null) {
          stampJunction(a, b, p, vj[p]);
        }
      }
      DenseLu.Factors factors = DenseLu.factor(a);
      if (factors == null) {
        return null;
      }
      double[] next = factors.solve(b);
      boolean settled = iteration > 0;
      for (int i = 0; i < size && settled; i++) {
        if (!(Math.abs(next[i] - x[i])
            <= NEWTON_RELATIVE * Math.max(Math.abs(next[i]), Math.abs(x[i])) + NEWTON_VOLTS)) {
          settled = false;
        }
      }
      double worst = 0;
      for (int p = 0; p < junction.length; p++) {
        if (junction[p] == null) {
          continue;
        }
        double proposed = junctionVolts(next, p);
        double limited = junction[p].limit(proposed, vj[p]);
        if (limited != proposed) {
          settled = false;
        }
        double moved = Math.abs(limited - vj[p]);
        if (moved >= worst) {
          worst = moved;
          newtonFailure = partRefs[p];
        }
        vj[p] = limited;
      }
      for (double v : next) {
        if (!Double.isFinite(v)) {
          return null;
        }
      }
      x = next;
      if (settled) {
        return new DcSystem(x, factors);
      }
    }
    return null;
  }

  /** Relative change of every unknown at which Newton's method has settled. */
  static final double NEWTON_RELATIVE = 1e-9;

  /** Absolute change (volts) at which Newton's method has settled. */
  static final double NEWTON_VOLTS = 1e-9;

  /** The voltage across part p's junction itself (inner node to cathode) at x. */
  double junctionVolts(double[] x, int p) {
    double cathode = volts(x, partB[p]);
    return (inner[p] >= 0 ? x[inner[p]] : volts(x, partA[p])) - cathode;
  }

  /** Stamps junction p linearised at vd: its conductance and the matching current source. */
  private void stampJunction(double[][] a, double[] b, int p, double vd) {
    double[] e = junction[p].evaluate(vd);
    double gd = e[1];
    double equivalent = e[0] - gd * vd;
    int anodeSide = inner[p] >= 0 ? -1 - inner[p] : partA[p];
    stampTerminals(a, b, anodeSide, partB[p], gd);
    injectTerminal(b, anodeSide, -equivalent);
    injectTerminal(b, partB[p], equivalent);
  }

  /** Stamps everything linear: resistors, trimmers, series resistances, sections, bias currents. */
  private void stampLinear(
      double[][] a, double[] b, SectionState[] states, boolean[] collapsedHint, double shunt) {
    for (int p = 0; p < value.length; p++) {
      if (junction[p] != null) {
        if (inner[p] >= 0) {
          stampTerminals(a, b, partA[p], -1 - inner[p], 1 / junction[p].figures.seriesOhms());
          if (shunt > 0) {
            a[inner[p]][inner[p]] += shunt;
          }
        }
      } else if (partW[p] >= 0) {
        stamp(a, b, partA[p], partW[p], 1 / Math.max(value[p] * position[p], MIN_OHMS));
        stamp(a, b, partW[p], partB[p], 1 / Math.max(value[p] * (1 - position[p]), MIN_OHMS));
      } else if (!capacitor[p]) {
        stamp(a, b, partA[p], partB[p], 1 / Math.max(value[p], MIN_OHMS));
      }
    }
    if (shunt > 0) {
      for (int i = 0; i < nets.length; i++) {
        if (unknownOf[i] >= 0) {
          a[unknownOf[i]][unknownOf[i]] += shunt;
        }
      }
    }
    for (int k = 0; k < sections.length; k++) {
      if (sourceNode[k] >= 0) {
        stampToSource(a, b, out[k], sourceNode[k], 1 / params[k].outputResistance());
      }
      // Bias currents leave each input's net into the section.
      inject(b, inPlus[k], -params[k].biasPlus());
      inject(b, inMinus[k], -params[k].biasMinus());
    }
    for (int k = 0; k < sections.length; k++) {
      if (sourceNode[k] >= 0) {
        writeSectionRow(a, b, k, states[k], collapsedHint[k]);
      }
    }
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

  /** The voltage at a terminal: a net index, or {@code -1 - u} for unknown u. */
  private double terminalVolts(double[] x, int terminal) {
    return terminal < 0 ? x[-1 - terminal] : volts(x, terminal);
  }

  /** The unknown of a terminal (a net index, or {@code -1 - u}), or -1 for a driven net. */
  private int terminalUnknown(int terminal) {
    return terminal < 0 ? -1 - terminal : unknownOf[terminal];
  }

  private void stampTerminals(double[][] a, double[] b, int t1, int t2, double g) {
    int i = terminalUnknown(t1);
    int j = terminalUnknown(t2);
    if (i >= 0) {
      a[i][i] += g;
      if (j >= 0) {
        a[i][j] -= g;
      } else {
        b[i] += g * driven[t2];
      }
    }
    if (j >= 0) {
      a[j][j] += g;
      if (i >= 0) {
        a[j][i] -= g;
      } else {
        b[j] += g * driven[t1];
      }
    }
  }

  private void injectTerminal(double[] b, int terminal, double amps) {
    int u = terminalUnknown(terminal);
    if (u >= 0) {
      b[u] += amps;
    }
  }

  /**
   * Returns the residual {@code b − M·x} of the DC system for the given states at x, computed from
   * the elements without building the matrix. Rows of section sources hold the residual of their
   * state's equation.
   */
  double[] residual(SectionState[] states, boolean[] collapsed, double[] x) {
    double[] r = new double[size];
    for (int p = 0; p < value.length; p++) {
      if (capacitor[p]) {
        continue;
      }
      if (junction[p] != null) {
        int anodeSide = partA[p];
        if (inner[p] >= 0) {
          anodeSide = -1 - inner[p];
          double series = (volts(x, partA[p]) - x[inner[p]]) / junction[p].figures.seriesOhms();
          flow(r, partA[p], anodeSide, series);
        }
        flow(r, anodeSide, partB[p], junction[p].current(junctionVolts(x, p)));
      } else if (partW[p] >= 0) {
        double upper = Math.max(value[p] * position[p], MIN_OHMS);
        double lower = Math.max(value[p] * (1 - position[p]), MIN_OHMS);
        flow(r, partA[p], partW[p], (volts(x, partA[p]) - volts(x, partW[p])) / upper);
        flow(r, partW[p], partB[p], (volts(x, partW[p]) - volts(x, partB[p])) / lower);
      } else {
        double current = (volts(x, partA[p]) - volts(x, partB[p])) / Math.max(value[p], MIN_OHMS);
        flow(r, partA[p], partB[p], current);
      }
    }
    for (int k = 0; k < sections.length; k++) {
      inject(r, inPlus[k], -params[k].biasPlus());
      inject(r, inMinus[k], -params[k].biasMinus());
      int s = sourceNode[k];
      if (s < 0) {
        continue;
      }
      int o = unknownOf[out[k]];
      if (o >= 0) {
        r[o] -= (x[o] - x[s]) / params[k].outputResistance();
      }
      double[] coefficients = new double[3];
      int[] terms = sectionTerms(k, states[k], collapsed[k], coefficients);
      double target = sectionConstant(k, states[k], collapsed[k]);
      for (int t = 0; t < terms.length; t++) {
        target += coefficients[t] * volts(x, terms[t]);
      }
      r[s] = target - x[s];
    }
    return r;
  }

  /** Books a current from terminal t1 to terminal t2 into the residual of their rows. */
  private void flow(double[] r, int t1, int t2, double amps) {
    int i = terminalUnknown(t1);
    int j = terminalUnknown(t2);
    if (i >= 0) {
      r[i] -= amps;
    }
    if (j >= 0) {
      r[j] += amps;
    }
  }

  /**
   * A solved DC system: the unknowns and the factorised matrix, kept for cheap follow-up solves.
   *
   * @param x the unknowns: undriven net voltages, then section source voltages
   * @param factors the LU factors of the system matrix
   */
  record DcSystem(double[] x, DenseLu.Factors factors) {
    /**
     * Whether section k's linear state is stable: its loop gain L is below 1. A unit disturbance
     * added to the section's source moves the source by 1/(1 − L), which is entry (k, k) of the
     * inverse matrix, so L &lt; 1 exactly when that entry is positive.
     */
    boolean stable(Network network, int k) {
      return network.sourceNode[k] < 0 || factors.inverseDiagonal(network.sourceNode[k]) > 0;
    }
  }

  /**
   * Solves the small-signal AC system about a DC state at {@link #acHz}; returns {@code {re, im}}
   * per unknown, or null when singular. Inputs whose AC is at another frequency are AC ground.
   */
  double[][] solveAc(SectionState[] states, boolean[] collapsedHint, double[] dc) {
    double[][] ar = new double[size][size];
    double[][] ai = new double[size][size];
    double[] br = new double[size];
    double[] bi = new double[size];
    double omega = 2 * Math.PI * acHz;
    for (int p = 0; p < value.length; p++) {
      if (junction[p] != null) {
        // Small signal: the junction is its conductance at the DC point (a conducting diode its
        // dynamic resistance, an off one nearly open), in series with its series resistance.
        double gd = junction[p].evaluate(junctionVolts(dc, p))[1];
        if (inner[p] >= 0) {
          int node = -1 - inner[p];
          stampComplex(ar, ai, br, bi, partA[p], node, 1 / junction[p].figures.seriesOhms(), 0);
          stampComplex(ar, ai, br, bi, partB[p], node, gd, 0);
        } else {
          stampComplex(ar, ai, br, bi, partA[p], partB[p], gd, 0);
        }
      } else if (partW[p] >= 0) {
        stampComplex(
            ar, ai, br, bi, partA[p], partW[p], 1 / Math.max(value[p] * position[p], MIN_OHMS), 0);
        stampComplex(
            ar,
            ai,
            br,
            bi,
            partW[p],
            partB[p],
            1 / Math.max(value[p] * (1 - position[p]), MIN_OHMS),
            0);
      } else {
        double g = capacitor[p] ? 0 : 1 / Math.max(value[p], MIN_OHMS);
        double susceptance = capacitor[p] ? omega * value[p] : 0;
        stampComplex(ar, ai, br, bi, partA[p], partB[p], g, susceptance);
      }
    }
    for (int k = 0; k < sections.length; k++) {
      if (sourceNode[k] >= 0) {
        stampComplex(
            ar, ai, br, bi, out[k], -1 - sourceNode[k], 1 / params[k].outputResistance(), 0);
      }
    }
    for (int k = 0; k < sections.length; k++) {
      if (sourceNode[k] < 0) {
        continue;
      }
      int row = sourceNode[k];
      Arrays.fill(ar[row], 0);
      Arrays.fill(ai[row], 0);
      br[row] = 0;
      bi[row] = 0;
      ar[row][row] = 1;
      double[] coefficients = new double[3];
      int[] terms = sectionTerms(k, states[k], collapsedHint[k], coefficients);
      for (int t = 0; t < terms.length; t++) {
        int col = unknownOf[terms[t]];
        if (col >= 0) {
          ar[row][col] -= coefficients[t];
        } else {
          br[row] += coefficients[t] * acSource[terms[t]];
        }
      }
    }
    return DenseLu.solveComplex(ar, ai, br, bi);
  }

  /**
   * The nets and coefficients c in {@code v_source = Σ c·v(net) + constant} for a state; the
   * coefficients are written into {@code coefficients}, the nets returned.
   */
  private int[] sectionTerms(int k, SectionState state, boolean collapsed, double[] coefficients) {
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

  private double sectionConstant(int k, SectionState state, boolean collapsed) {
    return switch (state) {
      case LINEAR -> params[k].gain() * params[k].offset();
      case HIGH -> collapsed ? 0 : -params[k].headroomHigh();
      case LOW -> collapsed ? 0 : params[k].headroomLow();
      case DEAD -> 0;
    };
  }

  private void writeSectionRow(
      double[][] a, double[] b, int k, SectionState state, boolean collapsed) {
    int row = sourceNode[k];
    Arrays.fill(a[row], 0);
    a[row][row] = 1;
    b[row] = sectionConstant(k, state, collapsed);
    double[] coefficients = new double[3];
    int[] terms = sectionTerms(k, state, collapsed, coefficients);
    for (int t = 0; t < terms.length; t++) {
      int col = unknownOf[terms[t]];
      if (col >= 0) {
        a[row][col] -= coefficients[t];
      } else {
        b[row] += coefficients[t] * driven[terms[t]];
      }
    }
  }

  private void stamp(double[][] a, double[] b, int netA, int netB, double g) {
    int i = unknownOf[netA];
    int j = unknownOf[netB];
    if (i >= 0) {
      a[i][i] += g;
      if (j >= 0) {
        a[i][j] -= g;
      } else {
        b[i] += g * driven[netB];
      }
    }
    if (j >= 0) {
      a[j][j] += g;
      if (i >= 0) {
        a[j][i] -= g;
      } else {
        b[j] += g * driven[netA];
      }
    }
  }

  private void stampToSource(double[][] a, double[] b, int net, int node, double g) {
    int i = unknownOf[net];
    a[node][node] += g;
    if (i >= 0) {
      a[i][i] += g;
      a[i][node] -= g;
      a[node][i] -= g;
    } else {
      b[node] += g * driven[net];
    }
  }

  private void inject(double[] b, int net, double amps) {
    int i = unknownOf[net];
    if (i >= 0) {
      b[i] += amps;
    }
  }

  /**
   * Stamps an admittance g + j·susceptance between net A and B (a negative B of {@code -1 - u}
   * names the unknown u directly: a section's internal node).
   */
  private void stampComplex(
      double[][] ar,
      double[][] ai,
      double[] br,
      double[] bi,
      int netA,
      int netB,
      double g,
      double susceptance) {
    int i = unknownOf[netA];
    int j = netB < 0 ? -1 - netB : unknownOf[netB];
    double sourceB = netB < 0 ? 0 : acSource[netB];
    double sourceA = acSource[netA];
    if (i >= 0) {
      ar[i][i] += g;
      ai[i][i] += susceptance;
      if (j >= 0) {
        ar[i][j] -= g;
        ai[i][j] -= susceptance;
      } else {
        br[i] += g * sourceB;
        bi[i] += susceptance * sourceB;
      }
    }
    if (j >= 0) {
      ar[j][j] += g;
      ai[j][j] += susceptance;
      if (i >= 0) {
        ar[j][i] -= g;
        ai[j][i] -= susceptance;
      } else {
        br[j] += g * sourceA;
        bi[j] += susceptance * sourceA;
      }
    }
  }
}

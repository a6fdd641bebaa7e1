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
    for (int p = 0; p < parts.size(); p++) {
      Part part = parts.get(p);
      partRefs[p] = part.ref();
      partA[p] = netIndex.get(part.netA());
      partB[p] = netIndex.get(part.netB());
      capacitor[p] = part.kind() == PartKind.CAPACITOR;
      value[p] = part.value();
    }
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
   * floating net, or a loop gain of exactly 1).
   *
   * @param states one state per section; forced sections must carry their forced state
   * @param collapsedHint per section, whether to use the mid-supply clamp for HIGH/LOW rows
   */
  DcSystem solveDc(SectionState[] states, boolean[] collapsedHint) {
    double[][] a = new double[size][size];
    double[] b = new double[size];
    for (int p = 0; p < value.length; p++) {
      if (!capacitor[p]) {
        stamp(a, b, partA[p], partB[p], 1 / Math.max(value[p], MIN_OHMS));
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
    DenseLu.Factors factors = DenseLu.factor(a);
    return factors == null ? null : new DcSystem(factors.solve(b), factors);
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
      double current = (volts(x, partA[p]) - volts(x, partB[p])) / Math.max(value[p], MIN_OHMS);
      int i = unknownOf[partA[p]];
      int j = unknownOf[partB[p]];
      if (i >= 0) {
        r[i] -= current;
      }
      if (j >= 0) {
        r[j] += current;
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
  double[][] solveAc(SectionState[] states, boolean[] collapsedHint) {
    double[][] ar = new double[size][size];
    double[][] ai = new double[size][size];
    double[] br = new double[size];
    double[] bi = new double[size];
    double omega = 2 * Math.PI * acHz;
    for (int p = 0; p < value.length; p++) {
      double g = capacitor[p] ? 0 : 1 / Math.max(value[p], MIN_OHMS);
      double susceptance = capacitor[p] ? omega * value[p] : 0;
      stampComplex(ar, ai, br, bi, partA[p], partB[p], g, susceptance);
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

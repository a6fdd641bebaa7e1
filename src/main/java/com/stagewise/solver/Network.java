package com.stagewise.solver;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A stage compiled for modified nodal analysis under given conditions.
 *
 * <p>Unknowns are the voltages of the undriven nets, then one internal source node per section
 * that drives (not dead). Each section's internal node connects to its output net through the
 * output resistance; its row holds the section's equation for its current state instead of a
 * current balance (the source's current is then whatever the balance at the output needs).
 */
final class Network {
  /**
   * Resistances below this are modelled at this value: a 0 Ω link or a dead short. 1 mΩ keeps the
   * matrix well conditioned against megohm parts and moves a node by microvolts at most.
   */
  static final double MIN_OHMS = 1e-3;

  final Stage stage;
  final Conditions conditions;
  final List<String> nets;
  final Map<String, Double> drivenVolts = new HashMap<>();
  final Map<String, Integer> unknown = new HashMap<>();
  final Amplifier[] sections;
  final DeviceParams[] params;
  final SectionState[] forced;
  /** Index of each section's internal node among the unknowns, or -1 for a dead section. */
  final int[] sourceNode;
  final int size;

  Network(Stage stage, Conditions conditions) {
    this.stage = stage;
    this.conditions = conditions;
    this.nets = List.copyOf(stage.nets());
    drivenVolts.putAll(stage.drivenVolts());
    conditions.driven().forEach(
        (net, volts) -> {
          if (drivenVolts.containsKey(net)) {
            drivenVolts.put(net, volts);
          }
        });
    int next = 0;
    for (String net : nets) {
      if (!drivenVolts.containsKey(net)) {
        unknown.put(net, next++);
      }
    }
    List<Amplifier> amps = stage.amplifiers();
    sections = amps.toArray(new Amplifier[0]);
    params = new DeviceParams[sections.length];
    forced = new SectionState[sections.length];
    sourceNode = new int[sections.length];
    for (int k = 0; k < sections.length; k++) {
      params[k] = conditions.device(sections[k]);
      forced[k] = conditions.forcedState(sections[k].ref()).orElse(null);
      sourceNode[k] = forced[k] == SectionState.DEAD ? -1 : next++;
    }
    size = next;
  }

  /** Returns the voltage of a net in a solution vector. */
  double volts(double[] x, String net) {
    Integer index = unknown.get(net);
    return index == null ? drivenVolts.get(net) : x[index];
  }

  /** The output limits of section k given the supply-pin voltages in x: {@code {low, high}}. */
  double[] limits(double[] x, int k) {
    double vPlus = volts(x, sections[k].vPlus());
    double vMinus = volts(x, sections[k].vMinus());
    double high = vPlus - params[k].headroomHigh();
    double low = vMinus + params[k].headroomLow();
    if (high < low) {
      // Too little supply for any swing (a missing rail on a single-supply part): the output
      // sits between its supply pins. Common practice for an unpowered output, as a model.
      double mid = (vPlus + vMinus) / 2;
      return new double[] {mid, mid};
    }
    return new double[] {low, high};
  }

  /** Whether the limits of section k have collapsed to the mid-supply point at x. */
  boolean collapsed(double[] x, int k) {
    double[] lim = limits(x, k);
    return lim[0] == lim[1]
        && volts(x, sections[k].vPlus()) - params[k].headroomHigh()
            < volts(x, sections[k].vMinus()) + params[k].headroomLow();
  }

  /** The internal source's demanded value {@code A·(v+ − v− + offset)} of section k at x. */
  double drive(double[] x, int k) {
    double vd = volts(x, sections[k].inPlus()) - volts(x, sections[k].inMinus());
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
    for (Part part : stage.parts()) {
      if (part.kind() == PartKind.RESISTOR) {
        stampConductance(a, b, part.netA(), part.netB(), 1 / Math.max(part.value(), MIN_OHMS));
      }
    }
    for (int k = 0; k < sections.length; k++) {
      if (sourceNode[k] >= 0) {
        stampConductanceToNode(a, b, sections[k].out(), sourceNode[k], 1 / params[k].outputResistance());
      }
      // Bias currents leave each input's net into the section.
      inject(b, sections[k].inPlus(), -params[k].biasPlus());
      inject(b, sections[k].inMinus(), -params[k].biasMinus());
    }
    for (int k = 0; k < sections.length; k++) {
      if (sourceNode[k] >= 0) {
        writeSectionRow(a, b, k, states[k], collapsedHint[k], true);
      }
    }
    DenseLu.Factors factors = DenseLu.factor(a);
    return factors == null ? null : new DcSystem(factors.solve(b), factors);
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
   * Solves the small-signal AC system about a DC state at {@code hz}; returns {@code {re, im}} or
   * null when singular. Inputs whose AC is at another frequency are taken as AC ground.
   */
  double[][] solveAc(SectionState[] states, boolean[] collapsedHint, double hz) {
    double[][] ar = new double[size][size];
    double[][] ai = new double[size][size];
    double[] br = new double[size];
    double[] bi = new double[size];
    Map<String, Double> acSource = new HashMap<>();
    for (TestInput input : stage.inputs()) {
      if (input.hasAc() && input.hz() == hz) {
        acSource.put(input.net(), input.ac());
      }
    }
    double omega = 2 * Math.PI * hz;
    for (Part part : stage.parts()) {
      double g = 0;
      double bSus = 0;
      if (part.kind() == PartKind.RESISTOR) {
        g = 1 / Math.max(part.value(), MIN_OHMS);
      } else {
        bSus = omega * part.value();
      }
      stampComplex(ar, ai, br, bi, acSource, part.netA(), part.netB(), g, bSus);
    }
    for (int k = 0; k < sections.length; k++) {
      if (sourceNode[k] >= 0) {
        double g = 1 / params[k].outputResistance();
        Integer out = unknown.get(sections[k].out());
        int s = sourceNode[k];
        ar[s][s] += g;
        if (out != null) {
          ar[out][out] += g;
          ar[out][s] -= g;
          ar[s][out] -= g;
        } else {
          br[s] += g * acSource.getOrDefault(sections[k].out(), 0.0);
        }
      }
    }
    for (int k = 0; k < sections.length; k++) {
      if (sourceNode[k] < 0) {
        continue;
      }
      int row = sourceNode[k];
      java.util.Arrays.fill(ar[row], 0);
      java.util.Arrays.fill(ai[row], 0);
      br[row] = 0;
      bi[row] = 0;
      ar[row][row] = 1;
      for (Map.Entry<String, Double> term : sectionTerms(k, states[k], collapsedHint[k]).entrySet()) {
        Integer col = unknown.get(term.getKey());
        if (col != null) {
          ar[row][col] -= term.getValue();
        } else {
          br[row] += term.getValue() * acSource.getOrDefault(term.getKey(), 0.0);
        }
      }
    }
    return DenseLu.solveComplex(ar, ai, br, bi);
  }

  /** Net coefficients c in {@code v_source = Σ c·v(net) + constant} for a state. */
  private Map<String, Double> sectionTerms(int k, SectionState state, boolean collapsed) {
    Map<String, Double> terms = new LinkedHashMap<>();
    Amplifier amp = sections[k];
    switch (state) {
      case LINEAR -> {
        terms.merge(amp.inPlus(), params[k].gain(), Double::sum);
        terms.merge(amp.inMinus(), -params[k].gain(), Double::sum);
      }
      case HIGH, LOW -> {
        if (collapsed) {
          terms.merge(amp.vPlus(), 0.5, Double::sum);
          terms.merge(amp.vMinus(), 0.5, Double::sum);
        } else {
          terms.merge(state == SectionState.HIGH ? amp.vPlus() : amp.vMinus(), 1.0, Double::sum);
        }
      }
      case DEAD -> throw new IllegalStateException("a dead section has no source row");
    }
    return terms;
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
      double[][] a, double[] b, int k, SectionState state, boolean collapsed, boolean dc) {
    int row = sourceNode[k];
    java.util.Arrays.fill(a[row], 0);
    a[row][row] = 1;
    b[row] = dc ? sectionConstant(k, state, collapsed) : 0;
    for (Map.Entry<String, Double> term : sectionTerms(k, state, collapsed).entrySet()) {
      Integer col = unknown.get(term.getKey());
      if (col != null) {
        a[row][col] -= term.getValue();
      } else if (dc) {
        b[row] += term.getValue() * drivenVolts.get(term.getKey());
      }
    }
  }

  private void stampConductance(double[][] a, double[] b, String netA, String netB, double g) {
    Integer i = unknown.get(netA);
    Integer j = unknown.get(netB);
    if (i != null) {
      a[i][i] += g;
      if (j != null) {
        a[i][j] -= g;
      } else {
        b[i] += g * drivenVolts.get(netB);
      }
    }
    if (j != null) {
      a[j][j] += g;
      if (i != null) {
        a[j][i] -= g;
      } else {
        b[j] += g * drivenVolts.get(netA);
      }
    }
  }

  private void stampConductanceToNode(double[][] a, double[] b, String net, int node, double g) {
    Integer i = unknown.get(net);
    a[node][node] += g;
    if (i != null) {
      a[i][i] += g;
      a[i][node] -= g;
      a[node][i] -= g;
    } else {
      b[node] += g * drivenVolts.get(net);
    }
  }

  private void inject(double[] b, String net, double amps) {
    Integer i = unknown.get(net);
    if (i != null) {
      b[i] += amps;
    }
  }

  private void stampComplex(
      double[][] ar,
      double[][] ai,
      double[] br,
      double[] bi,
      Map<String, Double> acSource,
      String netA,
      String netB,
      double g,
      double bSus) {
    Integer i = unknown.get(netA);
    Integer j = unknown.get(netB);
    if (i != null) {
      ar[i][i] += g;
      ai[i][i] += bSus;
      if (j != null) {
        ar[i][j] -= g;
        ai[i][j] -= bSus;
      } else {
        double v = acSource.getOrDefault(netB, 0.0);
        br[i] += g * v;
        bi[i] += bSus * v;
      }
    }
    if (j != null) {
      ar[j][j] += g;
      ai[j][j] += bSus;
      if (i != null) {
        ar[j][i] -= g;
        ai[j][i] -= bSus;
      } else {
        double v = acSource.getOrDefault(netA, 0.0);
        br[j] += g * v;
        bi[j] += bSus * v;
      }
    }
  }
}

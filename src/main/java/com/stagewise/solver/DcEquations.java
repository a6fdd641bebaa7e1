package com.stagewise.solver;

import java.util.Arrays;

/**
 * The DC equations of a {@link Network}: the modified nodal matrix stamped from its elements and
 * section rows, solved directly for a linear stage and by Newton's method (with gmin stepping) when
 * junctions are in; and the residual of a given solution, for the factorised re-solves.
 */
final class DcEquations {
  private final Network net;

  DcEquations(Network net) {
    this.net = net;
  }

  /**
   * Solves the DC system with every section in the given state, starting Newton's method from
   * {@code guess} (all unknowns; null for the junctions' critical voltages); returns null when
   * singular (a floating net, or a loop gain of exactly 1) or, with junctions, when Newton's method
   * does not settle (then {@link Network#newtonFailure} names the junction).
   *
   * @param states one state per section; forced sections must carry their forced state
   * @param collapsedHint per section, whether to use the mid-supply clamp for HIGH/LOW rows
   */
  DcSystem solve(SectionState[] states, boolean[] collapsedHint, double[] guess) {
    if (!net.nonlinear) {
      double[][] a = new double[net.size][net.size];
      double[] b = new double[net.size];
      stampLinear(a, b, states, collapsedHint, 0);
      DenseLu.Factors factors = DenseLu.factor(a);
      return factors == null ? null : new DcSystem(factors.solve(b), factors);
    }
    net.newtonFailure = "";
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
      net.newtonFailure = "";
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
    double[] x = guess != null ? guess.clone() : new double[net.size];
    double[] vj = new double[net.junction.length];
    for (int p = 0; p < net.junction.length; p++) {
      if (net.junction[p] != null) {
        vj[p] = guess != null ? net.junctionVolts(x, p) : net.junction[p].vcrit;
      }
    }
    for (int iteration = 0; iteration < MAX_NEWTON; iteration++) {
      double[][] a = new double[net.size][net.size];
      double[] b = new double[net.size];
      stampLinear(a, b, states, collapsedHint, shunt);
      for (int p = 0; p < net.junction.length; p++) {
        if (net.junction[p] != null) {
          stampJunction(a, b, p, vj[p]);
        }
      }
      DenseLu.Factors factors = DenseLu.factor(a);
      if (factors == null) {
        return null;
      }
      double[] next = factors.solve(b);
      boolean settled = iteration > 0;
      for (int i = 0; i < net.size && settled; i++) {
        if (!(Math.abs(next[i] - x[i])
            <= NEWTON_RELATIVE * Math.max(Math.abs(next[i]), Math.abs(x[i])) + NEWTON_VOLTS)) {
          settled = false;
        }
      }
      double worst = 0;
      for (int p = 0; p < net.junction.length; p++) {
        if (net.junction[p] == null) {
          continue;
        }
        double proposed = net.junctionVolts(next, p);
        double limited = net.junction[p].limit(proposed, vj[p]);
        if (limited != proposed) {
          settled = false;
        }
        double moved = Math.abs(limited - vj[p]);
        if (moved >= worst) {
          worst = moved;
          net.newtonFailure = net.partRefs[p];
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

  /** Stamps junction p linearised at vd: its conductance and the matching current source. */
  private void stampJunction(double[][] a, double[] b, int p, double vd) {
    double[] e = net.junction[p].evaluate(vd);
    double gd = e[1];
    double equivalent = e[0] - gd * vd;
    int anodeSide = net.inner[p] >= 0 ? -1 - net.inner[p] : net.partA[p];
    stampTerminals(a, b, anodeSide, net.partB[p], gd);
    injectTerminal(b, anodeSide, -equivalent);
    injectTerminal(b, net.partB[p], equivalent);
  }

  /** Stamps everything linear: resistors, trimmers, series resistances, sections, bias currents. */
  private void stampLinear(
      double[][] a, double[] b, SectionState[] states, boolean[] collapsedHint, double shunt) {
    for (int p = 0; p < net.value.length; p++) {
      if (net.junction[p] != null) {
        if (net.inner[p] >= 0) {
          stampTerminals(
              a, b, net.partA[p], -1 - net.inner[p], 1 / net.junction[p].figures.seriesOhms());
          if (shunt > 0) {
            a[net.inner[p]][net.inner[p]] += shunt;
          }
        }
      } else if (net.partW[p] >= 0) {
        stamp(
            a,
            b,
            net.partA[p],
            net.partW[p],
            1 / Math.max(net.value[p] * net.position[p], Network.MIN_OHMS));
        stamp(
            a,
            b,
            net.partW[p],
            net.partB[p],
            1 / Math.max(net.value[p] * (1 - net.position[p]), Network.MIN_OHMS));
      } else if (!net.capacitor[p]) {
        stamp(a, b, net.partA[p], net.partB[p], 1 / Math.max(net.value[p], Network.MIN_OHMS));
      }
    }
    if (shunt > 0) {
      for (int i = 0; i < net.nets.length; i++) {
        if (net.unknownOf[i] >= 0) {
          a[net.unknownOf[i]][net.unknownOf[i]] += shunt;
        }
      }
    }
    for (int k = 0; k < net.sections.length; k++) {
      if (net.sourceNode[k] >= 0) {
        stampToSource(a, b, net.out[k], net.sourceNode[k], 1 / net.params[k].outputResistance());
      }
      // Bias currents leave each input's net into the section.
      inject(b, net.inPlus[k], -net.params[k].biasPlus());
      inject(b, net.inMinus[k], -net.params[k].biasMinus());
    }
    for (int k = 0; k < net.sections.length; k++) {
      if (net.sourceNode[k] >= 0) {
        writeSectionRow(a, b, k, states[k], collapsedHint[k]);
      }
    }
  }

  /** The voltage at a terminal: a net index, or {@code -1 - u} for unknown u. */
  private double terminalVolts(double[] x, int terminal) {
    return terminal < 0 ? x[-1 - terminal] : net.volts(x, terminal);
  }

  /** The unknown of a terminal (a net index, or {@code -1 - u}), or -1 for a driven net. */
  private int terminalUnknown(int terminal) {
    return terminal < 0 ? -1 - terminal : net.unknownOf[terminal];
  }

  private void stampTerminals(double[][] a, double[] b, int t1, int t2, double g) {
    int i = terminalUnknown(t1);
    int j = terminalUnknown(t2);
    if (i >= 0) {
      a[i][i] += g;
      if (j >= 0) {
        a[i][j] -= g;
      } else {
        b[i] += g * net.driven[t2];
      }
    }
    if (j >= 0) {
      a[j][j] += g;
      if (i >= 0) {
        a[j][i] -= g;
      } else {
        b[j] += g * net.driven[t1];
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
    double[] r = new double[net.size];
    for (int p = 0; p < net.value.length; p++) {
      if (net.capacitor[p]) {
        continue;
      }
      if (net.junction[p] != null) {
        int anodeSide = net.partA[p];
        if (net.inner[p] >= 0) {
          anodeSide = -1 - net.inner[p];
          double series =
              (net.volts(x, net.partA[p]) - x[net.inner[p]]) / net.junction[p].figures.seriesOhms();
          flow(r, net.partA[p], anodeSide, series);
        }
        flow(r, anodeSide, net.partB[p], net.junction[p].current(net.junctionVolts(x, p)));
      } else if (net.partW[p] >= 0) {
        double upper = Math.max(net.value[p] * net.position[p], Network.MIN_OHMS);
        double lower = Math.max(net.value[p] * (1 - net.position[p]), Network.MIN_OHMS);
        flow(
            r,
            net.partA[p],
            net.partW[p],
            (net.volts(x, net.partA[p]) - net.volts(x, net.partW[p])) / upper);
        flow(
            r,
            net.partW[p],
            net.partB[p],
            (net.volts(x, net.partW[p]) - net.volts(x, net.partB[p])) / lower);
      } else {
        double current =
            (net.volts(x, net.partA[p]) - net.volts(x, net.partB[p]))
                / Math.max(net.value[p], Network.MIN_OHMS);
        flow(r, net.partA[p], net.partB[p], current);
      }
    }
    for (int k = 0; k < net.sections.length; k++) {
      inject(r, net.inPlus[k], -net.params[k].biasPlus());
      inject(r, net.inMinus[k], -net.params[k].biasMinus());
      int s = net.sourceNode[k];
      if (s < 0) {
        continue;
      }
      int o = net.unknownOf[net.out[k]];
      if (o >= 0) {
        r[o] -= (x[o] - x[s]) / net.params[k].outputResistance();
      }
      r[s] = sectionTarget(k, states[k], collapsed[k], x) - x[s];
    }
    return r;
  }

  /**
   * The value section k's state asks of its source at x: the constant of {@link
   * Network#sectionConstant} plus the terms of {@link Network#sectionTerms}, added in the same
   * order, without making their arrays.
   */
  private double sectionTarget(int k, SectionState state, boolean collapsed, double[] x) {
    double target = net.sectionConstant(k, state, collapsed);
    switch (state) {
      case LINEAR -> {
        double gain = net.params[k].gain();
        target += gain * net.volts(x, net.inPlus[k]);
        target += -gain * net.volts(x, net.inMinus[k]);
      }
      case HIGH, LOW -> {
        if (collapsed) {
          target += 0.5 * net.volts(x, net.vPlus[k]);
          target += 0.5 * net.volts(x, net.vMinus[k]);
        } else {
          target += 1 * net.volts(x, state == SectionState.HIGH ? net.vPlus[k] : net.vMinus[k]);
        }
      }
      default -> throw new IllegalStateException("a dead section has no source row");
    }
    return target;
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

  private void writeSectionRow(
      double[][] a, double[] b, int k, SectionState state, boolean collapsed) {
    int row = net.sourceNode[k];
    Arrays.fill(a[row], 0);
    a[row][row] = 1;
    b[row] = net.sectionConstant(k, state, collapsed);
    double[] coefficients = new double[3];
    int[] terms = net.sectionTerms(k, state, collapsed, coefficients);
    for (int t = 0; t < terms.length; t++) {
      int col = net.unknownOf[terms[t]];
      if (col >= 0) {
        a[row][col] -= coefficients[t];
      } else {
        b[row] += coefficients[t] * net.driven[terms[t]];
      }
    }
  }

  private void stamp(double[][] a, double[] b, int netA, int netB, double g) {
    int i = net.unknownOf[netA];
    int j = net.unknownOf[netB];
    if (i >= 0) {
      a[i][i] += g;
      if (j >= 0) {
        a[i][j] -= g;
      } else {
        b[i] += g * net.driven[netB];
      }
    }
    if (j >= 0) {
      a[j][j] += g;
      if (i >= 0) {
        a[j][i] -= g;
      } else {
        b[j] += g * net.driven[netA];
      }
    }
  }

  private void stampToSource(double[][] a, double[] b, int netIndex, int node, double g) {
    int i = net.unknownOf[netIndex];
    a[node][node] += g;
    if (i >= 0) {
      a[i][i] += g;
      a[i][node] -= g;
      a[node][i] -= g;
    } else {
      b[node] += g * net.driven[netIndex];
    }
  }

  private void inject(double[] b, int netIndex, double amps) {
    int i = net.unknownOf[netIndex];
    if (i >= 0) {
      b[i] += amps;
    }
  }
}

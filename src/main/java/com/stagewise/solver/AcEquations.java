package com.stagewise.solver;

import java.util.Arrays;

/** The small-signal AC equations of a {@link Network} about a DC state, in complex arithmetic. */
final class AcEquations {
  private final Network net;

  AcEquations(Network net) {
    this.net = net;
  }

  /**
   * Solves the small-signal AC system about a DC state at {@link Network#acHz}; returns {@code {re,
   * im}} per unknown, or null when singular. Inputs whose AC is at another frequency are AC ground.
   */
  double[][] solve(SectionState[] states, boolean[] collapsedHint, double[] dc) {
    Equations e = assemble(states, collapsedHint, dc);
    return ComplexLu.solve(e.ar, e.ai, e.br, e.bi);
  }

  /** The AC system's matrix {@code ar + j·ai} and right-hand side {@code br + j·bi}. */
  record Equations(double[][] ar, double[][] ai, double[] br, double[] bi) {}

  /** Assembles the small-signal AC system about a DC state, as {@link #solve} solves it. */
  Equations assemble(SectionState[] states, boolean[] collapsedHint, double[] dc) {
    double[][] ar = new double[net.size][net.size];
    double[][] ai = new double[net.size][net.size];
    double[] br = new double[net.size];
    double[] bi = new double[net.size];
    double omega = 2 * Math.PI * net.acHz;
    for (int p = 0; p < net.value.length; p++) {
      if (net.junction[p] != null) {
        // Small signal: the junction is its conductance at the DC point (a conducting diode its
        // dynamic resistance, an off one nearly open), in series with its series resistance.
        double gd = net.junction[p].evaluate(net.junctionVolts(dc, p))[1];
        if (net.inner[p] >= 0) {
          int node = -1 - net.inner[p];
          stampComplex(
              ar, ai, br, bi, net.partA[p], node, 1 / net.junction[p].figures.seriesOhms(), 0);
          stampComplex(ar, ai, br, bi, net.partB[p], node, gd, 0);
        } else {
          stampComplex(ar, ai, br, bi, net.partA[p], net.partB[p], gd, 0);
        }
      } else if (net.partW[p] >= 0) {
        stampComplex(
            ar,
            ai,
            br,
            bi,
            net.partA[p],
            net.partW[p],
            1 / Math.max(net.value[p] * net.position[p], Network.MIN_OHMS),
            0);
        stampComplex(
            ar,
            ai,
            br,
            bi,
            net.partW[p],
            net.partB[p],
            1 / Math.max(net.value[p] * (1 - net.position[p]), Network.MIN_OHMS),
            0);
      } else {
        double g = net.capacitor[p] ? 0 : 1 / Math.max(net.value[p], Network.MIN_OHMS);
        double susceptance = net.capacitor[p] ? omega * net.value[p] : 0;
        stampComplex(ar, ai, br, bi, net.partA[p], net.partB[p], g, susceptance);
      }
    }
    for (int k = 0; k < net.sections.length; k++) {
      if (net.sourceNode[k] >= 0) {
        stampComplex(
            ar,
            ai,
            br,
            bi,
            net.out[k],
            -1 - net.sourceNode[k],
            1 / net.params[k].outputResistance(),
            0);
      }
    }
    for (int k = 0; k < net.sections.length; k++) {
      if (net.sourceNode[k] < 0) {
        continue;
      }
      int row = net.sourceNode[k];
      Arrays.fill(ar[row], 0);
      Arrays.fill(ai[row], 0);
      br[row] = 0;
      bi[row] = 0;
      ar[row][row] = 1;
      double[] coefficients = new double[3];
      int[] terms = net.sectionTerms(k, states[k], collapsedHint[k], coefficients);
      for (int t = 0; t < terms.length; t++) {
        int col = net.unknownOf[terms[t]];
        if (col >= 0) {
          ar[row][col] -= coefficients[t];
        } else {
          br[row] += coefficients[t] * net.acSource[terms[t]];
        }
      }
    }
    return new Equations(ar, ai, br, bi);
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
    int i = net.unknownOf[netA];
    int j = netB < 0 ? -1 - netB : net.unknownOf[netB];
    double sourceB = netB < 0 ? 0 : net.acSource[netB];
    double sourceA = net.acSource[netA];
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

package com.stagewise.solver;

/**
 * The AC response after a change of one number, from the factors of the system before it: a
 * two-terminal part's value or a linear section's open-loop gain changes the AC matrix by a
 * rank-one term, {@code M′ = M + p·qᵀ} (and the right-hand side where a terminal is a driven net),
 * so by the Sherman–Morrison formula {@code x′ = z − w·(qᵀz)/(1 + qᵀw)} with {@code z = M⁻¹·b′} and
 * {@code w = M⁻¹·p}: two solves with the old factors in place of a new factorisation (Golub and Van
 * Loan, Matrix Computations, section 2.1.4).
 */
final class AcUpdate {
  /**
   * A denominator {@code 1 + qᵀw} smaller than this share of its terms means the changed matrix is
   * (nearly) singular, where the update loses its digits: the caller then solves in full.
   */
  private static final double CANCELLATION = 1e-8;

  /**
   * Largest ratio of the update's terms to its result: each decade of cancellation costs one digit
   * of the 16, and a tolerance-sized change stays near 1.
   */
  private static final double GROWTH = 100;

  private final Network network;
  private final SectionState[] states;
  private final ComplexLu.Factors factors;
  private final double[] br;
  private final double[] bi;
  private double[][] before;

  private AcUpdate(
      Network network, SectionState[] states, ComplexLu.Factors factors, double[] br, double[] bi) {
    this.network = network;
    this.states = states;
    this.factors = factors;
    this.br = br;
    this.bi = bi;
  }

  /**
   * Factorises the AC system of a network about a DC state; null when it has no AC analysis or the
   * system is singular there.
   */
  static AcUpdate of(Network network, SectionState[] states, boolean[] collapsed, double[] dc) {
    if (network.acHz == 0) {
      return null;
    }
    AcEquations.Equations e = new AcEquations(network).assemble(states, collapsed, dc);
    ComplexLu.Factors factors = ComplexLu.factor(e.ar(), e.ai());
    return factors == null ? null : new AcUpdate(network, states, factors, e.br(), e.bi());
  }

  /**
   * Returns {@code {re, im}} per unknown after a change, or null when this change is not a rank-one
   * update (a trimmer, a junction, a section's output resistance, a clamped section's gain) or the
   * update would lose its digits: the caller then solves in full. The network holds the numbers
   * before the change.
   */
  double[][] solve(Change change) {
    int n = network.size;
    double[] pr = new double[n];
    double[] pi = new double[n];
    double[] q = new double[n];
    double[] dbr = br.clone();
    double[] dbi = bi.clone();
    if (change instanceof Change.PartValue v) {
      int p = partIndex(v.ref());
      if (p < 0 || network.junction[p] != null || network.partW[p] >= 0) {
        return null;
      }
      // The admittance between the part's nets before and after: g for a resistor, jωC for a
      // capacitor (as AcEquations stamps them).
      double omega = 2 * Math.PI * network.acHz;
      double dr = 0;
      double di = 0;
      if (network.capacitor[p]) {
        di = omega * (v.value() - network.value[p]);
      } else {
        dr =
            1 / Math.max(v.value(), Network.MIN_OHMS)
                - 1 / Math.max(network.value[p], Network.MIN_OHMS);
      }
      int a = network.unknownOf[network.partA[p]];
      int b = network.unknownOf[network.partB[p]];
      // M′ = M + δy·u·uᵀ with u = e_a − e_b over the unknowns; a driven terminal feeds δy·v_s
      // into the other side's row instead.
      if (a >= 0) {
        pr[a] += dr;
        pi[a] += di;
        q[a] += 1;
      }
      if (b >= 0) {
        pr[b] -= dr;
        pi[b] -= di;
        q[b] -= 1;
      }
      if (a >= 0 && b < 0) {
        double source = network.acSource[network.partB[p]];
        dbr[a] += dr * source;
        dbi[a] += di * source;
      }
      if (b >= 0 && a < 0) {
        double source = network.acSource[network.partA[p]];
        dbr[b] += dr * source;
        dbi[b] += di * source;
      }
    } else if (change instanceof Change.Device d) {
      int k = sectionIndex(d.section());
      DeviceParams now = network.params[k];
      int s = network.sourceNode[k];
      if (s < 0
          || d.params().outputResistance() != now.outputResistance()
          || states[k] != SectionState.LINEAR) {
        return null;
      }
      // The source row reads v_s − A·(v+ − v−) = A·offset: a change of A adds e_s·vᵀ with v = −δA
      // at v+ and +δA at v− (a driven input moves the right-hand side instead).
      double delta = d.params().gain() - now.gain();
      pr[s] = 1;
      addTerm(q, dbr, dbi, s, network.inPlus[k], -delta);
      addTerm(q, dbr, dbi, s, network.inMinus[k], delta);
    } else {
      return null;
    }
    // z = M⁻¹·b′: the response before the change where the right-hand side stays as it was.
    double[][] z = changesRightHandSide(dbr, dbi) ? factors.solve(dbr, dbi) : unchanged();
    double[][] w = factors.solve(pr, pi);
    // qᵀz and qᵀw (q is real).
    double qzr = 0;
    double qzi = 0;
    double qwr = 0;
    double qwi = 0;
    double size = 0;
    for (int i = 0; i < n; i++) {
      if (q[i] != 0) {
        qzr += q[i] * z[0][i];
        qzi += q[i] * z[1][i];
        qwr += q[i] * w[0][i];
        qwi += q[i] * w[1][i];
        size += Math.abs(q[i] * w[0][i]) + Math.abs(q[i] * w[1][i]);
      }
    }
    double denr = 1 + qwr;
    double deni = qwi;
    if (Math.abs(denr) + Math.abs(deni) < CANCELLATION * (1 + size)) {
      return null;
    }
    // ratio = qᵀz / (1 + qᵀw), complex.
    double den = denr * denr + deni * deni;
    double rr = (qzr * denr + qzi * deni) / den;
    double ri = (qzi * denr - qzr * deni) / den;
    double[] xr = new double[n];
    double[] xi = new double[n];
    double terms = 0;
    double result = 0;
    for (int i = 0; i < n; i++) {
      double cr = w[0][i] * rr - w[1][i] * ri;
      double ci = w[0][i] * ri + w[1][i] * rr;
      xr[i] = z[0][i] - cr;
      xi[i] = z[1][i] - ci;
      terms = Math.max(terms, Math.hypot(z[0][i], z[1][i]) + Math.hypot(cr, ci));
      result = Math.max(result, Math.hypot(xr[i], xi[i]));
    }
    // A large change (a part shorted or opened) makes z and the correction nearly cancel: beyond
    // GROWTH the update would lose more digits than a fresh factorisation, so solve in full.
    return terms > GROWTH * result ? null : new double[][] {xr, xi};
  }

  private boolean changesRightHandSide(double[] dbr, double[] dbi) {
    return !java.util.Arrays.equals(dbr, br) || !java.util.Arrays.equals(dbi, bi);
  }

  /** The response before any change ({@code {re, im}} per unknown), solved once and kept. */
  double[][] unchanged() {
    if (before == null) {
      before = factors.solve(br, bi);
    }
    return before;
  }

  /** Adds coefficient c of net {@code net} in row s: into q, or the right-hand side if driven. */
  private void addTerm(double[] q, double[] dbr, double[] dbi, int s, int net, double c) {
    int col = network.unknownOf[net];
    if (col >= 0) {
      q[col] += c;
    } else {
      // A driven net's term sits on the right-hand side with the opposite sign.
      dbr[s] -= c * network.acSource[net];
    }
  }

  private int partIndex(String ref) {
    for (int p = 0; p < network.partRefs.length; p++) {
      if (network.partRefs[p].equals(ref)) {
        return p;
      }
    }
    return -1;
  }

  private int sectionIndex(String ref) {
    for (int k = 0; k < network.sections.length; k++) {
      if (network.sections[k].ref().equals(ref)) {
        return k;
      }
    }
    throw new IllegalArgumentException("the stage has no section " + ref);
  }
}

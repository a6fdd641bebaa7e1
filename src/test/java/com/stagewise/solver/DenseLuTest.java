package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.CommonOps_ZDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;

/**
 * Our LU factorisation and complex solve against EJML 0.46.1 (an independent, widely used Java
 * linear-algebra library) as the oracle, on seeded random systems shaped like a stage's
 * (conductances from 1 nS to 1 kS, gain rows near 1e5) and on a textbook worked example.
 */
class DenseLuTest {
  /**
   * Two backward-stable solvers agree to about the condition number times the machine epsilon (the
   * textbook forward-error bound of Gaussian elimination with partial pivoting); this is that
   * factor, with room for the growth factor.
   */
  private static final double EPSILONS = 1e4 * Math.ulp(1.0);

  private static final Random RANDOM = new Random(20261202);

  @Nested
  class Real {
    @Test
    void textbookExample_givesItsKnownSolution() {
      // The worked example of Gaussian elimination with partial pivoting found in most numerical
      // analysis textbooks: 2x + y − z = 8, −3x − y + 2z = −11, −2x + y + 2z = −3 → (2, 3, −1).
      double[][] a = {{2, 1, -1}, {-3, -1, 2}, {-2, 1, 2}};
      double[] x = DenseLu.factor(a).solve(new double[] {8, -11, -3});
      assertThat(x[0]).isCloseTo(2, within(1e-12));
      assertThat(x[1]).isCloseTo(3, within(1e-12));
      assertThat(x[2]).isCloseTo(-1, within(1e-12));
    }

    @Test
    void stageShapedSystems_agreeWithEjml() {
      int checked = 0;
      for (int trial = 0; trial < 300; trial++) {
        int n = 2 + RANDOM.nextInt(40);
        double[][] a = stageShaped(n);
        double[] b = vector(n);
        DMatrixRMaj oracle = new DMatrixRMaj(a);
        DMatrixRMaj expected = new DMatrixRMaj(n, 1);
        assertThat(CommonOps_DDRM.solve(oracle, new DMatrixRMaj(n, 1, true, b), expected)).isTrue();
        DenseLu.Factors factors = DenseLu.factor(copy(a));
        assertThat(factors).as("trial %d, n %d", trial, n).isNotNull();
        double[] x = factors.solve(b);
        double[] e = new double[n];
        for (int i = 0; i < n; i++) {
          e[i] = expected.get(i, 0);
        }
        double condition = rowScaledCondition(a);
        if (!meaningful(condition)) {
          continue;
        }
        assertAgree(x, e, condition, "trial " + trial);
        checked++;
      }
      assertThat(checked).as("well-conditioned trials").isGreaterThan(150);
    }

    @Test
    void inverseDiagonal_agreesWithEjmlsInverse() {
      int checked = 0;
      for (int trial = 0; trial < 100; trial++) {
        int n = 2 + RANDOM.nextInt(25);
        double[][] a = stageShaped(n);
        DMatrixRMaj inverse = new DMatrixRMaj(a);
        assertThat(CommonOps_DDRM.invert(inverse)).isTrue();
        DenseLu.Factors factors = DenseLu.factor(copy(a));
        double condition = rowScaledCondition(a);
        if (!meaningful(condition)) {
          continue;
        }
        checked++;
        // Entry (k, k) of the inverse is the k-th entry of the solution for the k-th unit vector.
        for (int k = 0; k < n; k++) {
          double[] column = new double[n];
          for (int i = 0; i < n; i++) {
            column[i] = inverse.get(i, k);
          }
          double[] ours = column.clone();
          ours[k] = factors.inverseDiagonal(k);
          assertAgree(ours, column, condition, "trial " + trial + " k " + k);
        }
      }
      assertThat(checked).as("well-conditioned trials").isGreaterThan(50);
    }

    @Test
    void factorsSolveSeveralRightHandSides_withoutChangingThem() {
      double[][] a = stageShaped(12);
      DenseLu.Factors factors = DenseLu.factor(copy(a));
      for (int r = 0; r < 5; r++) {
        double[] b = vector(12);
        double[] kept = b.clone();
        double[] x = factors.solve(b);
        assertThat(b).containsExactly(kept);
        // The residual a·x − b, checked directly: no oracle needed.
        for (int i = 0; i < 12; i++) {
          double sum = 0;
          double scale = 0;
          for (int j = 0; j < 12; j++) {
            sum += a[i][j] * x[j];
            scale += Math.abs(a[i][j] * x[j]);
          }
          assertThat(Math.abs(sum - b[i])).isLessThanOrEqualTo(1e-12 * (scale + Math.abs(b[i])));
        }
      }
    }

    @Test
    void tridiagonalPoisson_givesTheClosedFormSolution() {
      // The second-difference system of the textbook finite-difference Poisson problem, −x(i−1) +
      // 2·x(i) − x(i+1) = 1 with x(0) = x(n+1) = 0, has x(i) = i·(n + 1 − i)/2 (the discrete
      // parabola, as in numerical analysis textbooks). Sparse like a chain's nodal matrix: the
      // factors keep only the non-zero entries, and the answer must not notice.
      int n = 60;
      double[][] a = new double[n][n];
      double[] b = new double[n];
      for (int i = 0; i < n; i++) {
        a[i][i] = 2;
        if (i > 0) {
          a[i][i - 1] = -1;
        }
        if (i < n - 1) {
          a[i][i + 1] = -1;
        }
        b[i] = 1;
      }
      DenseLu.Factors factors = DenseLu.factor(a);
      double[] x = factors.solve(b);
      for (int i = 1; i <= n; i++) {
        assertThat(x[i - 1]).as("x(%d)", i).isCloseTo(i * (n + 1.0 - i) / 2, within(1e-9));
      }
      // The inverse's diagonal of the same matrix: (K⁻¹)ᵢᵢ = i·(n + 1 − i)/(n + 1).
      for (int i = 1; i <= n; i += 7) {
        assertThat(factors.inverseDiagonal(i - 1))
            .as("inverse (%d, %d)", i, i)
            .isCloseTo(i * (n + 1.0 - i) / (n + 1), within(1e-9));
      }
    }

    @Test
    void singularMatrix_isNull() {
      double[][] dependent = {{1, 2, 3}, {2, 4, 6}, {1, 0, 1}};
      assertThat(DenseLu.factor(dependent)).isNull();
      double[][] zeroRow = {{1, 2}, {0, 0}};
      assertThat(DenseLu.factor(zeroRow)).isNull();
    }
  }

  @Nested
  class Complex {
    @Test
    void stageShapedSystems_agreeWithEjml() {
      int checked = 0;
      for (int trial = 0; trial < 300; trial++) {
        int n = 2 + RANDOM.nextInt(40);
        double[][] ar = stageShaped(n);
        double[][] ai = susceptances(n);
        double[] br = vector(n);
        double[] bi = vector(n);
        double[][] x = ComplexLu.solve(copy(ar), copy(ai), br.clone(), bi.clone());
        if (agreesWithEjml(ar, ai, br, bi, x, trial)) {
          checked++;
        }
      }
      assertThat(checked).as("well-conditioned trials").isGreaterThan(150);
    }

    @Test
    void keptFactors_agreeWithEjml() {
      int checked = 0;
      for (int trial = 0; trial < 100; trial++) {
        int n = 2 + RANDOM.nextInt(40);
        double[][] ar = stageShaped(n);
        double[][] ai = susceptances(n);
        double[] br = vector(n);
        double[] bi = vector(n);
        ComplexLu.Factors factors = ComplexLu.factor(copy(ar), copy(ai));
        assertThat(factors).as("trial %d", trial).isNotNull();
        if (agreesWithEjml(ar, ai, br, bi, factors.solve(br, bi), trial)) {
          checked++;
        }
      }
      assertThat(checked).as("well-conditioned trials").isGreaterThan(50);
    }

    @Test
    void keptFactors_giveTheOneShotSolvesBits() {
      // The same pivots and the same sums in the same order: the kept factors' solve is the
      // one-shot elimination's to the last bit, which lets the diagnosis take a response with no
      // change from the factors it keeps for the changes (the one-shot solve is checked against
      // EJML above).
      for (int trial = 0; trial < 200; trial++) {
        int n = 2 + RANDOM.nextInt(40);
        double[][] ar = stageShaped(n);
        double[][] ai = susceptances(n);
        double[] br = vector(n);
        double[] bi = vector(n);
        double[][] once = ComplexLu.solve(copy(ar), copy(ai), br.clone(), bi.clone());
        ComplexLu.Factors factors = ComplexLu.factor(copy(ar), copy(ai));
        assertThat(factors == null).as("trial %d", trial).isEqualTo(once == null);
        if (once == null) {
          continue;
        }
        double[][] kept = factors.solve(br, bi);
        for (int part = 0; part < 2; part++) {
          for (int i = 0; i < n; i++) {
            assertThat(Double.doubleToRawLongBits(kept[part][i]))
                .as("trial %d, unknown %d", trial, i)
                .isEqualTo(Double.doubleToRawLongBits(once[part][i]));
          }
        }
      }
    }

    /**
     * Checks our solution x of (ar + j·ai)·x = br + j·bi against EJML's, within what the system's
     * condition allows; false when the system is too ill-conditioned for a comparison to mean
     * anything.
     */
    private boolean agreesWithEjml(
        double[][] ar, double[][] ai, double[] br, double[] bi, double[][] x, int trial) {
      int n = br.length;
      assertThat(x).as("trial %d", trial).isNotNull();
      ZMatrixRMaj a = new ZMatrixRMaj(n, n);
      ZMatrixRMaj b = new ZMatrixRMaj(n, 1);
      for (int i = 0; i < n; i++) {
        for (int j = 0; j < n; j++) {
          a.set(i, j, ar[i][j], ai[i][j]);
        }
        b.set(i, 0, br[i], bi[i]);
      }
      ZMatrixRMaj expected = new ZMatrixRMaj(n, 1);
      assertThat(CommonOps_ZDRM.solve(a, b, expected)).isTrue();
      // The complex system as the real one of twice the size [[Ar, −Ai], [Ai, Ar]]: same
      // condition number.
      DMatrixRMaj twice = new DMatrixRMaj(2 * n, 2 * n);
      double[] ours = new double[2 * n];
      double[] theirs = new double[2 * n];
      for (int i = 0; i < n; i++) {
        for (int j = 0; j < n; j++) {
          twice.set(i, j, ar[i][j]);
          twice.set(i, n + j, -ai[i][j]);
          twice.set(n + i, j, ai[i][j]);
          twice.set(n + i, n + j, ar[i][j]);
        }
        ours[i] = x[0][i];
        ours[n + i] = x[1][i];
        theirs[i] = expected.getReal(i, 0);
        theirs[n + i] = expected.getImag(i, 0);
      }
      double condition = rowScaledCondition(twice);
      if (!meaningful(condition)) {
        return false;
      }
      assertAgree(ours, theirs, condition, "trial " + trial);
      return true;
    }

    @Test
    void seriesRc_givesTheTextbookDivider() {
      // One node between a 1 kΩ resistor from a 1 V source and a 159.155 nF capacitor to ground at
      // 1 kHz: the corner frequency, so |v| = 1/√2 at −45° (the first-order low-pass of every
      // circuits textbook).
      double g = 1e-3;
      double b = 2 * Math.PI * 1000 * 159.155e-9;
      double[][] x =
          ComplexLu.solve(
              new double[][] {{g}}, new double[][] {{b}}, new double[] {g}, new double[] {0});
      Phasor p = Phasor.of(x[0][0], x[1][0]);
      assertThat(p.amplitude()).isCloseTo(1 / Math.sqrt(2), within(1e-5));
      assertThat(p.phaseDegrees()).isCloseTo(-45, within(1e-3));
    }

    @Test
    void singularMatrix_isNull() {
      double[][] ar = {{1, 1}, {1, 1}};
      double[][] ai = {{1, 1}, {1, 1}};
      assertThat(ComplexLu.solve(ar, ai, new double[] {1, 0}, new double[] {0, 0})).isNull();
    }
  }

  /**
   * The condition number of the matrix with each row scaled to a largest entry of 1: scaling rows
   * leaves the solution alone, and both solvers' errors follow this figure, not the raw one (gain
   * rows near 1e5 beside conductances near 1e-7 make the raw figure meaninglessly large).
   */
  private static double rowScaledCondition(double[][] a) {
    return rowScaledCondition(new DMatrixRMaj(a));
  }

  private static double rowScaledCondition(DMatrixRMaj a) {
    DMatrixRMaj scaled = a.copy();
    for (int i = 0; i < scaled.numRows; i++) {
      double max = 0;
      for (int j = 0; j < scaled.numCols; j++) {
        max = Math.max(max, Math.abs(scaled.get(i, j)));
      }
      for (int j = 0; j < scaled.numCols; j++) {
        scaled.set(i, j, scaled.get(i, j) / max);
      }
    }
    return NormOps_DDRM.conditionP2(scaled);
  }

  /** Whether a system is conditioned well enough for the agreement bound to say anything. */
  private static boolean meaningful(double condition) {
    return EPSILONS * condition < 1e-6;
  }

  /** Norm-wise agreement within the forward-error bound for the given condition number. */
  private static void assertAgree(
      double[] actual, double[] expected, double condition, String what) {
    double difference = 0;
    double size = 0;
    for (int i = 0; i < actual.length; i++) {
      difference += (actual[i] - expected[i]) * (actual[i] - expected[i]);
      size += expected[i] * expected[i];
    }
    assertThat(Math.sqrt(difference))
        .as("%s (condition number %.3g)", what, condition)
        .isLessThanOrEqualTo(EPSILONS * condition * Math.sqrt(size));
  }

  /**
   * A random matrix shaped like a stage's nodal matrix: conductances of 100 nS … 100 mS (10 Ω … 10
   * MΩ) between random pairs, and a few source rows with gains near 1e5, made non-singular by a
   * path to ground.
   */
  private static double[][] stageShaped(int n) {
    double[][] a = new double[n][n];
    for (int i = 0; i < n; i++) {
      a[i][i] += Math.pow(10, -7 + 6 * RANDOM.nextDouble());
    }
    for (int e = 0; e < 2 * n; e++) {
      int i = RANDOM.nextInt(n);
      int j = RANDOM.nextInt(n);
      if (i == j) {
        continue;
      }
      double g = Math.pow(10, -7 + 6 * RANDOM.nextDouble());
      a[i][i] += g;
      a[j][j] += g;
      a[i][j] -= g;
      a[j][i] -= g;
    }
    int sources = Math.min(3, n / 4);
    for (int s = 0; s < sources; s++) {
      int row = n - 1 - s;
      java.util.Arrays.fill(a[row], 0);
      a[row][row] = 1;
      double gain = 1e5 * (0.5 + RANDOM.nextDouble());
      a[row][RANDOM.nextInt(n - sources)] -= gain;
      a[row][RANDOM.nextInt(n - sources)] += gain;
    }
    return a;
  }

  private static double[][] susceptances(int n) {
    double[][] a = new double[n][n];
    for (int e = 0; e < n; e++) {
      int i = RANDOM.nextInt(n);
      int j = RANDOM.nextInt(n);
      double b = Math.pow(10, -7 + 4 * RANDOM.nextDouble());
      a[i][i] += b;
      if (i != j) {
        a[j][j] += b;
        a[i][j] -= b;
        a[j][i] -= b;
      }
    }
    return a;
  }

  private static double[] vector(int n) {
    double[] b = new double[n];
    for (int i = 0; i < n; i++) {
      b[i] = 2 * RANDOM.nextDouble() - 1;
    }
    return b;
  }

  private static double[][] copy(double[][] a) {
    double[][] c = new double[a.length][];
    for (int i = 0; i < a.length; i++) {
      c[i] = a[i].clone();
    }
    return c;
  }
}

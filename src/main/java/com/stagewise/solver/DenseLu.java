package com.stagewise.solver;

/**
 * Gaussian elimination with partial pivoting for the small dense systems of one stage (tens of
 * unknowns), in real and complex arithmetic.
 */
final class DenseLu {
  /**
   * Pivots smaller than this fraction of the largest entry of their column's original scale mark
   * the system as singular. Stage matrices mix conductances near 1e-9 S (open parts) with gain rows
   * near 1e6, so the test is relative to each row's largest entry.
   */
  private static final double SINGULAR = 1e-15;

  private DenseLu() {}

  /**
   * An LU factorisation of a real matrix with partial pivoting, for solving with several right-hand
   * sides.
   */
  static final class Factors {
    private final double[][] lu;
    private final int[] order;

    /**
     * Per row, the columns left of the diagonal that hold a non-zero entry of L, in increasing
     * order: entries {@code lowerStart[i]} (inclusive) to {@code lowerEnd[i]} (exclusive) of {@code
     * lowerColumns}, noted during elimination as each multiplier is stored. A stage's matrix is
     * sparse (a net meets a few parts), so the substitutions run over these alone; the terms left
     * out are exactly zero, so every sum is the same as over the whole row.
     */
    private final int[] lowerColumns;

    private final int[] lowerStart;
    private final int[] lowerEnd;

    /**
     * Per row, the columns right of the diagonal that hold a non-zero entry of U, in increasing
     * order: the pivot row's columns that the elimination used, or (where no row below needed them)
     * found at the end of the elimination.
     */
    private final int[][] upper;

    /** Entries of the inverse's diagonal found so far (NaN: not yet), kept for repeated tests. */
    private double[] inverseDiagonal;

    private Factors(
        double[][] lu,
        int[] order,
        int[] lowerColumns,
        int[] lowerStart,
        int[] lowerEnd,
        int[][] upper) {
      this.lu = lu;
      this.order = order;
      this.lowerColumns = lowerColumns;
      this.lowerStart = lowerStart;
      this.lowerEnd = lowerEnd;
      this.upper = upper;
    }

    /** Returns x with {@code a·x = b} for the factorised a; b is not changed. */
    double[] solve(double[] b) {
      int n = order.length;
      double[] y = new double[n];
      for (int i = 0; i < n; i++) {
        double sum = b[order[i]];
        double[] row = lu[i];
        for (int p = lowerStart[i], end = lowerEnd[i]; p < end; p++) {
          int j = lowerColumns[p];
          sum -= row[j] * y[j];
        }
        y[i] = sum;
      }
      for (int i = n - 1; i >= 0; i--) {
        double sum = y[i];
        double[] row = lu[i];
        for (int j : upper[i]) {
          sum -= row[j] * y[j];
        }
        y[i] = sum / row[i];
      }
      return y;
    }

    /**
     * Returns entry (k, k) of the inverse matrix: the k-th unknown of {@code a·x = e_k}. The same
     * sums as {@link #solve} with the unit vector, less the terms that are exactly zero: forward
     * substitution starts at the row that holds the unit, back substitution stops at row k. Kept
     * once found (the saturation search asks again for every section at every settled state).
     */
    double inverseDiagonal(int k) {
      int n = order.length;
      if (inverseDiagonal == null) {
        inverseDiagonal = new double[n];
        java.util.Arrays.fill(inverseDiagonal, Double.NaN);
      } else if (!Double.isNaN(inverseDiagonal[k])) {
        return inverseDiagonal[k];
      }
      int first = 0;
      while (order[first] != k) {
        first++;
      }
      double[] y = new double[n];
      for (int i = first; i < n; i++) {
        double sum = i == first ? 1 : 0;
        double[] row = lu[i];
        for (int p = lowerStart[i], end = lowerEnd[i]; p < end; p++) {
          int j = lowerColumns[p];
          if (j >= first) {
            sum -= row[j] * y[j];
          }
        }
        y[i] = sum;
      }
      for (int i = n - 1; i >= k; i--) {
        double sum = y[i];
        double[] row = lu[i];
        for (int j : upper[i]) {
          sum -= row[j] * y[j];
        }
        y[i] = sum / row[i];
      }
      inverseDiagonal[k] = y[k];
      return y[k];
    }
  }

  /** Factorises {@code a} in place and returns the factors, or null when the matrix is singular. */
  static Factors factor(double[][] a) {
    int n = a.length;
    double[] rowScale = new double[n];
    int[] order = new int[n];
    for (int i = 0; i < n; i++) {
      order[i] = i;
      double max = 0;
      for (int j = 0; j < n; j++) {
        max = Math.max(max, Math.abs(a[i][j]));
      }
      if (max == 0) {
        return null;
      }
      rowScale[i] = 1 / max;
    }
    // L's non-zero columns per row, noted as the multipliers are stored: row array r (by its
    // original position, which moves with it when rows swap) keeps its columns at r·n onwards.
    int[] lowerColumns = new int[n * n];
    int[] lowerCount = new int[n];
    int[] slot = order.clone();
    int[][] upper = new int[n][];
    for (int col = 0; col < n; col++) {
      int pivot = col;
      double best = Math.abs(a[col][col]) * rowScale[col];
      for (int row = col + 1; row < n; row++) {
        double size = Math.abs(a[row][col]) * rowScale[row];
        if (size > best) {
          best = size;
          pivot = row;
        }
      }
      if (best < SINGULAR) {
        return null;
      }
      if (pivot != col) {
        double[] r = a[col];
        a[col] = a[pivot];
        a[pivot] = r;
        double t = rowScale[col];
        rowScale[col] = rowScale[pivot];
        rowScale[pivot] = t;
        int o = order[col];
        order[col] = order[pivot];
        order[pivot] = o;
        o = slot[col];
        slot[col] = slot[pivot];
        slot[pivot] = o;
      }
      double[] pivotRow = a[col];
      // Only the pivot row's non-zero entries change the rows below (the rest would subtract 0);
      // found when a row below needs them. The pivot row is final from here on, so they are also
      // its columns of U.
      int[] columns = null;
      for (int row = col + 1; row < n; row++) {
        double[] target = a[row];
        double factor = target[col] / pivotRow[col];
        target[col] = factor;
        if (factor != 0) {
          if (columns == null) {
            columns = nonZero(pivotRow, col + 1, n);
          }
          for (int j : columns) {
            target[j] -= factor * pivotRow[j];
          }
          int s = slot[row];
          lowerColumns[s * n + lowerCount[s]++] = col;
        }
      }
      upper[col] = columns;
    }
    int[] lowerStart = new int[n];
    int[] lowerEnd = new int[n];
    for (int i = 0; i < n; i++) {
      lowerStart[i] = slot[i] * n;
      lowerEnd[i] = lowerStart[i] + lowerCount[slot[i]];
      if (upper[i] == null) {
        upper[i] = nonZero(a[i], i + 1, n);
      }
    }
    return new Factors(a, order, lowerColumns, lowerStart, lowerEnd, upper);
  }

  /**
   * An LU factorisation of a complex matrix with partial pivoting (the same pivots as {@link
   * #solveComplex}), for solving with several right-hand sides.
   */
  static final class ComplexFactors {
    private final double[][] re;
    private final double[][] im;
    private final int[] order;

    /**
     * Per row, the non-zero columns of L and of U, as in {@link Factors}: L's noted as the
     * multipliers are stored, U's as the pivot row's columns that the elimination used.
     */
    private final int[][] lower;

    private final int[][] upper;

    private ComplexFactors(
        double[][] re, double[][] im, int[] order, int[][] lower, int[][] upper) {
      this.re = re;
      this.im = im;
      this.order = order;
      this.lower = lower;
      this.upper = upper;
    }

    /** Returns {@code {re, im}} of x with {@code a·x = br + j·bi}; b is not changed. */
    double[][] solve(double[] br, double[] bi) {
      int n = order.length;
      double[] yr = new double[n];
      double[] yi = new double[n];
      for (int i = 0; i < n; i++) {
        double sr = br[order[i]];
        double si = bi[order[i]];
        double[] lr = re[i];
        double[] li = im[i];
        for (int j : lower[i]) {
          sr -= lr[j] * yr[j] - li[j] * yi[j];
          si -= lr[j] * yi[j] + li[j] * yr[j];
        }
        yr[i] = sr;
        yi[i] = si;
      }
      for (int i = n - 1; i >= 0; i--) {
        double sr = yr[i];
        double si = yi[i];
        double[] ur = re[i];
        double[] ui = im[i];
        for (int j : upper[i]) {
          sr -= ur[j] * yr[j] - ui[j] * yi[j];
          si -= ur[j] * yi[j] + ui[j] * yr[j];
        }
        double dr = ur[i];
        double di = ui[i];
        double d = dr * dr + di * di;
        yr[i] = (sr * dr + si * di) / d;
        yi[i] = (si * dr - sr * di) / d;
      }
      return new double[][] {yr, yi};
    }
  }

  /**
   * Factorises the complex matrix {@code ar + j·ai} in place and returns the factors, or null when
   * it is singular (by the same test as {@link #solveComplex}).
   */
  static ComplexFactors factorComplex(double[][] ar, double[][] ai) {
    int n = ar.length;
    double[] rowScale = new double[n];
    int[] order = new int[n];
    for (int i = 0; i < n; i++) {
      order[i] = i;
      double max = 0;
      for (int j = 0; j < n; j++) {
        max = Math.max(max, Math.abs(ar[i][j]) + Math.abs(ai[i][j]));
      }
      if (max == 0) {
        return null;
      }
      rowScale[i] = 1 / max;
    }
    // L's non-zero columns per row, noted as in factor.
    int[] lowerColumns = new int[n * n];
    int[] lowerCount = new int[n];
    int[] slot = order.clone();
    int[][] upper = new int[n][];
    for (int col = 0; col < n; col++) {
      int pivot = col;
      double best = (Math.abs(ar[col][col]) + Math.abs(ai[col][col])) * rowScale[col];
      for (int row = col + 1; row < n; row++) {
        double size = (Math.abs(ar[row][col]) + Math.abs(ai[row][col])) * rowScale[row];
        if (size > best) {
          best = size;
          pivot = row;
        }
      }
      if (best < SINGULAR) {
        return null;
      }
      if (pivot != col) {
        double[] r = ar[col];
        ar[col] = ar[pivot];
        ar[pivot] = r;
        r = ai[col];
        ai[col] = ai[pivot];
        ai[pivot] = r;
        double t = rowScale[col];
        rowScale[col] = rowScale[pivot];
        rowScale[pivot] = t;
        int o = order[col];
        order[col] = order[pivot];
        order[pivot] = o;
        o = slot[col];
        slot[col] = slot[pivot];
        slot[pivot] = o;
      }
      double pr = ar[col][col];
      double pi = ai[col][col];
      double denominator = pr * pr + pi * pi;
      // The pivot row is final from here on: its non-zero columns are also its columns of U.
      int[] columns = nonZero(ar[col], ai[col], col + 1, n);
      upper[col] = columns;
      for (int row = col + 1; row < n; row++) {
        double fr = (ar[row][col] * pr + ai[row][col] * pi) / denominator;
        double fi = (ai[row][col] * pr - ar[row][col] * pi) / denominator;
        ar[row][col] = fr;
        ai[row][col] = fi;
        if (fr == 0 && fi == 0) {
          continue;
        }
        for (int j : columns) {
          double xr = ar[col][j];
          double xi = ai[col][j];
          ar[row][j] -= fr * xr - fi * xi;
          ai[row][j] -= fr * xi + fi * xr;
        }
        int s = slot[row];
        lowerColumns[s * n + lowerCount[s]++] = col;
      }
    }
    int[][] lower = new int[n][];
    for (int i = 0; i < n; i++) {
      int start = slot[i] * n;
      lower[i] = java.util.Arrays.copyOfRange(lowerColumns, start, start + lowerCount[slot[i]]);
    }
    return new ComplexFactors(ar, ai, order, lower, upper);
  }

  /**
   * Solves the complex system {@code (ar + j·ai)·x = br + j·bi} in place and returns {@code {re,
   * im}}, or null when the matrix is singular.
   */
  static double[][] solveComplex(double[][] ar, double[][] ai, double[] br, double[] bi) {
    int n = br.length;
    double[] rowScale = new double[n];
    for (int i = 0; i < n; i++) {
      double max = 0;
      for (int j = 0; j < n; j++) {
        max = Math.max(max, Math.abs(ar[i][j]) + Math.abs(ai[i][j]));
      }
      if (max == 0) {
        return null;
      }
      rowScale[i] = 1 / max;
    }
    int[][] pivotColumns = new int[n][];
    for (int col = 0; col < n; col++) {
      int pivot = col;
      double best = (Math.abs(ar[col][col]) + Math.abs(ai[col][col])) * rowScale[col];
      for (int row = col + 1; row < n; row++) {
        double size = (Math.abs(ar[row][col]) + Math.abs(ai[row][col])) * rowScale[row];
        if (size > best) {
          best = size;
          pivot = row;
        }
      }
      if (best < SINGULAR) {
        return null;
      }
      swap(ar, br, rowScale, col, pivot);
      swap(ai, bi, col, pivot);
      double pr = ar[col][col];
      double pi = ai[col][col];
      double denominator = pr * pr + pi * pi;
      // The pivot row is final from here on: its non-zero columns serve the back substitution
      // too (the first is the pivot itself, which is not zero).
      int[] columns = nonZero(ar[col], ai[col], col, n);
      pivotColumns[col] = columns;
      for (int row = col + 1; row < n; row++) {
        // factor = a[row][col] / pivot, in complex arithmetic
        double fr = (ar[row][col] * pr + ai[row][col] * pi) / denominator;
        double fi = (ai[row][col] * pr - ar[row][col] * pi) / denominator;
        if (fr == 0 && fi == 0) {
          continue;
        }
        for (int j : columns) {
          double xr = ar[col][j];
          double xi = ai[col][j];
          ar[row][j] -= fr * xr - fi * xi;
          ai[row][j] -= fr * xi + fi * xr;
        }
        double yr = br[col];
        double yi = bi[col];
        br[row] -= fr * yr - fi * yi;
        bi[row] -= fr * yi + fi * yr;
      }
    }
    double[] xr = new double[n];
    double[] xi = new double[n];
    for (int row = n - 1; row >= 0; row--) {
      double sr = br[row];
      double si = bi[row];
      int[] columns = pivotColumns[row];
      for (int c = 1; c < columns.length; c++) {
        int j = columns[c];
        sr -= ar[row][j] * xr[j] - ai[row][j] * xi[j];
        si -= ar[row][j] * xi[j] + ai[row][j] * xr[j];
      }
      double dr = ar[row][row];
      double di = ai[row][row];
      double d = dr * dr + di * di;
      xr[row] = (sr * dr + si * di) / d;
      xi[row] = (si * dr - sr * di) / d;
    }
    return new double[][] {xr, xi};
  }

  /** The columns from {@code from} (inclusive) to {@code to} (exclusive) where row is not 0. */
  private static int[] nonZero(double[] row, int from, int to) {
    int[] columns = new int[to - from];
    int count = 0;
    for (int j = from; j < to; j++) {
      columns[count] = j;
      count += notZero(row[j]);
    }
    return count == columns.length ? columns : java.util.Arrays.copyOf(columns, count);
  }

  /** The columns from {@code from} to {@code to} (exclusive) where re or im is not 0. */
  private static int[] nonZero(double[] re, double[] im, int from, int to) {
    int[] columns = new int[to - from];
    int count = 0;
    for (int j = from; j < to; j++) {
      columns[count] = j;
      count += notZero(re[j]) | notZero(im[j]);
    }
    return count == columns.length ? columns : java.util.Arrays.copyOf(columns, count);
  }

  /**
   * 1 when {@code v != 0} (NaN included), 0 for either zero; without a branch, since which entries
   * of a stage's matrix are zero follows no pattern a processor's branch predictor could learn.
   */
  private static int notZero(double v) {
    long bits = Double.doubleToRawLongBits(v) << 1; // the sign shifted out: 0 exactly for ±0
    return (int) ((bits | -bits) >>> 63);
  }

  private static void swap(double[][] a, double[] b, int i, int j) {
    if (i == j) {
      return;
    }
    double[] row = a[i];
    a[i] = a[j];
    a[j] = row;
    double t = b[i];
    b[i] = b[j];
    b[j] = t;
  }

  private static void swap(double[][] a, double[] b, double[] scale, int i, int j) {
    if (i == j) {
      return;
    }
    double[] row = a[i];
    a[i] = a[j];
    a[j] = row;
    double t = b[i];
    b[i] = b[j];
    b[j] = t;
    t = scale[i];
    scale[i] = scale[j];
    scale[j] = t;
  }
}

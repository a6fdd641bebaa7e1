package com.stagewise.solver;

/**
 * Gaussian elimination with partial pivoting for the small dense complex systems of one stage's AC
 * analysis, as {@link DenseLu} does it in real arithmetic (the same pivot test, the same skipping
 * of exact zeros).
 */
final class ComplexLu {
  private ComplexLu() {}

  /**
   * An LU factorisation of a complex matrix with partial pivoting (the same pivots as {@link
   * #solve}), for solving with several right-hand sides.
   */
  static final class Factors {
    private final double[][] re;
    private final double[][] im;
    private final int[] order;

    /**
     * Per row, the non-zero columns of L and of U, as in {@link DenseLu.Factors}: L's noted as the
     * multipliers are stored, U's as the pivot row's columns that the elimination used.
     */
    private final int[][] lower;

    private final int[][] upper;

    private Factors(double[][] re, double[][] im, int[] order, int[][] lower, int[][] upper) {
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
   * it is singular (by the same test as {@link #solve}).
   */
  static Factors factor(double[][] ar, double[][] ai) {
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
    // L's non-zero columns per row, noted as in DenseLu.factor.
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
      if (best < DenseLu.SINGULAR) {
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
    return new Factors(ar, ai, order, lower, upper);
  }

  /**
   * Solves the complex system {@code (ar + j·ai)·x = br + j·bi} in place and returns {@code {re,
   * im}}, or null when the matrix is singular.
   */
  static double[][] solve(double[][] ar, double[][] ai, double[] br, double[] bi) {
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
      if (best < DenseLu.SINGULAR) {
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

  /** The columns from {@code from} to {@code to} (exclusive) where re or im is not 0. */
  private static int[] nonZero(double[] re, double[] im, int from, int to) {
    int[] columns = new int[to - from];
    int count = 0;
    for (int j = from; j < to; j++) {
      columns[count] = j;
      count += DenseLu.notZero(re[j]) | DenseLu.notZero(im[j]);
    }
    return count == columns.length ? columns : java.util.Arrays.copyOf(columns, count);
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

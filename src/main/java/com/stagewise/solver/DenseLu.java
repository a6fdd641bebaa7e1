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
   * Solves {@code a·x = b} in place and returns x, or null when the matrix is singular.
   *
   * <p>Both arrays are overwritten.
   */
  static double[] solve(double[][] a, double[] b) {
    int n = b.length;
    double[] rowScale = new double[n];
    for (int i = 0; i < n; i++) {
      double max = 0;
      for (int j = 0; j < n; j++) {
        max = Math.max(max, Math.abs(a[i][j]));
      }
      if (max == 0) {
        return null;
      }
      rowScale[i] = 1 / max;
    }
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
      swap(a, b, rowScale, col, pivot);
      double[] pivotRow = a[col];
      for (int row = col + 1; row < n; row++) {
        double factor = a[row][col] / pivotRow[col];
        if (factor != 0) {
          double[] target = a[row];
          for (int j = col; j < n; j++) {
            target[j] -= factor * pivotRow[j];
          }
          b[row] -= factor * b[col];
        }
      }
    }
    double[] x = new double[n];
    for (int row = n - 1; row >= 0; row--) {
      double sum = b[row];
      for (int j = row + 1; j < n; j++) {
        sum -= a[row][j] * x[j];
      }
      x[row] = sum / a[row][row];
    }
    return x;
  }

  /**
   * Solves the complex system {@code (ar + j·ai)·x = br + j·bi} in place and returns {@code
   * {re, im}}, or null when the matrix is singular.
   */
  static double[][] solveComplex(double[][] ar, double[][] ai, double[] br, double[] bi) {
    int n = br.length;
    double[] rowScale = new double[n];
    for (int i = 0; i < n; i++) {
      double max = 0;
      for (int j = 0; j < n; j++) {
        max = Math.max(max, Math.hypot(ar[i][j], ai[i][j]));
      }
      if (max == 0) {
        return null;
      }
      rowScale[i] = 1 / max;
    }
    for (int col = 0; col < n; col++) {
      int pivot = col;
      double best = Math.hypot(ar[col][col], ai[col][col]) * rowScale[col];
      for (int row = col + 1; row < n; row++) {
        double size = Math.hypot(ar[row][col], ai[row][col]) * rowScale[row];
        if (size > best) {
          best = size;
          pivot = row;
        }
      }
      if (best < SINGULAR) {
        return null;
      }
      swap(ar, br, rowScale, col, pivot);
      swap(ai, bi, new double[n], col, pivot);
      double pr = ar[col][col];
      double pi = ai[col][col];
      double denominator = pr * pr + pi * pi;
      for (int row = col + 1; row < n; row++) {
        // factor = a[row][col] / pivot, in complex arithmetic
        double fr = (ar[row][col] * pr + ai[row][col] * pi) / denominator;
        double fi = (ai[row][col] * pr - ar[row][col] * pi) / denominator;
        if (fr == 0 && fi == 0) {
          continue;
        }
        for (int j = col; j < n; j++) {
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
      for (int j = row + 1; j < n; j++) {
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

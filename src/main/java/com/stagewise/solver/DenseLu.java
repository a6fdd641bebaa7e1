package com.stagewise.solver;

/**
 * Gaussian elimination with partial pivoting for the small dense systems of one stage (tens of
 * unknowns), in real arithmetic ({@link ComplexLu} does it in complex arithmetic).
 */
final class DenseLu {
  /**
   * Pivots smaller than this fraction of the largest entry of their column's original scale mark
   * the system as singular. Stage matrices mix conductances near 1e-9 S (open parts) with gain rows
   * near 1e6, so the test is relative to each row's largest entry.
   */
  static final double SINGULAR = 1e-15;

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
    // Up to 64 unknowns, each row's columns that may hold a non-zero entry, as the bits of a long:
    // exact at first, then widened by the pivot rows subtracted from it (the fill-in), so the
    // non-zero columns of a pivot row are found among a few candidates, not the whole row.
    long[] mask = n <= Long.SIZE ? new long[n] : null;
    for (int i = 0; i < n; i++) {
      order[i] = i;
      double max = 0;
      long bits = 0;
      for (int j = 0; j < n; j++) {
        max = Math.max(max, Math.abs(a[i][j]));
        bits |= (long) notZero(a[i][j]) << j;
      }
      if (max == 0) {
        return null;
      }
      rowScale[i] = 1 / max;
      if (mask != null) {
        mask[i] = bits;
      }
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
        if (mask != null) {
          long m = mask[col];
          mask[col] = mask[pivot];
          mask[pivot] = m;
        }
      }
      double[] pivotRow = a[col];
      long right = mask == null ? 0 : mask[col] & rightOf(col);
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
            columns = mask == null ? nonZero(pivotRow, col + 1, n) : nonZero(pivotRow, right);
          }
          for (int j : columns) {
            target[j] -= factor * pivotRow[j];
          }
          if (mask != null) {
            mask[row] |= right;
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
        upper[i] = mask == null ? nonZero(a[i], i + 1, n) : nonZero(a[i], mask[i] & rightOf(i));
      }
    }
    return new Factors(a, order, lowerColumns, lowerStart, lowerEnd, upper);
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

  /** The bits of the columns right of column i (up to 64 columns). */
  private static long rightOf(int i) {
    return i + 1 < Long.SIZE ? -1L << (i + 1) : 0;
  }

  /** The columns among the candidate bits where row is not 0, in increasing order. */
  private static int[] nonZero(double[] row, long candidates) {
    int[] columns = new int[Long.bitCount(candidates)];
    int count = 0;
    for (long rest = candidates; rest != 0; rest &= rest - 1) {
      int j = Long.numberOfTrailingZeros(rest);
      columns[count] = j;
      count += notZero(row[j]);
    }
    return count == columns.length ? columns : java.util.Arrays.copyOf(columns, count);
  }

  /**
   * 1 when {@code v != 0} (NaN included), 0 for either zero; without a branch, since which entries
   * of a stage's matrix are zero follows no pattern a processor's branch predictor could learn.
   */
  static int notZero(double v) {
    long bits = Double.doubleToRawLongBits(v) << 1; // the sign shifted out: 0 exactly for ±0
    return (int) ((bits | -bits) >>> 63);
  }
}

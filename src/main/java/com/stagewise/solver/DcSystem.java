package com.stagewise.solver;

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

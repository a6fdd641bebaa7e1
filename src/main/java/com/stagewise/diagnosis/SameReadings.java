package com.stagewise.diagnosis;

import com.stagewise.solver.OhmsPrediction;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Tells when two suspects read the same everywhere a technician can probe: the same volts at every
 * net and used pin (and AC amplitude where the stage has an AC input), and the same ohms between
 * every two points with the power off. A solder bridge between two pins and a short of a part
 * between the same two nets are one network change, so they read the same; so do a capacitor's
 * faults and a working stage at DC. No reading splits such suspects: only a look at the board or
 * lifting a leg does.
 */
final class SameReadings {
  /** Volts closer than this (plus the relative share below) read the same: half a millivolt. */
  private static final double VOLTS = Evidence.FLOOR_VOLTS;

  /** … and this share of the level (0.1 %), below any meter's resolution on its range. */
  private static final double SHARE = 1e-3;

  private final TestPoints points;
  private final OhmsChecks ohmsChecks;
  private final Map<FaultAtValue, double[]> byFault = new ConcurrentHashMap<>();

  SameReadings(TestPoints points, OhmsChecks ohmsChecks) {
    this.points = points;
    this.ohmsChecks = ohmsChecks;
  }

  /** Returns whether two suspects, each at its best-fitting scenario, read the same everywhere. */
  boolean same(Diagnoser.Scored a, Diagnoser.Scored b) {
    Prediction x = a.best;
    Prediction y = b.best;
    for (int i = 0; i < points.size; i++) {
      if (!close(x.dcMean()[i], y.dcMean()[i])) {
        return false;
      }
      if (x.acMean() != null
          && y.acMean() != null
          && !close(ProbePlanner.mean(x, i, true), ProbePlanner.mean(y, i, true))) {
        return false;
      }
    }
    double[] p = ohms(a);
    double[] q = ohms(b);
    for (int i = 0; i < p.length; i++) {
      // OL (not connected) is kept as -1.
      if ((p[i] < 0) != (q[i] < 0)
          || Math.abs(p[i] - q[i]) > OhmsChecks.LEAD_OHMS + SHARE * Math.max(p[i], q[i])) {
        return false;
      }
    }
    return true;
  }

  /**
   * Returns a suspect's ohms between every pair of points (-1 for OL), kept per fault and value.
   */
  private double[] ohms(Diagnoser.Scored s) {
    Fault fault = s.hypothesis.fault;
    double value = s.best.value();
    FaultAtValue key = new FaultAtValue(fault.id(), value);
    double[] kept = byFault.get(key);
    if (kept != null) {
      return kept;
    }
    OhmsPrediction[] at = ohmsChecks.predictAll(fault, value);
    double[] out = new double[at.length];
    for (int i = 0; i < out.length; i++) {
      out[i] = at[i].connected() ? at[i].nominal() : -1;
    }
    double[] raced = byFault.putIfAbsent(key, out);
    return raced != null ? raced : out;
  }

  private static boolean close(double u, double v) {
    return Math.abs(u - v) <= VOLTS + SHARE * Math.max(Math.abs(u), Math.abs(v));
  }
}

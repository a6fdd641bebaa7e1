package com.stagewise.solver;

import com.stagewise.circuit.JunctionFigures;

/**
 * The DC equations of one pn junction, as the SPICE2 diode model has them (L. W. Nagel, "SPICE2: A
 * Computer Program to Simulate Semiconductor Circuits", ERL Memo M520, UC Berkeley, 1975) and
 * ngspice's {@code D} element keeps them: the Shockley equation forward and for small reverse
 * voltages, a cubic approximation of the saturation current further in reverse, and an exponential
 * reverse breakdown below −BV; plus a minimum conductance across the junction, as ngspice adds.
 *
 * <p>Also the junction-voltage limiting of the same memo ({@code pnjlim}): a Newton step that would
 * move a junction's voltage far up its exponential is cut to a logarithmic step, so that the
 * iteration neither overflows nor oscillates.
 */
final class Junction {
  /** ngspice's minimum conductance across every junction (its option GMIN, default 1e-12 S). */
  static final double GMIN = 1e-12;

  /** Above this exponent the exponential is continued linearly, to stay finite at absurd points. */
  private static final double MAX_EXPONENT = 80;

  final JunctionFigures figures;

  /** N·Vt, volts. */
  final double vte;

  /** The critical voltage of pnjlim: N·Vt·ln(N·Vt / (√2·Is)). */
  final double vcrit;

  /**
   * The junction voltage at which breakdown sets in, adjusted (as ngspice does) so that the reverse
   * current at −BV is IBV; infinite for a junction without breakdown.
   */
  final double breakdown;

  Junction(JunctionFigures figures) {
    this.figures = figures;
    double vt = JunctionFigures.THERMAL_VOLTS;
    vte = figures.emission() * vt;
    double is = figures.saturationAmps();
    vcrit = vte * Math.log(vte / (Math.sqrt(2) * is));
    if (!figures.breaksDown()) {
      breakdown = Double.POSITIVE_INFINITY;
    } else {
      double bv = figures.breakdownVolts();
      double ibv = figures.breakdownAmps();
      double nbv = vte; // the breakdown's emission coefficient is the junction's own
      if (ibv < is * bv / vt) {
        breakdown = bv;
      } else {
        // Solve IBV = Is·(exp((BV − x)/(N·Vt)) − 1 + x/Vt) for x by the fixed-point iteration that
        // ngspice uses, run to convergence.
        double x = bv - nbv * Math.log(1 + ibv / is);
        for (int i = 0; i < 200; i++) {
          double next = bv - nbv * Math.log(ibv / is + 1 - x / vt);
          if (Math.abs(next - x) < 1e-15 * Math.max(1, Math.abs(x))) {
            x = next;
            break;
          }
          x = next;
        }
        breakdown = x;
      }
    }
  }

  /** Returns the junction current at junction voltage vd (amperes, anode to cathode). */
  double current(double vd) {
    return evaluate(vd)[0];
  }

  /** Returns {@code {current, conductance}} at junction voltage vd, gmin included. */
  double[] evaluate(double vd) {
    double is = figures.saturationAmps();
    double cd;
    double gd;
    if (vd >= -3 * vte) {
      double exponent = vd / vte;
      if (exponent > MAX_EXPONENT) {
        double e = Math.exp(MAX_EXPONENT);
        cd = is * (e - 1) + is * e / vte * (vd - MAX_EXPONENT * vte);
        gd = is * e / vte;
      } else {
        double e = Math.exp(exponent);
        cd = is * (e - 1);
        gd = is * e / vte;
      }
    } else if (!Double.isFinite(breakdown) || vd >= -breakdown) {
      double arg = 3 * vte / (vd * Math.E);
      arg = arg * arg * arg;
      cd = -is * (1 + arg);
      gd = is * 3 * arg / vd;
    } else {
      double exponent = -(breakdown + vd) / vte;
      if (exponent > MAX_EXPONENT) {
        double e = Math.exp(MAX_EXPONENT);
        cd = -is * e - is * e / vte * (-(breakdown + vd) - MAX_EXPONENT * vte);
        gd = is * e / vte;
      } else {
        double e = Math.exp(exponent);
        cd = -is * e;
        gd = is * e / vte;
      }
    }
    return new double[] {cd + GMIN * vd, gd + GMIN};
  }

  /**
   * Returns the junction voltage to linearise at after a Newton step proposed {@code vnew} from
   * {@code vold}: pnjlim of the SPICE2 memo, mirrored about −BV in breakdown, as ngspice does.
   */
  double limit(double vnew, double vold) {
    if (Double.isFinite(breakdown) && vnew < Math.min(0, -breakdown + 10 * vte)) {
      double limited = pnjlim(-(vnew + breakdown), -(vold + breakdown));
      return -(limited + breakdown);
    }
    return pnjlim(vnew, vold);
  }

  private double pnjlim(double vnew, double vold) {
    if (vnew > vcrit && Math.abs(vnew - vold) > 2 * vte) {
      if (vold > 0) {
        double arg = 1 + (vnew - vold) / vte;
        return arg > 0 ? vold + vte * Math.log(arg) : vcrit;
      }
      return vte * Math.log(vnew / vte);
    }
    if (vnew < 0) {
      // The negative-going limit that ngspice adds: at most a step of about the old voltage.
      double floor = vold > 0 ? -vold - 1 : 2 * vold - 1;
      return Math.max(vnew, floor);
    }
    return vnew;
  }

  /**
   * Returns the junction voltage when {@code volts} lie across the whole part (junction plus series
   * resistance), solving {@code volts = vj + Rs·I(vj)}; the function is monotone, so a safeguarded
   * Newton iteration inside a shrinking bracket always settles.
   */
  double junctionVolts(double volts) {
    double rs = figures.seriesOhms();
    if (rs == 0) {
      return volts;
    }
    double lo = Math.min(volts, 0) - 1e-12;
    double hi = Math.max(volts, 0) + 1e-12;
    double v = Math.max(lo, Math.min(hi, Math.min(volts, vcrit)));
    for (int i = 0; i < 200; i++) {
      double[] e = evaluate(v);
      double f = v + rs * e[0] - volts;
      if (f > 0) {
        hi = v;
      } else {
        lo = v;
      }
      double next = v - f / (1 + rs * e[1]);
      if (!(next > lo && next < hi)) {
        next = (lo + hi) / 2;
      }
      if (Math.abs(next - v) < 1e-13 * Math.max(1, Math.abs(v)) || hi - lo < 1e-13) {
        return next;
      }
      v = next;
    }
    return v;
  }
}

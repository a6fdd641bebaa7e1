package com.stagewise.ui.drawing;

import com.stagewise.circuit.value.Engineering;
import java.util.ArrayList;
import java.util.List;

/**
 * The ohms axis of a band chart: logarithmic (a decade takes the same room whether it is 10 Ω to
 * 100 Ω or 1 MΩ to 10 MΩ, as resistances in a circuit spread over many decades), with a zone at the
 * right end for OL (the meter's over-range, +∞) when any value shown is OL.
 *
 * @param lowDecade log10 of the ohms at the left end
 * @param highDecade log10 of the ohms where the finite values end, above {@code lowDecade}
 * @param overRangeZone whether the right end holds the OL zone
 */
record OhmsScale(double lowDecade, double highDecade, boolean overRangeZone) implements ChartAxis {
  /** The smallest resistance the axis tells apart: 0.1 Ω (below the test leads' resistance). */
  static final double FLOOR_OHMS = 0.1;

  /** The share of the line the finite values take when there is an OL zone. */
  static final double FINITE_SHARE = 0.84;

  /** Checks the span. */
  OhmsScale {
    if (!Double.isFinite(lowDecade) || !Double.isFinite(highDecade) || highDecade <= lowDecade) {
      throw new IllegalArgumentException(
          "decade span [" + lowDecade + ", " + highDecade + "] must be finite and not empty");
    }
  }

  /**
   * Returns an axis that shows every value given (NaN ignored, +∞ in the OL zone, 0 at the floor)
   * with a quarter of a decade spare at each end and at least one decade in all; no finite value
   * gives 1 Ω to 1 MΩ.
   */
  static OhmsScale fit(double healthyLow, double healthyHigh, double measured, List<Double> more) {
    List<Double> all = new ArrayList<>(more);
    all.add(healthyLow);
    all.add(healthyHigh);
    all.add(measured);
    double lo = Double.POSITIVE_INFINITY;
    double hi = Double.NEGATIVE_INFINITY;
    boolean overRange = false;
    for (double v : all) {
      if (v == Double.POSITIVE_INFINITY) {
        overRange = true;
      } else if (!Double.isNaN(v)) {
        double d = Math.log10(Math.max(FLOOR_OHMS, v));
        lo = Math.min(lo, d);
        hi = Math.max(hi, d);
      }
    }
    if (lo > hi) {
      return new OhmsScale(0, 6, overRange);
    }
    lo -= 0.25;
    hi += 0.25;
    if (hi - lo < 1) {
      double middle = (lo + hi) / 2;
      lo = middle - 0.5;
      hi = middle + 0.5;
    }
    return new OhmsScale(lo, hi, overRange);
  }

  @Override
  public double position(double ohms, double length) {
    double finite = overRangeZone ? FINITE_SHARE * length : length;
    if (ohms == Double.POSITIVE_INFINITY) {
      // The middle of the OL zone (or the right end when there is none).
      return overRangeZone ? (finite + length) / 2 : length;
    }
    double d = Math.log10(Math.max(FLOOR_OHMS, ohms));
    return (d - lowDecade) / (highDecade - lowDecade) * finite;
  }

  /**
   * Returns the decades inside the span (1, 10, 100 … Ω), with 2 and 5 between them when the span
   * is short, and +∞ for the OL zone.
   */
  @Override
  public List<Double> ticks(int wanted) {
    List<Double> ticks = new ArrayList<>();
    double[] steps = highDecade - lowDecade < 2.5 ? new double[] {1, 2, 5} : new double[] {1};
    for (int k = (int) Math.floor(lowDecade); k <= Math.ceil(highDecade); k++) {
      for (double m : steps) {
        double d = k + Math.log10(m);
        if (d >= lowDecade && d <= highDecade) {
          ticks.add(m * Math.pow(10, k));
        }
      }
    }
    // Too many decades for the room: keep every second one.
    while (ticks.size() > Math.max(2, wanted + 1)) {
      List<Double> fewer = new ArrayList<>();
      for (int i = 0; i < ticks.size(); i += 2) {
        fewer.add(ticks.get(i));
      }
      ticks = fewer;
    }
    if (overRangeZone) {
      ticks.add(Double.POSITIVE_INFINITY);
    }
    return ticks;
  }

  @Override
  public String tickText(double ohms) {
    if (ohms == Double.POSITIVE_INFINITY) {
      return "OL";
    }
    return Engineering.of(ohms, "Ω", 3).replace(String.valueOf(Engineering.SPACE), "");
  }
}

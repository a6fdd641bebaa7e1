package com.stagewise.ui.drawing;

import java.util.ArrayList;
import java.util.List;

/**
 * The volts axis of a band chart: a span that holds the healthy band, the reading and the suspects'
 * markers with a margin, and round tick values (1-2-5 steps).
 *
 * @param min the volts at the left end
 * @param max the volts at the right end, above {@code min}
 */
record BandScale(double min, double max) implements ChartAxis {

  /** Checks that the span is finite and not empty. */
  BandScale {
    if (!Double.isFinite(min) || !Double.isFinite(max) || max <= min) {
      throw new IllegalArgumentException(
          "axis span [" + min + ", " + max + "] must be finite and not empty");
    }
  }

  /**
   * Returns an axis that shows every finite value given, with 12 % of the span spare at each end;
   * non-finite values are ignored. A single value (or a band of zero width) gets a span of 0.5 V or
   * 20 % of its size, whichever is more, on each side; no finite value at all gives −1 V to +1 V.
   */
  static BandScale fit(
      double healthyLow, double healthyHigh, double measured, List<Double> markers) {
    double lo = Double.POSITIVE_INFINITY;
    double hi = Double.NEGATIVE_INFINITY;
    List<Double> all = new ArrayList<>(markers);
    all.add(healthyLow);
    all.add(healthyHigh);
    all.add(measured);
    for (double v : all) {
      if (Double.isFinite(v)) {
        lo = Math.min(lo, v);
        hi = Math.max(hi, v);
      }
    }
    if (lo > hi) {
      return new BandScale(-1, 1);
    }
    double span = hi - lo;
    if (span < 1e-9) {
      double pad = Math.max(0.5, Math.abs(lo) * 0.2);
      return new BandScale(lo - pad, hi + pad);
    }
    return new BandScale(lo - 0.12 * span, hi + 0.12 * span);
  }

  /**
   * Returns an axis for amplitudes: as {@link #fit}, but never reaching below 0 V (an amplitude is
   * never negative, so the left end stops at 0 V where the margin would pass it).
   */
  static BandScale fitAmplitude(
      double healthyLow, double healthyHigh, double measured, List<Double> markers) {
    BandScale fitted = fit(healthyLow, healthyHigh, measured, markers);
    return fitted.min() >= 0 ? fitted : new BandScale(0, Math.max(fitted.max(), 1e-9));
  }

  /** Returns the position of {@code volts} on a line of {@code length} pixels starting at 0. */
  @Override
  public double position(double volts, double length) {
    return (volts - min) / (max - min) * length;
  }

  /** Returns round tick values inside the span, about {@code wanted} of them (1-2-5 steps). */
  @Override
  public List<Double> ticks(int wanted) {
    double raw = (max - min) / Math.max(1, wanted);
    double magnitude = Math.pow(10, Math.floor(Math.log10(raw)));
    double step = magnitude;
    for (double m : new double[] {1, 2, 5, 10}) {
      step = m * magnitude;
      if (step >= raw) {
        break;
      }
    }
    List<Double> ticks = new ArrayList<>();
    for (double t = Math.ceil(min / step) * step; t <= max + step * 1e-9; t += step) {
      // Snap to the step grid so that 0 prints as 0 and not as a tiny remainder.
      ticks.add(Math.round(t / step) * step);
    }
    return ticks;
  }

  @Override
  public String tickText(double volts) {
    return VoltText.tick(volts);
  }

  /**
   * Returns, for labels centred at {@code centres} with the given widths, the row each goes in so
   * that no two labels in a row come closer than {@code gap} (row 0 first, greedy in the given
   * order).
   */
  static int[] labelRows(double[] centres, double[] widths, double gap) {
    int[] rows = new int[centres.length];
    List<List<double[]>> taken = new ArrayList<>();
    for (int i = 0; i < centres.length; i++) {
      double left = centres[i] - widths[i] / 2;
      double right = centres[i] + widths[i] / 2;
      int row = 0;
      while (true) {
        if (row == taken.size()) {
          taken.add(new ArrayList<>());
        }
        boolean free = true;
        for (double[] span : taken.get(row)) {
          if (left < span[1] + gap && span[0] < right + gap) {
            free = false;
            break;
          }
        }
        if (free) {
          taken.get(row).add(new double[] {left, right});
          rows[i] = row;
          break;
        }
        row++;
      }
    }
    return rows;
  }
}

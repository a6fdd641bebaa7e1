package com.stagewise.ui.readings;

import com.stagewise.circuit.Reading;
import com.stagewise.ui.drawing.BandChart;
import java.time.Instant;
import java.util.Map;

/**
 * One reading as listed on the readings screen, with what a healthy stage and the top suspects
 * would read there: volts for DC, the AC amplitude in the reading's own measure for AC, ohms for a
 * power-off reading.
 *
 * @param reading the reading
 * @param title the test point in words
 * @param healthyLow the low end of the healthy range (NaN when unknown)
 * @param healthyHigh the high end of the healthy range (NaN when unknown)
 * @param predictions where the top suspects put this reading: label to volts (or ohms)
 * @param struckAt when the reading was struck out (null while it stands, and while its strike is
 *     being stored: see {@link #struck()})
 * @param struck whether the reading is struck out (left out of the diagnosis)
 */
public record ReadingRow(
    Reading reading,
    String title,
    double healthyLow,
    double healthyHigh,
    Map<String, Double> predictions,
    Instant struckAt,
    boolean struck) {
  /**
   * Returns whether the reading lies in the healthy range (false when the range is unknown); an
   * ohms reading within the meter's uncertainty and the test leads of it ({@link
   * BandChart#ohmsInside}), an AC reading within its own uncertainty of it ({@link
   * BandChart#acInside}).
   */
  public boolean healthy() {
    return switch (reading.kind()) {
      case OHMS -> BandChart.ohmsInside(healthyLow, healthyHigh, reading.value());
      case AC -> BandChart.acInside(healthyLow, healthyHigh, reading.value());
      case DC -> reading.value() >= healthyLow && reading.value() <= healthyHigh;
    };
  }
}

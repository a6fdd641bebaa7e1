package com.stagewise.ui.drawing;

import java.util.List;

/** The axis of a band chart: where a value goes, and its tick marks with their labels. */
interface ChartAxis {
  /** Returns the position of a value on a line of {@code length} pixels starting at 0. */
  double position(double value, double length);

  /** Returns tick values inside the span, about {@code wanted} of them. */
  List<Double> ticks(int wanted);

  /** Returns a tick's label. */
  String tickText(double value);
}

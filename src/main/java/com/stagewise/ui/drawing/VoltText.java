package com.stagewise.ui.drawing;

import java.util.Locale;

/** Formats the band chart's tick labels (values and bands use {@code Engineering}). */
final class VoltText {
  private VoltText() {}

  /** Returns a tick label: no unit, no superfluous decimals, e.g. "−5", "2.5", "0". */
  static String tick(double volts) {
    String text =
        String.format(Locale.ROOT, "%.3f", volts).replaceAll("0+$", "").replaceAll("\\.$", "");
    if (text.equals("-0")) {
      text = "0";
    }
    return text.replace('-', '\u2212');
  }
}

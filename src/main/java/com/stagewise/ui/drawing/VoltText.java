package com.stagewise.ui.drawing;

import java.util.Locale;

/** Formats volts for the drawings: a real minus sign, a sign on positive values, fixed decimals. */
final class VoltText {
  private VoltText() {}

  /** Returns e.g. "+4.70 V", "−0.012 V", "0.00 V"; three decimals below 0.1 V in size. */
  static String of(double volts) {
    if (!Double.isFinite(volts)) {
      return "—";
    }
    double size = Math.abs(volts);
    String digits = String.format(Locale.ROOT, size != 0 && size < 0.1 ? "%.3f" : "%.2f", size);
    boolean zero = Double.parseDouble(digits) == 0;
    String sign = zero ? "" : volts < 0 ? "\u2212" : "+";
    return sign + digits + " V";
  }

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

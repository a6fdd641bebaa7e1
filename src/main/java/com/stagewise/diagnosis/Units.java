package com.stagewise.diagnosis;

import java.util.Locale;

/** Formats volts and part values for the texts of a diagnosis (locale-independent). */
final class Units {
  private static final String[] PREFIXES = {"p", "n", "µ", "m", "", "k", "M", "G"};

  private Units() {}

  /** Returns volts with millivolt resolution below 10 V, e.g. "0.620 V", "13.41 V", "-4.70 V". */
  static String volts(double v) {
    double a = Math.abs(v);
    if (a < 1e-3) {
      return String.format(Locale.ROOT, "%.2f mV", v * 1e3);
    }
    if (a < 10) {
      return String.format(Locale.ROOT, "%.3f V", v);
    }
    return String.format(Locale.ROOT, "%.2f V", v);
  }

  /** Returns a value with an SI prefix and three significant digits, e.g. "47 kΩ", "2.2 µF". */
  static String format(double value, String unit) {
    if (value == 0) {
      return "0 " + unit;
    }
    int exponent = (int) Math.floor(Math.log10(Math.abs(value)) / 3);
    exponent = Math.max(-4, Math.min(3, exponent));
    double scaled = value / Math.pow(1000, exponent);
    String digits = String.format(Locale.ROOT, scaled >= 100 ? "%.0f" : scaled >= 10 ? "%.1f" : "%.2f", scaled);
    if (digits.contains(".")) {
      digits = digits.replaceAll("0+$", "").replaceAll("\\.$", "");
    }
    return digits + " " + PREFIXES[exponent + 4] + unit;
  }
}

package com.stagewise.diagnosis;

import java.util.Locale;

/** Formats volts and part values for the texts of a diagnosis (locale-independent). */
final class Units {
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

  /** Returns a value with an SI prefix, e.g. "47 kΩ", "2.2 µF". */
  static String format(double value, String unit) {
    return com.stagewise.circuit.value.SiValue.format(value, unit, 3);
  }
}

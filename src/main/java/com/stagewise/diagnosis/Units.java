package com.stagewise.diagnosis;

import com.stagewise.circuit.value.Engineering;

/** Formats volts and part values for the texts of a diagnosis (locale-independent). */
final class Units {
  private Units() {}

  /**
   * Returns volts in engineering units, e.g. "620 mV", "13.41 V", "−4.7 V", "20 µV" (see {@link
   * Engineering#volts(double)}: one minus sign, a no-break space before the unit).
   */
  static String volts(double v) {
    return Engineering.volts(v);
  }

  /** Returns a value with an SI prefix, e.g. "47 kΩ", "2.2 µF". */
  static String format(double value, String unit) {
    return com.stagewise.circuit.value.SiValue.format(value, unit, 3);
  }
}

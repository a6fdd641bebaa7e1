package com.stagewise.ui.stage;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.ZenerMarking;

/**
 * One part of the stage as listed.
 *
 * @param part the part
 * @param value its value with unit, e.g. "4.7 kΩ"
 * @param tolerance its tolerance, e.g. "1 %"
 * @param nets the nets it joins, e.g. "IN – SUM"
 */
public record PartRow(Part part, String value, String tolerance, String nets) {
  /** Returns the row as one line. */
  public String line() {
    // A diode's or an LED's class fixes its figures: it has no tolerance to show.
    String within = tolerance.isEmpty() ? "" : "  ±" + tolerance;
    return part.ref() + "   " + value + within + "   (" + nets + ")";
  }

  /**
   * Returns a part's value as the list shows it: {@code 4.7 kΩ}, a zener's marking {@code 5V1}, a
   * diode's class, an LED's colour, a trimmer's value and wiper ({@code 10 kΩ, wiper at 0.5}).
   */
  static String valueWords(Part part) {
    return switch (part.kind()) {
      case CAPACITOR -> SiValue.format(part.value(), "F");
      case ZENER -> ZenerMarking.format(part.value()) + " zener";
      case DIODE -> part.diodeClass().word() + " diode";
      case LED -> part.colour().word() + " LED";
      case TRIMMER, POTENTIOMETER ->
          SiValue.format(part.value(), "Ω")
              + ", wiper at "
              + java.math.BigDecimal.valueOf(part.position()).stripTrailingZeros().toPlainString()
              + (part.sealed() ? " (sealed)" : "");
      default -> SiValue.format(part.value(), "Ω");
    };
  }

  /**
   * Returns a part's nets with its lead names where they matter: {@code anode OUT – cathode RECT},
   * {@code VCC – wiper NULL – VEE}; a resistor's or capacitor's as {@code SUM – OUT}.
   */
  static String leadWords(Part part) {
    if (part.kind().isJunction()) {
      return "anode " + part.anode() + " – cathode " + part.cathode();
    }
    if (part.kind().isTrimmer()) {
      return part.netA() + " – wiper " + part.wiper() + " – " + part.netB();
    }
    return part.netA() + " – " + part.netB();
  }
}
